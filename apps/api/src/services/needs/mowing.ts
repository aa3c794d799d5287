/** The needs cards of cutting: HOC and mower, growth, mowing (one-third rule) and labour per mowing. */
import {
  CAUTIONS,
  checkMowerForHoc,
  hocFor,
  hoursPerMowingPolygon,
  levelIntervalDays,
  longAxis,
  mowTriggerHeightMm,
  mowerTypeFor,
  mowingPolicy,
  overdueDate,
  simulateMowing,
  stripePassPlan,
  type HocNeed,
  type LabourNeed,
  type MowingNeed,
} from '@swardwise/domain';
import { input, sum, type NeedsBasis } from './basis.ts';

/** HOC and mower. */
export function hocCard(b: NeedsBasis) {
  const { field, level, std, params, season } = b;
  const hocMm = hocFor(b.outlookField, b.standards);
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
  return { hoc, hocMm, mower };
}

/** Growth potential and growth over the week. */
export function growthCard(b: NeedsBasis) {
  const { prepared, daily, w0, weekDays, inWeek, season } = b;
  const gpWeek = inWeek(daily.gp);
  const growthWeek = inWeek(daily.growthMm);
  return {
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
}

/** The next mowing and the overdue date, from the last mowing on record (or the season simulation). */
function nextMowing(b: NeedsBasis, hocMm: number, mowOptions: ReturnType<typeof mowingPolicy>, seasonSim: ReturnType<typeof simulateMowing>) {
  const { field, prepared, daily, weekStart } = b;
  let nextMowingOn: string | null = null;
  let overdueOn: string | null = null;
  let lastCutNote: string;
  let nextMowingNote: string | null = null;
  const lastIdx = field.lastMowedOn ? prepared.dates.indexOf(field.lastMowedOn) : -1;
  if (!field.lastMowedOn) {
    nextMowingOn = seasonSim.mowings.find((m) => m.date >= weekStart)?.date ?? null;
    lastCutNote = 'No mowing is on record: the simulation starts cut to HOC on the first day of weather.';
  } else if (lastIdx < 0 || lastIdx >= prepared.dates.length - 1) {
    // On or after the last day of weather nothing after the cut is known: a date from the
    // season run would fall before the last mowing.
    const after = field.lastMowedOn >= prepared.dates[prepared.dates.length - 1]!;
    lastCutNote = after
      ? `Last mowed ${field.lastMowedOn}, on or after the last day of weather on file.`
      : `Last mowed ${field.lastMowedOn}, outside the weather on file: the next mowing follows the season simulation.`;
    if (!after) nextMowingOn = seasonSim.mowings.find((m) => m.date >= weekStart && m.date > field.lastMowedOn!)?.date ?? null;
    else nextMowingNote = `The next mowing cannot be projected until weather after ${field.lastMowedOn} arrives; by the Standards it falls due within ${levelIntervalDays(b.std)} days once the grass grows.`;
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
  return { nextMowingOn, overdueOn, lastCutNote, nextMowingNote };
}

/** Mowing by the one-third rule over the season, with the week's share. */
export function mowingCard(b: NeedsBasis, hocMm: number, plannedThisWeek: MowingNeed['plannedThisWeek']) {
  const { field, std, prepared, daily, w0, w1, weekDays, requested, weekStart, weekEnd } = b;
  const mowOptions = mowingPolicy(hocMm, std);
  const seasonSim = simulateMowing(hocMm, daily.growthMm, hocMm, { startDate: prepared.startDate, ...mowOptions });
  const weekMowings = seasonSim.mowings.filter((m) => m.dayIndex >= w0 && m.dayIndex <= w1);
  const asOf = requested >= weekStart && requested <= weekEnd ? requested : weekEnd;
  const { nextMowingOn, overdueOn, lastCutNote, nextMowingNote } = nextMowing(b, hocMm, mowOptions, seasonSim);
  const intervalDays = levelIntervalDays(std);
  const mowing = {
    intervalDays,
    plannedThisWeek,
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
      input('interval', 'Mow at least every (the shorter of the longest interval and 7 ÷ least mowings per week)', intervalDays, 'd'),
      input('lastMowed', 'Last mowed', field.lastMowedOn),
    ],
    how: `One-third rule: never remove more than a third of the leaf, so mow before the grass passes 1.5 × HOC. The predicted growth is run day by day; a cut also falls due ${intervalDays} days after the last (level ${b.level}: the shorter of its longest interval, ${std.maxMowingIntervalDays} days, and 7 ÷ its ${std.minMowingsPerWeek} least mowings per week), once the grass has grown a tenth of HOC. Mowings per week come from that run over the week of weather shown; the week plan\u2019s mowings are counted from its work orders for the week asked for, as Records counts them; the next mowing and the overdue date from the last mowing on record. ${lastCutNote}`,
    cautions: [CAUTIONS.mowing],
  };
  return { mowing, seasonMowings: seasonSim.mowings };
}

/** Labour per mowing: a pass plan for rectangular sports fields, else area ÷ field capacity. */
export function labourCard(b: NeedsBasis, mower: ReturnType<typeof hocCard>['mower'], mowingsPerWeek: number, seasonMowings: number): LabourNeed {
  const { field } = b;
  const corners = (field.geometry.coordinates[0]?.length ?? 1) - 1;
  const rectangular = corners === 4 && field.sport !== 'lawn' && field.sport !== 'multi_use';
  const axis = longAxis(field.geometry);
  const capacityHours = hoursPerMowingPolygon(field.geometry, mower);
  const plan = rectangular ? stripePassPlan(axis.lengthM, axis.widthM, mower, 'side_to_side') : null;
  const hoursPerMowing = plan ? plan.hours : capacityHours;
  return {
    method: plan ? 'pass_plan' : 'field_capacity',
    hoursPerMowing,
    hoursPerWeek: hoursPerMowing * mowingsPerWeek,
    seasonHours: hoursPerMowing * seasonMowings,
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
}
