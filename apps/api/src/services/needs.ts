/**
 * What a field needs for a week: every figure comes from the turf engine, fed with the
 * field, its level's Standards (from the `standards` table), the department parameters and
 * the daily weather of the nearest station. Each block carries the inputs it used, a short
 * note on how it is worked out, and the cautions that apply.
 */
import { asc, desc, eq } from 'drizzle-orm';
import {
  AppError,
  CAUTIONS,
  addDaysIso,
  annualNitrogen,
  checkMowerForHoc,
  defaultTemplateFor,
  fieldDailySeries,
  grassSeason,
  grossIrrigationMm,
  hocFor,
  hoursPerMowingPolygon,
  irrigationVolumeLitres,
  linePlan,
  longAxis,
  mondayOf,
  monthOf,
  monthlyNSplitByGp,
  mowTriggerHeightMm,
  mowerTypeFor,
  mowingPolicy,
  netIrrigationMm,
  overdueDate,
  planNApplications,
  productForArea,
  recommendLevel,
  runTimeMinutes,
  simulateMowing,
  stripePassPlan,
  type FieldNeeds,
  type HocNeed,
  type LabourNeed,
  type Level,
  type NeedInput,
  type PlayLevel,
  type SiteKind,
  type Sport,
  type Visibility,
  type WaterNeed,
} from '@swardwise/domain';
import { fieldChecks, sites, weatherDays } from '../db/schema/index.ts';
import type { Ctx } from './context.ts';
import { getField } from './fields.ts';
import { loadParameters, loadStandards } from './standards.ts';
import { nearestStation, prepareStationWeather, stationsWithWeather, unbrokenRunAround, type WeatherRow } from './stations.ts';

export type { FieldNeeds, NeedInput };

const input = (key: string, label: string, value: NeedInput['value'], unit: string | null = null): NeedInput => ({ key, label, value, unit });

/** Penman–Monteith needs more than temperatures; the engine takes Hargreaves otherwise. */
const hasMoreThanTemperatures = (r: WeatherRow) => r.rhMaxPct !== null || r.windMs !== null || r.sunshineH !== null || r.solarMJ !== null;


/**
 * Level of play and visibility are not recorded per field yet: they are read from the site
 * and the sport (department assumption, shown as such in the inputs).
 */
function assumedUse(kind: SiteKind, sport: Sport): { play: PlayLevel; visibility: Visibility } {
  if (sport === 'lawn') return { play: 'informal', visibility: kind === 'park' ? 'medium' : 'low' };
  if (kind === 'school') return { play: 'varsity', visibility: 'medium' };
  if (kind === 'complex') return { play: 'league', visibility: 'medium' };
  return { play: 'recreation', visibility: 'low' };
}

const sum = (xs: ArrayLike<number>) => {
  let total = 0;
  for (let i = 0; i < xs.length; i++) total += xs[i] as number;
  return total;
};
const r = (v: number, digits = 3) => Math.round(v * 10 ** digits) / 10 ** digits;

export async function fieldNeeds(ctx: Ctx, fieldId: number, date?: string): Promise<FieldNeeds> {
  const field = await getField(ctx, fieldId); // authorizes 'read' on this field's district and site
  const [site] = await ctx.db.select({ lat: sites.lat, lng: sites.lng, kind: sites.kind }).from(sites).where(eq(sites.id, field.siteId));
  const level = field.maintenanceLevel as Level;
  const { standards, versions, missing } = await loadStandards(ctx.db);
  const params = await loadParameters(ctx.db);
  const std = standards[level];

  const here = { lat: site!.lat, lng: site!.lng };
  const station = nearestStation(await stationsWithWeather(ctx.db), here);
  if (!station) throw new AppError('not_found', 'weather/none', 'No weather station has daily weather on file, so the needs of this field cannot be worked out yet. Add weather first.');
  const allDays = await ctx.db.select().from(weatherDays).where(eq(weatherDays.stationId, station.id)).orderBy(asc(weatherDays.date));

  // The week asked for, or else the latest week with weather on or before it.
  const requested = date ?? ctx.clock.today();
  const askedStart = mondayOf(requested);
  const askedEnd = addDaysIso(askedStart, 6);
  const have = new Set(allDays.map((d) => d.date));
  let weekStart = askedStart;
  let weekEnd = askedEnd;
  let weatherNote: string | null = null;
  const covered = Array.from({ length: 7 }, (_, i) => addDaysIso(askedStart, i)).filter((d) => have.has(d)).length;
  if (covered < 7) {
    const before = allDays.filter((d) => d.date <= askedEnd);
    const last = (before.length ? before[before.length - 1]! : allDays[allDays.length - 1]!).date;
    weekEnd = last;
    weekStart = addDaysIso(last, -6);
    weatherNote = `${station.name} has ${covered ? `only ${covered} of 7 days of` : 'no'} weather for the week of ${askedStart} to ${askedEnd}. These figures use the latest week with weather instead: ${weekStart} to ${weekEnd}.`;
  }

  // The unbroken run of days around the week: the season the chart and the mowing simulation use.
  const run = unbrokenRunAround(allDays, allDays.findIndex((d) => d.date === weekEnd));
  if (run[0]!.date > weekStart) {
    weekStart = run[0]!.date;
    weatherNote ??= `The weather on file starts on ${weekStart}; the week is shortened to the days with weather.`;
  }
  const prepared = prepareStationWeather(station, run);
  const w0 = prepared.dates.indexOf(weekStart);
  const w1 = prepared.dates.indexOf(weekEnd);
  const weekDays = w1 - w0 + 1;
  const inWeek = <T>(xs: ArrayLike<T>) => Array.prototype.slice.call(xs, w0, w1 + 1) as T[];

  const outlookField = { id: field.id, areaM2: field.areaM2, sport: field.sport, grass: field.grass, maintenanceLevel: level, hocOverrideMm: field.hocOverrideMm, clippings: field.clippings, irrigation: field.irrigation };
  const daily = fieldDailySeries(outlookField, prepared, standards, params);
  const season = grassSeason(field.grass);

  // HOC and mower.
  const hocMm = hocFor(outlookField, standards);
  const hocSource = field.hocOverrideMm !== null ? 'override' : std.hocByGrassMm[field.grass] !== undefined ? 'standards_grass' : 'standards_sport';
  const mowerKind = mowerTypeFor(hocMm, params.mowerSettings);
  const mower = params.mowers[mowerKind];
  const hoc: HocNeed = {
    hocMm,
    source: hocSource,
    triggerHeightMm: mowTriggerHeightMm(hocMm),
    mowerKind,
    mowerWarnings: checkMowerForHoc(mower, hocMm, params.mowerSettings),
    inputs: [
      input('level', 'Maintenance level', `${level} ${std.name}`),
      input('sport', 'Sport', field.sport),
      input('season', 'Grass season', season),
      input('standardsHoc', 'Standards HOC for this sport and season', std.hocMm[field.sport][season], 'mm'),
      input('grassHoc', 'Standards HOC for this grass', std.hocByGrassMm[field.grass] ?? null, 'mm'),
      input('override', 'Field override', field.hocOverrideMm, 'mm'),
      input('mowerRange', 'Default mower setting range', `${mower.hocMinMm}–${mower.hocMaxMm} mm`),
    ],
    how: `The field override wins when set; else the Standards HOC for this grass at the level, else the Standards HOC for the sport and grass season. A reel mower is usual up to ${params.mowerSettings.reelUpToHoc} ${params.mowerSettings.unit} inclusive (compared in the unit the department sets mowers in, to its step), a rotary above. The mower is the department default of that kind until equipment is recorded.`,
    cautions: [] as string[],
  };

  // Growth and mowing (one-third rule).
  const gpWeek = inWeek(daily.gp);
  const growthWeek = inWeek(daily.growthMm);
  const mowOptions = mowingPolicy(hocMm, std);
  const seasonSim = simulateMowing(hocMm, daily.growthMm, hocMm, { startDate: prepared.startDate, ...mowOptions });
  const weekMowings = seasonSim.mowings.filter((m) => m.dayIndex >= w0 && m.dayIndex <= w1);
  const asOf = requested >= weekStart && requested <= weekEnd ? requested : weekEnd;
  let nextMowingOn: string | null = null;
  let overdueOn: string | null = null;
  let lastCutNote: string;
  let nextMowingNote: string | null = null;
  const lastIdx = field.lastMowedOn ? prepared.dates.indexOf(field.lastMowedOn) : -1;
  if (!field.lastMowedOn) {
    nextMowingOn = seasonSim.mowings.find((m) => m.date >= weekStart)?.date ?? null;
    lastCutNote = 'No mowing is on record: the simulation starts cut to HOC on the first day of weather.';
  } else if (lastIdx < 0 || lastIdx >= prepared.dates.length - 1) {
    const after = field.lastMowedOn > prepared.dates[prepared.dates.length - 1]!;
    lastCutNote = after
      ? `Last mowed ${field.lastMowedOn}, after the last day of weather on file.`
      : `Last mowed ${field.lastMowedOn}, outside the weather on file: the next mowing follows the season simulation.`;
    if (!after) nextMowingOn = seasonSim.mowings.find((m) => m.date >= weekStart)?.date ?? null;
    else nextMowingNote = 'The next mowing cannot be projected until weather after the last mowing arrives.';
  } else {
    const growthAfter = daily.growthMm.slice(lastIdx + 1);
    const from = prepared.dates[lastIdx + 1]!;
    // Cut to HOC that morning, then the day's growth: the week plan's convention.
    const heightAfterCutDay = hocMm + daily.growthMm[lastIdx]!;
    const sim = simulateMowing(hocMm, growthAfter, heightAfterCutDay, { startDate: from, ...mowOptions });
    nextMowingOn = sim.mowings[0]?.date ?? null;
    overdueOn = overdueDate(hocMm, heightAfterCutDay, growthAfter, from);
    lastCutNote = `Simulated from the last mowing on ${field.lastMowedOn} (cut to HOC).`;
    if (!nextMowingOn) nextMowingNote = `No further mowing falls due before ${prepared.dates[prepared.dates.length - 1]}, the last day of weather on file.`;
  }
  const growth = {
    gpDaily: gpWeek.map((g, i) => ({ date: prepared.dates[w0 + i]!, gp: g, growthMm: growthWeek[i]! })),
    gpMean: sum(gpWeek) / weekDays,
    growthMmPerDay: sum(growthWeek) / weekDays,
    growthMmWeek: sum(growthWeek),
    inputs: [
      input('tMean', 'Mean air temperature of the week', sum(inWeek(prepared.tMeanC)) / weekDays, '°C'),
      input('season', 'Grass season', season),
      input('gmax', 'Maximum growth at GP 1', daily.gmaxMmPerDay, 'mm/day'),
    ],
    how: 'Growth potential GP = exp(−½((T − To)/σ)²) from the daily mean temperature (Gelernter & Stowell 2005; To 20 °C cool-season, 31 °C warm-season; warm-season GP stays at 1 from 31 °C up, as in the authors\u2019 later revision). Daily growth = the grass\u2019s maximum growth × GP × a water modifier (rain and the irrigation the water budget schedules, against ETc over the last 14 days).',
    cautions: [] as string[],
  };
  const mowing = {
    mowingsThisWeek: weekMowings.length,
    mowingsPerWeek: (weekMowings.length / weekDays) * 7,
    weekMowingDates: weekMowings.map((m) => m.date),
    nextMowingOn,
    nextMowingNote,
    overdueOn,
    overdueNow: overdueOn !== null && overdueOn <= asOf,
    lastMowedOn: field.lastMowedOn,
    inputs: [
      input('hoc', 'HOC', hocMm, 'mm'),
      input('trigger', 'Mow before the grass reaches (1.5 × HOC)', mowTriggerHeightMm(hocMm), 'mm'),
      input('minPerWeek', 'Standards: least mowings per week', std.minMowingsPerWeek),
      input('maxInterval', 'Standards: longest interval', std.maxMowingIntervalDays, 'd'),
      input('lastMowed', 'Last mowed', field.lastMowedOn),
    ],
    how: `One-third rule: never remove more than a third of the leaf, so mow before the grass passes 1.5 × HOC. The predicted growth is run day by day; a cut also falls due when the level\u2019s longest interval or least frequency is reached (once the grass has grown a tenth of HOC). Mowings per week come from that run over the season; the next mowing and the overdue date from the last mowing on record. ${lastCutNote}`,
    cautions: [CAUTIONS.mowing],
  };

  // Labour per mowing: a pass plan for rectangular sports fields, else area ÷ field capacity.
  const corners = (field.geometry.coordinates[0]?.length ?? 1) - 1;
  const rectangular = corners === 4 && field.sport !== 'lawn' && field.sport !== 'multi_use';
  const axis = longAxis(field.geometry);
  const capacityHours = hoursPerMowingPolygon(field.geometry, mower);
  const plan = rectangular ? stripePassPlan(axis.lengthM, axis.widthM, mower, 'side_to_side') : null;
  const hoursPerMowing = plan ? plan.hours : capacityHours;
  const labour: LabourNeed = {
    method: plan ? 'pass_plan' : 'field_capacity',
    hoursPerMowing,
    hoursPerWeek: hoursPerMowing * mowing.mowingsPerWeek,
    seasonHours: hoursPerMowing * seasonSim.mowings.length,
    passPlan: plan ? { direction: plan.direction, passes: plan.passes[0]!, passLengthM: plan.passLengthsM[0]!, turns: plan.turns, distanceM: plan.distanceM } : null,
    capacityHours,
    inputs: [
      input('area', 'Field area', field.areaM2, 'm2'),
      input('length', 'Length', axis.lengthM, 'm'),
      input('width', 'Width', axis.widthM, 'm'),
      input('mowerWidth', 'Mower cutting width', mower.widthM, 'm'),
      input('speed', 'Mowing speed', mower.speedKmh, 'km/h'),
      input('efficiency', 'Field efficiency', mower.efficiency, '%'),
      input('turn', 'Time per turn', mower.turnTimeS, 's'),
    ],
    how: plan
      ? 'A rectangular sports field is mowed in stripes from side to side (officials read the lines across): passes = width of the stripe direction ÷ (cutting width − overlap); time = distance ÷ speed + turns × turn time. Hours per week = hours per mowing × mowings per week.'
      : 'Hours per mowing = area ÷ effective field capacity, where capacity (ha/h) = speed (km/h) × width (m) × efficiency ÷ 10 (ASABE EP496). Hours per week = hours per mowing × mowings per week.',
    cautions: [] as string[],
  };

  // Water budget for the week.
  const weekRows = run.slice(w0, w1 + 1);
  const hargreavesDays = weekRows.filter((d) => !hasMoreThanTemperatures(d)).length;
  const et0Week = sum(inWeek(prepared.et0Mm));
  const etcWeek = sum(inWeek(daily.etcMm));
  const rainWeek = sum(inWeek(prepared.rainMm));
  const effWeek = sum(inWeek(prepared.effectiveRainMm));
  const irrigated = daily.share > 0;
  const netMm = irrigated ? netIrrigationMm(etcWeek, effWeek, daily.share) : 0;
  const grossMm = irrigated ? grossIrrigationMm(netMm, daily.du) : 0;
  const water: WaterNeed = {
    irrigated,
    notIrrigatedReason: irrigated ? null : field.irrigation === 'none' ? 'The field has no irrigation.' : `Level ${level} (${std.name}) is not irrigated in the Standards.`,
    et0Method: hargreavesDays === 0 ? 'penman_monteith' : hargreavesDays === weekDays ? 'hargreaves' : 'mixed',
    et0Mm: et0Week,
    kc: daily.kc,
    etcMm: etcWeek,
    rainMm: rainWeek,
    effectiveRainMm: effWeek,
    shareOfEtc: daily.share,
    netMm,
    grossMm,
    runTimeMin: irrigated ? runTimeMinutes(grossMm, params.irrigation.precipRateMmPerH) : 0,
    volumeL: irrigated ? irrigationVolumeLitres(grossMm, field.areaM2) : 0,
    inputs: [
      input('station', 'Weather station', `${station.name} (${r(station.distanceKm, 1)} km)`),
      input('elevation', 'Station elevation', station.elevationM, 'm'),
      input('kc', `Kc (department's ${season}-season turf Kc${std.reducedKc ? `, less ${params.turfKc.reducedBy}` : ''})`, daily.kc),
      input('share', 'Standards: share of ETc replaced', std.irrigationShareOfEtc, '%'),
      input('du', 'Distribution uniformity (DU)', daily.du, '%'),
      input('precipRate', 'Precipitation rate', params.irrigation.precipRateMmPerH, 'mm/h'),
      input('area', 'Field area', field.areaM2, 'm2'),
    ],
    how: 'ET0 by FAO-56 Penman–Monteith from the station\u2019s daily temperature, humidity, wind and sunshine (Hargreaves on days with temperatures only). ETc = Kc × ET0, with the department\u2019s turf Kc (annual planning values for mowed turf, by default 0.8 cool-season and 0.6 warm-season: University of California ANR turfgrass water guidance). Effective rain: the first 0.1 in of each day is lost, the rest counts (TexasET rule). Net need = share × ETc − effective rain; gross need = net × SM, the scheduling multiplier SM = 1 ÷ (0.4 + 0.6 × DU) of the lower-quarter DU; run time = gross ÷ precipitation rate; volume = gross × area.',
    cautions: [CAUTIONS.water],
  };

  // Feed plan for the season's year, split by monthly growth potential.
  const year = Number(prepared.startDate.slice(0, 4));
  const monthGp: (number | null)[] = new Array(12).fill(null);
  const monthDays = new Array(12).fill(0);
  prepared.dates.forEach((d, i) => {
    if (Number(d.slice(0, 4)) !== year) return;
    const m = monthOf(d) - 1;
    monthGp[m] = (monthGp[m] ?? 0) + (daily.gp[i] as number);
    monthDays[m]++;
  });
  const monthlyMeanGp = monthGp.map((g, m) => (g === null ? null : g / monthDays[m]));
  const annual = annualNitrogen({ grass: field.grass, level, clippings: field.clippings, irrigated }, standards);
  const monthly = monthlyNSplitByGp(annual.gPerM2, monthlyMeanGp);
  const product = params.fertiliserProduct;
  const applications = planNApplications(monthly, { slowReleaseShare: product.slowReleaseShare, year, params }).map((a) => {
    const need = productForArea(a.nGPerM2, product, field.areaM2, params.fertiliserBagKg, params.costs.fertiliserPerKg);
    return { date: a.date!, month: a.month, nGPerM2: a.nGPerM2, productGPerM2: need.productGPerM2, productKg: need.productKg, bags: need.bags };
  });
  const feed = {
    annualNGPerM2: annual.gPerM2,
    reasons: annual.reasons,
    monthlyNGPerM2: monthly,
    product: { analysis: `${product.n}-${product.p}-${product.k}`, slowReleaseShare: product.slowReleaseShare, bagKg: params.fertiliserBagKg },
    applications,
    nextApplication: applications.find((a) => a.date >= weekStart) ?? null,
    productKgSeason: sum(applications.map((a) => a.productKg)),
    inputs: [
      input('grass', 'Grass', field.grass),
      input('clippings', 'Clippings', field.clippings),
      input('irrigated', 'Irrigated', irrigated),
      input('share', 'Standards: share of the grass\u2019s upper N', std.annualNShare, '%'),
      input('product', 'Default product (N-P-K)', `${product.n}-${product.p}-${product.k}, ${Math.round(product.slowReleaseShare * 100)} % slow-release N`),
      input('area', 'Field area', field.areaM2, 'm2'),
    ],
    how: 'Annual N = the grass\u2019s published annual range (upper end when irrigated, lower when not) × the level\u2019s share (a level fed below the published range says so), less 25–60 % when clippings are returned, more on older turf (Qian et al. 2003; 25 % when the turf\u2019s age is not recorded). It is split over the months in proportion to each month\u2019s mean growth potential (months below GP 0.1 or without weather get none) and into applications that keep soluble N within 1 lb N/1000 ft² (4.9 g/m²). Product = N ÷ N %.',
    cautions: [CAUTIONS.feed],
  };

  // Line plan.
  const template = std.lineRepaintDays === null ? null : defaultTemplateFor(field.sport);
  const lp = template ? linePlan(template, params.lines, { days: prepared.dates.length, repaintDays: std.lineRepaintDays }) : null;
  const lines = {
    kept: lp !== null,
    reason: lp ? null : field.sport === 'lawn' || field.sport === 'multi_use' ? 'No lines are kept on this kind of field.' : `Level ${level} (${std.name}) keeps no lines in the Standards.`,
    template: template && lp ? { id: template.id, name: template.name, source: template.source, lineWidthM: template.lineWidthM } : null,
    lineLengthM: lp?.lineLengthM ?? 0,
    /** What the totals include, element by element (lines, marks, numerals, team areas). */
    elements: lp?.elements ?? [],
    paintedAreaM2: lp?.paintedAreaM2 ?? 0,
    // One repaint: a touch-up over lines that still show (the usual repaint).
    mixedLitres: lp?.touchUp.mixedLitres ?? 0,
    concentrateLitres: lp?.touchUp.concentrateLitres ?? 0,
    waterLitres: lp?.touchUp.waterLitres ?? 0,
    hoursPerRepaint: lp?.touchUp.hours ?? 0,
    /** The first coat of the season (the layout painted afresh). */
    firstCoat: { mixedLitres: lp?.firstCoat.mixedLitres ?? 0, concentrateLitres: lp?.firstCoat.concentrateLitres ?? 0, waterLitres: lp?.firstCoat.waterLitres ?? 0, hours: lp?.firstCoat.hours ?? 0 },
    repaintDays: std.lineRepaintDays,
    repaints: lp?.repaints ?? 0,
    firstCoats: lp?.firstCoats ?? 0,
    touchUps: lp?.touchUps ?? 0,
    seasonMixedLitres: lp?.seasonMixedLitres ?? 0,
    seasonConcentrateLitres: lp?.seasonConcentrateLitres ?? 0,
    seasonHours: lp?.seasonHours ?? 0,
    inputs: [
      input('coverageFirst', 'First coat: finished line per litre of mixed paint', params.lines.firstCoat.coverageM2PerMixedL, 'm2/L'),
      input('dilutionFirst', 'First coat: parts water per part paint', params.lines.firstCoat.dilutionWaterPerPaint),
      input('passesFirst', 'First coat: passes', params.lines.firstCoat.passes),
      input('coverageTouchUp', 'Touch-up: finished line per litre of mixed paint', params.lines.touchUp.coverageM2PerMixedL, 'm2/L'),
      input('dilutionTouchUp', 'Touch-up: parts water per part paint', params.lines.touchUp.dilutionWaterPerPaint),
      input('passesTouchUp', 'Touch-up: passes', params.lines.touchUp.passes),
      input('markerSpeed', 'Marker speed', params.lines.markerSpeedKmh, 'km/h'),
      input('repaintDays', 'Standards: days between repaints', std.lineRepaintDays, 'd'),
      input('seasonDays', 'Days of the season', prepared.dates.length, 'd'),
    ],
    how: 'Line length from the sport\u2019s layout template (straight lines, arcs, marks, numerals and team areas, listed element by element). Mixed paint = painted area ÷ the coat\u2019s coverage of finished line (about 200 linear ft of 4 in line per mixed gallon for a first coat painted in both directions; a touch-up is one pass, so about twice that); concentrate = mixed ÷ (1 + parts water); labour = length × passes ÷ marker speed + set-up. The season: one first coat at the start, then a touch-up every repaint interval.',
    cautions: lp ? [CAUTIONS.lines] : [],
  };

  // Level: assigned against the rubric, and the latest surface score against the target.
  const use = assumedUse(site!.kind, field.sport);
  const rec = recommendLevel({ play: use.play, visibility: use.visibility, weeklyUseHours: Math.min(168, field.weeklyUseHours), rootzone: field.rootzone, irrigation: field.irrigation });
  const [latest] = await ctx.db.select({ checkedOn: fieldChecks.checkedOn, score: fieldChecks.score }).from(fieldChecks).where(eq(fieldChecks.fieldId, field.id)).orderBy(desc(fieldChecks.checkedOn), desc(fieldChecks.id)).limit(1);
  const levelBlock = {
    assigned: level,
    recommended: rec.level,
    points: rec.points,
    reasons: rec.reasons,
    targetScore: std.targetScore,
    latestCheck: latest ? { checkedOn: latest.checkedOn, score: latest.score } : null,
    scoreMet: latest ? latest.score >= std.targetScore : null,
    workCompliance: { tracked: false, note: 'Work planned against work done is not tracked yet: it comes with work orders.' },
    inputs: [
      input('play', 'Level of play (assumed from the site and sport)', use.play),
      input('visibility', 'Visibility (assumed from the site)', use.visibility),
      input('use', 'Use per week', field.weeklyUseHours, 'h'),
      input('rootzone', 'Rootzone', field.rootzone),
      input('irrigation', 'Irrigation', field.irrigation),
      input('checkDays', 'Standards: days between field checks', std.fieldCheckDays, 'd'),
    ],
    how: 'The department rubric adds points for level of play, hours of use per week, visibility, rootzone and irrigation (8 or more: level 1; 5: level 2; 2: level 3; else 4; no irrigation holds a field at level 3 or lower). Compliance compares the latest field check\u2019s surface score with the level\u2019s target score.',
    cautions: [] as string[],
  };

  const seasonBlock = {
    stationId: station.id,
    start: prepared.startDate,
    end: prepared.dates[prepared.dates.length - 1]!,
    dates: prepared.dates,
    gp: Array.from(daily.gp, (v) => r(v)),
    growthMm: daily.growthMm.map((v) => r(v, 2)),
    waterNeedMm: Array.from(daily.grossNeedMm, (v) => r(v, 2)),
    mowings: seasonSim.mowings.map((m) => m.date),
    feedApplications: applications.map((a) => ({ date: a.date, nGPerM2: a.nGPerM2 })),
  };

  return {
    fieldId: field.id,
    requestedDate: requested,
    week: { start: weekStart, end: weekEnd, days: weekDays, fallback: weatherNote !== null },
    weatherNote,
    station: { id: station.id, code: station.code, name: station.name, distanceKm: station.distanceKm, hargreavesDays: prepared.hargreavesDays },
    standards: { level, name: std.name, version: versions[level], missingLevels: missing },
    hoc,
    growth,
    mowing,
    labour,
    water,
    feed,
    lines,
    level: levelBlock,
    season: seasonBlock,
  };
}
