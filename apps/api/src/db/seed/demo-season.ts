/**
 * A season of invented work history for the demo city, laid around the day the demo starts:
 * the weather the stations recorded up to yesterday and their forecast for the coming week,
 * the mowings the one-third rule asked for on that weather (the turf engine's own growth and
 * mowing run, on the crews' working days) with the crews' usual misses and late cuts, the feed
 * plan's applications and a few weed-control sprays with product, rate and applicator, a
 * field check about every month, and the days a field was closed.
 *
 * Pure and deterministic (seeded PRNG, no clock): computed in memory once and bulk-inserted by
 * the seed, so a fresh demo database stays cheap to make.
 */
import {
  DEFAULT_PARAMETERS,
  DEFAULT_STANDARDS,
  addDaysIso,
  annualNitrogen,
  fieldDailySeries,
  grassSeason,
  hocFor,
  hoursPerMowing,
  isoToDayNumber,
  levelStandard,
  mondayOf,
  monthlyNSplitByGp,
  mowerTypeFor,
  mowingPolicy,
  planNApplications,
  prepareWeather,
  productForArea,
  simulateMowing,
  weekdayOf,
  type FieldDailySeries,
  type Level,
  type OutlookField,
  type PreparedWeather,
  type Weekday,
  type WorkTask,
} from '@swardwise/domain';
import { outlineFacts } from '../../services/fields.ts';
import { demoCityWeather, type DemoCity, type DemoWeatherDay } from './demo-city.ts';
import { rngFor, type Rng } from './prng.ts';

/** Days of forecast the demo's stations hold from today on (today and the six days after it). */
export const DEMO_FORECAST_DAYS = 7;
/** The days the demo crews work (the crews table's default). */
export const DEMO_WORK_DAYS: readonly Weekday[] = ['mon', 'tue', 'wed', 'thu', 'fri'];
/** Mean growth potential of the week before a booking below which the turf is too dormant to play on (demo choice). */
export const PLAYABLE_GP = 0.25;

/** The dates a demo started on `today` describes. */
export interface DemoSeasonWindow {
  /** First day of history: 1 March of the season in progress or, before July, of last year's. */
  start: string;
  today: string;
  yesterday: string;
  /** Last day of forecast. */
  forecastEnd: string;
}

/**
 * The window of a demo started on `today`: a season's history back to 1 March. Before July
 * the current season is too young to show one, so the history starts on last year's 1 March.
 */
export function demoSeasonWindow(today: string): DemoSeasonWindow {
  const year = Number(today.slice(0, 4));
  const start = today >= `${year}-07-01` ? `${year}-03-01` : `${year - 1}-03-01`;
  return { start, today, yesterday: addDaysIso(today, -1), forecastEnd: addDaysIso(today, DEMO_FORECAST_DAYS - 1) };
}

export interface DemoWeatherRow extends DemoWeatherDay {
  kind: 'observed' | 'forecast';
}

export interface DemoSeasonOrder {
  fieldIndex: number;
  crewName: string;
  task: WorkTask;
  plannedDate: string;
  weekStart: string;
  plannedHours: number;
  status: 'done' | 'skipped';
  /** Department-local date the work was done on (null when skipped). */
  doneOn: string | null;
  actualHours: number | null;
  reason: string;
  details: Record<string, unknown>;
  /** The crew's note: why it was skipped or what was applied. */
  notes: string;
}

export interface DemoSeasonCheck {
  fieldIndex: number;
  checkedOn: string;
  turfCoverPct: number;
  weedsPct: number;
  barePct: number;
  /** Measured height ÷ HOC. */
  heightRatio: number;
  daysSinceCut: number | null;
  gmax: number;
  gmaxDevice: 'portable_2_25kg';
  evenness: number;
  notes: string;
}

export interface DemoClosure {
  fieldIndex: number;
  startsOn: string;
  title: string;
  notes: string;
}

export interface DemoSeason {
  window: DemoSeasonWindow;
  /** Every station's days from the season's start: observed up to yesterday, forecast from today. */
  weather: DemoWeatherRow[];
  orders: DemoSeasonOrder[];
  checks: DemoSeasonCheck[];
  closures: DemoClosure[];
  /** Per field (index of `city.fields`): the last mowing done, null when none. */
  lastMowedOn: (string | null)[];
  /**
   * Whether the field's turf can be played on that day: the mean growth potential of its grass
   * over the week to the day at least `PLAYABLE_GP` and no hard frost that morning. Dates past
   * the forecast are judged on the demo's invented climate of that day.
   */
  playable: (fieldIndex: number, date: string) => boolean;
}

const round = (x: number, digits = 2) => Math.round(x * 10 ** digits) / 10 ** digits;

/** The demo crews' own reasons for a job not done (invented, common practice). */
const SKIP_REASONS = ['Mower down: belt replaced at the yard', 'Crew sent to storm clean-up', 'Two of the crew off sick', 'Site locked; no key on the truck'];
const WET_SKIP = (rain: number) => `Too wet to mow: ${round(rain, 0)} mm of rain, ruts on the sidelines`;

interface StationSeries {
  code: string;
  prepared: PreparedWeather;
  days: DemoWeatherDay[];
}

interface FieldFacts {
  index: number;
  outlook: OutlookField;
  hocMm: number;
  crewName: string;
  applicator: string;
  station: StationSeries;
  daily: FieldDailySeries;
}

/** Seasons already built, by the demo city and the day: tests make many fresh demo databases on one day. */
const built = new WeakMap<DemoCity, Map<string, DemoSeason>>();

/** The demo city's season around `today` (the rows are shared between calls: do not change them). */
export function buildDemoSeason(city: DemoCity, today: string): DemoSeason {
  let byDay = built.get(city);
  if (!byDay) built.set(city, (byDay = new Map()));
  let season = byDay.get(today);
  if (!season) byDay.set(today, (season = computeSeason(city, today)));
  return season;
}

function computeSeason(city: DemoCity, today: string): DemoSeason {
  const window = demoSeasonWindow(today);
  // The climate runs on to the end of today's year: a feed plan is made for a whole year, and
  // bookings weeks ahead are judged on it. Only the window's days become weather rows.
  const climateFrom = `${window.start.slice(0, 4)}-01-01`;
  const climateTo = `${window.forecastEnd.slice(0, 4)}-12-31`;
  const all = demoCityWeather(climateFrom, climateTo);
  const weather: DemoWeatherRow[] = all
    .filter((w) => w.date >= window.start && w.date <= window.forecastEnd)
    .map((w) => ({ ...w, kind: w.date < today ? 'observed' : 'forecast' }));

  const stations = new Map<string, StationSeries>();
  for (const st of city.weatherStations) {
    const days = all.filter((w) => w.stationCode === st.code);
    stations.set(st.code, { code: st.code, days, prepared: prepareWeather(days, { latDeg: st.lat, elevationM: st.elevationM }) });
  }
  const day0 = isoToDayNumber(climateFrom);
  const idx = (iso: string) => isoToDayNumber(iso) - day0;

  const siteOf = new Map(city.sites.map((s) => [s.key, s]));
  const crewsOf = new Map<string, DemoCity['crews']>();
  for (const c of city.crews) crewsOf.set(c.districtCode, [...(crewsOf.get(c.districtCode) ?? []), c]);
  const perDistrict = new Map<string, number>();
  const facts: (FieldFacts | null)[] = city.fields.map((f, index) => {
    const site = siteOf.get(f.siteKey)!;
    const crews = crewsOf.get(site.districtCode) ?? [];
    const n = perDistrict.get(site.districtCode) ?? 0;
    perDistrict.set(site.districtCode, n + 1);
    const station = stations.get(nearestStationCode(city, site))!;
    const outlook: OutlookField = { id: index, areaM2: outlineFacts(f.geometry).areaM2, sport: f.sport, grass: f.grass, maintenanceLevel: f.maintenanceLevel as Level, hocOverrideMm: f.hocOverrideMm, clippings: f.clippings, irrigation: f.irrigation };
    const crew = crews[n % Math.max(1, crews.length)];
    if (!crew || f.status === 'retired') return null;
    return {
      index,
      outlook,
      hocMm: hocFor(outlook, DEFAULT_STANDARDS),
      crewName: crew.name,
      applicator: crew.members[0]!,
      station,
      daily: fieldDailySeries(outlook, station.prepared, DEFAULT_STANDARDS, DEFAULT_PARAMETERS),
    };
  });

  const orders: DemoSeasonOrder[] = [];
  const checks: DemoSeasonCheck[] = [];
  const closures: DemoClosure[] = [];
  const lastMowedOn: (string | null)[] = city.fields.map(() => null);
  const startI = idx(window.start);
  const endI = idx(window.yesterday);

  for (const f of facts) {
    if (!f) continue;
    const field = city.fields[f.index]!;
    const rand = rngFor(`season:${field.siteKey}:${field.name}`);
    const rainOf = (iso: string) => f.station.days[idx(iso)]?.rainMm ?? 0;
    const cuts = mowings(f, startI, endI, rand, rainOf, orders);
    lastMowedOn[f.index] = cuts.at(-1) ?? null;
    feeds(f, window, rand, orders);
    weedControl(f, window, rand, orders);
    fieldChecks(f, field.status === 'closed', window, rand, cuts, checks, orders);
    wetClosures(f, field.sport !== 'lawn', window, rand, rainOf, closures);
  }

  const playable = (fieldIndex: number, date: string): boolean => {
    const f = facts[fieldIndex];
    if (!f) return false;
    const i = idx(date);
    if (i < 6 || i >= f.daily.gp.length) return true;
    let gp = 0;
    for (let k = i - 6; k <= i; k++) gp += f.daily.gp[k] as number;
    const frost = (f.station.days[i]?.tminC ?? 10) < -2;
    return gp / 7 >= PLAYABLE_GP && !frost;
  };

  orders.sort((a, b) => a.plannedDate.localeCompare(b.plannedDate) || a.fieldIndex - b.fieldIndex || a.task.localeCompare(b.task));
  return { window, weather, orders, checks, closures, lastMowedOn, playable };
}

function nearestStationCode(city: DemoCity, here: { lat: number; lng: number }): string {
  let best = city.weatherStations[0]!;
  let bestD = Infinity;
  for (const st of city.weatherStations) {
    const d = (st.lat - here.lat) ** 2 + ((st.lng - here.lng) * Math.cos((here.lat * Math.PI) / 180)) ** 2;
    if (d < bestD) {
      best = st;
      bestD = d;
    }
  }
  return best.code;
}

const isWorkDay = (iso: string) => DEMO_WORK_DAYS.includes(weekdayOf(iso));
/** The first working day after `iso`. */
function nextWorkDay(iso: string): string {
  let d = addDaysIso(iso, 1);
  while (!isWorkDay(d)) d = addDaysIso(d, 1);
  return d;
}
/** `iso` itself when the crews work that day, else the next working day. */
const workDayFrom = (iso: string) => (isWorkDay(iso) ? iso : nextWorkDay(iso));

/**
 * The season's mowings of a field: the engine's mowing run (`simulateMowing` with
 * `mowingPolicy`, the crews' working days) over the field's predicted growth, cut by cut.
 * Most cuts are done on the day asked; some are done a working day or two late and some are
 * skipped (rain, a broken mower, the crew elsewhere); after either, the run starts again from
 * the grass as it then stands, as the next week's plan would. Returns the dates cut.
 */
function mowings(f: FieldFacts, startI: number, endI: number, rand: Rng, rainOf: (iso: string) => number, out: DemoSeasonOrder[]): string[] {
  const { hocMm, daily } = f;
  const growth = daily.growthMm;
  const policy = mowingPolicy(hocMm, levelStandard(f.outlook.maintenanceLevel, DEFAULT_STANDARDS));
  const mower = DEFAULT_PARAMETERS.mowers[mowerTypeFor(hocMm, DEFAULT_PARAMETERS.mowerSettings)];
  const field = f.outlook;
  const dates = f.station.prepared.dates;
  const plannedHours = round(hoursPerMowing(field.areaM2, mower));
  const cuts: string[] = [];
  let from = startI;
  let height = hocMm;
  let sinceCut = 0;
  // Index of the last cut: the day before the window at first (the run's own assumption).
  let lastCut = startI - 1;
  while (from <= endI) {
    const sim = simulateMowing(hocMm, growth.slice(from, endI + 1), height, { startDate: dates[from]!, ...policy, mowingDays: DEMO_WORK_DAYS, daysSinceCutAtStart: sinceCut });
    let restart: number | null = null;
    for (const ev of sim.mowings) {
      const i = from + ev.dayIndex;
      const date = ev.date;
      const rain = rainOf(date);
      const roll = rand();
      const base = {
        fieldIndex: f.index,
        crewName: f.crewName,
        task: 'mow' as const,
        plannedDate: date,
        weekStart: mondayOf(date),
        plannedHours,
        reason: ev.reason === 'growth' ? `One-third rule: mow before the grass passes ${round(1.5 * hocMm, 0)} mm` : `Level ${field.maintenanceLevel} frequency`,
        details: { hocMm: round(hocMm, 1), mower: mower.kind, dueBy: date, heightBeforeMm: round(ev.heightBeforeMm, 1) },
      };
      const hours = () => round(plannedHours * (0.85 + rand() * 0.4));
      if (rain >= 20 || roll < 0.035) {
        // Skipped: the grass keeps growing and the next plan asks again.
        const notes = rain >= 20 ? WET_SKIP(rain) : SKIP_REASONS[Math.floor(rand() * SKIP_REASONS.length)]!;
        out.push({ ...base, status: 'skipped', doneOn: null, actualHours: null, notes });
        if (i + 1 <= endI) {
          restart = i + 1;
          height = ev.heightBeforeMm + (growth[i] as number);
          sinceCut = i - lastCut;
        } else restart = endI + 1;
        break;
      }
      if (roll < 0.11) {
        // Late: done on the next working day or the one after.
        let doneOn = nextWorkDay(date);
        if (rand() < 0.35) doneOn = nextWorkDay(doneOn);
        if (idx0(doneOn, dates) > endI) {
          out.push({ ...base, status: 'skipped', doneOn: null, actualHours: null, notes: 'Not reached this week' });
          restart = endI + 1;
          break;
        }
        out.push({ ...base, status: 'done', doneOn, actualHours: hours(), notes: 'Done late: the crew caught up after a busy day' });
        cuts.push(doneOn);
        const j = idx0(doneOn, dates);
        restart = j + 1;
        height = hocMm + (growth[j] as number);
        sinceCut = 0;
        lastCut = j;
        break;
      }
      out.push({ ...base, status: 'done', doneOn: date, actualHours: hours(), notes: '' });
      cuts.push(date);
      // An on-time cut is the run's own: it goes on from there.
      lastCut = i;
    }
    if (restart === null) break;
    from = restart;
  }
  return cuts;
}

function idx0(iso: string, dates: readonly string[]): number {
  return isoToDayNumber(iso) - isoToDayNumber(dates[0]!);
}

/** Mean growth potential of each month of `year` for the field's grass, as the feed plan splits N by. */
function monthlyGp(f: FieldFacts, year: number): (number | null)[] {
  const sums = new Array<number>(12).fill(0);
  const counts = new Array<number>(12).fill(0);
  const dates = f.station.prepared.dates;
  for (let i = 0; i < dates.length; i++) {
    const d = dates[i]!;
    if (Number(d.slice(0, 4)) !== year) continue;
    const m = Number(d.slice(5, 7)) - 1;
    sums[m]! += f.daily.gp[i] as number;
    counts[m]!++;
  }
  return sums.map((s, m) => (counts[m] ? s / counts[m]! : null));
}

/** The feed plan's applications in the window (annual N split by monthly GP), done with the department's product. */
function feeds(f: FieldFacts, window: DemoSeasonWindow, rand: Rng, out: DemoSeasonOrder[]): void {
  const params = DEFAULT_PARAMETERS;
  const product = params.fertiliserProduct;
  const spreader = params.planning.spreader;
  const irrigated = f.daily.share > 0;
  const annual = annualNitrogen({ grass: f.outlook.grass, level: f.outlook.maintenanceLevel, clippings: f.outlook.clippings, irrigated }, DEFAULT_STANDARDS);
  const hours = round(hoursPerMowing(f.outlook.areaM2, spreader) + spreader.setupMin / 60);
  const used = new Set<string>();
  for (let year = Number(window.start.slice(0, 4)); year <= Number(window.yesterday.slice(0, 4)); year++) {
    const apps = planNApplications(monthlyNSplitByGp(annual.gPerM2, monthlyGp(f, year)), { slowReleaseShare: product.slowReleaseShare, year, params });
    for (const app of apps) {
      if (!app.date || app.nGPerM2 <= 0) continue;
      const date = workDayFrom(app.date);
      if (date < window.start || date > window.yesterday || used.has(date)) continue;
      used.add(date);
      const need = productForArea(app.nGPerM2, product, f.outlook.areaM2, params.fertiliserBagKg, params.costs.fertiliserPerKg);
      const late = rand() < 0.1 && nextWorkDay(date) <= window.yesterday;
      const doneOn = late ? nextWorkDay(date) : date;
      const analysis = `${product.n}-${product.p}-${product.k}`;
      out.push({
        fieldIndex: f.index,
        crewName: f.crewName,
        task: 'feed',
        plannedDate: date,
        weekStart: mondayOf(date),
        plannedHours: hours,
        status: 'done',
        doneOn,
        actualHours: round(hours * (0.9 + rand() * 0.3)),
        reason: `Feed plan: ${round(app.nGPerM2, 2)} g N/m² planned for ${app.date}`,
        details: {
          dueBy: date,
          nGPerM2: round(app.nGPerM2, 3),
          product: analysis,
          productName: `${analysis} granular, ${Math.round(product.slowReleaseShare * 100)} % slow-release N`,
          rateGPerM2: round(need.productGPerM2, 1),
          productKg: round(need.productKg, 1),
          bags: need.bags,
          applicator: f.applicator,
        },
        notes: `${round(need.productKg, 1)} kg of ${analysis} at ${round(need.productGPerM2, 1)} g/m², applied by ${f.applicator}; label rates followed`,
      });
    }
  }
}

/** A broadleaf spot spray in late spring or early autumn on about a third of the fields (demo choice). */
function weedControl(f: FieldFacts, window: DemoSeasonWindow, rand: Rng, out: DemoSeasonOrder[]): void {
  if (rand() > 0.35) return;
  const year = window.start.slice(0, 4);
  const date = workDayFrom(rand() < 0.5 ? `${year}-05-${String(12 + Math.floor(rand() * 10)).padStart(2, '0')}` : `${year}-09-${String(14 + Math.floor(rand() * 10)).padStart(2, '0')}`);
  if (date > window.yesterday) return;
  const hours = round(hoursPerMowing(f.outlook.areaM2, DEFAULT_PARAMETERS.planning.spreader) * 1.5 + 0.5);
  out.push({
    fieldIndex: f.index,
    crewName: f.crewName,
    task: 'weed_control',
    plannedDate: date,
    weekStart: mondayOf(date),
    plannedHours: hours,
    status: 'done',
    doneOn: date,
    actualHours: round(hours * (0.9 + rand() * 0.3)),
    reason: 'Field check: broadleaf weeds above the level’s limit',
    details: { dueBy: date, productName: 'Broadleaf herbicide (invented demo product)', rateLPerHa: 2.3, areaTreatedM2: Math.round(f.outlook.areaM2 * 0.2), applicator: f.applicator, licensed: true },
    notes: `Spot spray of the weedy patches by ${f.applicator} (licensed applicator), wind under 3 m/s; label directions, posting and re-entry interval followed`,
  });
}

/** A field check about every four weeks from the season's start, and its work order. */
function fieldChecks(f: FieldFacts, closedNow: boolean, window: DemoSeasonWindow, rand: Rng, cuts: readonly string[], out: DemoSeasonCheck[], orders: DemoSeasonOrder[]): void {
  const level = f.outlook.maintenanceLevel;
  const quality = (5 - level) / 4;
  const warm = grassSeason(f.outlook.grass) === 'warm';
  const hours = round(0.3 + f.outlook.areaM2 / 20_000);
  for (let d = workDayFrom(addDaysIso(window.start, 7 + Math.floor(rand() * 10))); d <= window.yesterday; d = workDayFrom(addDaysIso(d, 26 + Math.floor(rand() * 6)))) {
    const month = Number(d.slice(5, 7));
    // Wear builds through the playing seasons; dormant warm-season turf thins in winter.
    const wear = month >= 9 && month <= 11 ? 0.1 : month >= 5 && month <= 6 ? 0.06 : 0;
    const dormancy = warm && (month <= 3 || month >= 11) ? 0.12 : 0;
    const cover = Math.max(50, Math.min(100, Math.round(72 + quality * 24 - (wear + dormancy) * 100 + rand() * 6)));
    const weeds = Math.min(100 - cover, Math.round((1 - quality) * 14 + rand() * 5 + (month >= 5 && month <= 8 ? 2 : 0)));
    const bare = Math.max(0, 100 - cover - weeds);
    const lastCut = [...cuts].reverse().find((c) => c <= d) ?? null;
    const daysSinceCut = lastCut ? isoToDayNumber(d) - isoToDayNumber(lastCut) : null;
    const lastOfAll = addDaysIso(d, 30) > window.yesterday;
    const hard = closedNow && lastOfAll;
    out.push({
      fieldIndex: f.index,
      checkedOn: d,
      turfCoverPct: cover,
      weedsPct: weeds,
      barePct: bare,
      heightRatio: round(1 + Math.min(0.5, (daysSinceCut ?? 7) * 0.04) + rand() * 0.1),
      daysSinceCut,
      gmax: Math.round(hard ? 112 + rand() * 10 : 45 + rand() * 35 + (month >= 7 && month <= 9 ? 10 : 0)),
      gmaxDevice: 'portable_2_25kg',
      evenness: Math.max(1, Math.min(5, Math.round(2 + quality * 2.5 + rand() - wear * 5))),
      notes: hard ? 'Surface hard in the centre; closed pending aeration and watering' : wear > 0.08 ? 'Goalmouths and centre worn from the season' : '',
    });
    orders.push({
      fieldIndex: f.index,
      crewName: f.crewName,
      task: 'field_check',
      plannedDate: d,
      weekStart: mondayOf(d),
      plannedHours: hours,
      status: 'done',
      doneOn: d,
      actualHours: round(hours * (0.8 + rand() * 0.5)),
      reason: 'Monthly field check',
      details: { dueBy: d },
      notes: '',
    });
  }
}

/** A sports field closed for a day after a storm soaked it (rain of 30 mm or more), now and then. */
function wetClosures(f: FieldFacts, sports: boolean, window: DemoSeasonWindow, rand: Rng, rainOf: (iso: string) => number, out: DemoClosure[]): void {
  if (!sports) return;
  // Past days only: a booking of today on would have the week plan paint lines for it.
  for (let d = window.start; d < window.yesterday; d = addDaysIso(d, 1)) {
    const rain = rainOf(d);
    if (rain < 30 || f.outlook.maintenanceLevel === 4 || rand() > 0.2) continue;
    out.push({
      fieldIndex: f.index,
      startsOn: addDaysIso(d, 1),
      title: 'Closed: saturated after a storm',
      notes: `Closed for the day after ${round(rain, 0)} mm of rain: standing water, no play or machines (field status history)`,
    });
  }
}
