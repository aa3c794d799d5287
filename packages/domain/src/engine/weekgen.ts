/**
 * Week plan generation: what each field asks of the crews in one week (Monday to Sunday),
 * from the turf engine and the weather, and how those asks become crew work.
 *
 * - Mowing: the one-third rule over the predicted daily growth (`simulateMowing`), from the
 *   last cut on record; a cut the rule asked for before the week is overdue and goes first.
 * - Lines: painted before each booking (department lead time), and every repaint interval of
 *   the level while the turf grows.
 * - Feed: the feed plan's applications (annual N split by monthly growth potential).
 * - Water: the week's gross need ((share × ETc − effective rain) × SM, `weekIrrigation`) as run
 *   times on the allowed watering days.
 * - Field checks: every `fieldCheckDays` of the level.
 *
 * Orders that people kept (assigned, moved, logged or added by hand) count as done work:
 * a kept mowing resets the grass to HOC on its date, a kept painting serves nearby bookings.
 * Pure and deterministic: the same input gives the same plan.
 */
import type { Polygon } from '../schemas/common.ts';
import type { WeekWarning } from './week-warnings.ts';
import type { Clippings, FieldStatus, Grass, IrrigationKind, Level, Sport, StripePattern, WorkStatus, WorkTask } from '../vocabulary.ts';
import { LEVEL_NAMES, STRIPE_PATTERN_LABELS } from '../vocabulary.ts';
import { fail } from './check.ts';
import { WEEKDAYS, addDaysIso, isoToDayNumber, monthOf, weekdayOf } from './dates.ts';
import type { Weekday } from './dates.ts';
import { annualNitrogen, monthlyNSplitByGp, planNApplications, productForArea } from './feed.ts';
import { greatCircleKm, hoursPerMowing, hoursPerMowingPolygon, stripePassPlan } from './labour.ts';
import type { LatLng, TravelSettings } from './labour.ts';
import { defaultTemplateFor, linePlan } from './lines.ts';
import { longAxis } from '../geometry.ts';
import { levelIntervalDays, mowTriggerHeightMm, mowerTypeFor, mowingPolicy, simulateMowing } from './mowing.ts';
import { fieldDailySeries } from './outlook.ts';
import type { FieldDailySeries, OutlookField, PreparedWeather } from './outlook.ts';
import { planRoute } from './routing.ts';
import { fieldStripePlan } from './stripes.ts';
import { DEFAULT_PARAMETERS, DEFAULT_STANDARDS, hocFor, levelStandard } from './standards.ts';
import type { DepartmentParameters, LevelStandard, MowerSpec, PlanningParameters, Standards } from './standards.ts';
import { culturalProgramsOf, grassSeason } from './standards.ts';
import { AERATION_METHOD_LABELS, CULTURAL_TASKS, CULTURAL_TASK_WORDS, culturalDue, monthWindowWords, overseedShare } from './cultural.ts';
import type { CulturalTask } from './cultural.ts';
import { irrigationVolumeLitres, weekIrrigation, weeklyIrrigationSchedule } from './water.ts';

/** A field as the week plan needs it. */
export interface PlanField {
  id: number;
  siteId: number;
  site: LatLng;
  sport: Sport;
  grass: Grass;
  areaM2: number;
  geometry: Polygon;
  maintenanceLevel: Level;
  hocOverrideMm: number | null;
  clippings: Clippings;
  irrigation: IrrigationKind;
  status: FieldStatus;
  lastMowedOn: string | null;
  lastPaintedOn: string | null;
  lastFedOn: string | null;
  lastCheckedOn: string | null;
  /** Bookings from the week's Monday to the next Monday. */
  events: ReadonlyArray<{ id: number; startsOn: string; title: string }>;
  /**
   * Paintings planned or done in the weeks before this one (not skipped), with the booking
   * each was for: a booking painted last week is not painted again, and the repaint interval
   * counts from them.
   */
  paints?: ReadonlyArray<{ date: string; eventId: number | null }>;
  /** Dates each cultural task was done this season (work orders logged done). */
  culturalDone?: Partial<Record<CulturalTask, readonly string[]>>;
  /** The last field check's bare share (%) and where the wear is, for overseeding. */
  lastWear?: { checkedOn: string; barePct: number; areas: readonly string[] } | null;
  /** The stripe pattern asked for on its mowings, and the mower chosen for it (null: the plan's pick). */
  stripes?: { pattern: StripePattern; mowerId: number | null } | null;
}

/** An order that stays as people left it; it counts as work already planned or done. */
export interface KeptOrder {
  id: number;
  fieldId: number;
  task: WorkTask;
  plannedDate: string;
  status: WorkStatus;
  /** The engine's details it was planned with (a painting's `eventId`). */
  details?: Record<string, unknown> | null;
}

/** A mower the district has (for hours and HOC fit); the department default stands in when none fits. */
export interface PlanMower {
  id: number;
  crewId: number | null;
  kind: 'reel' | 'rotary' | 'flail';
  widthM: number;
  speedKmh: number;
  efficiency: number;
  hocMinMm: number;
  hocMaxMm: number;
}

/** What the plan asks of one field on one day. */
export interface AskedOrder {
  fieldId: number;
  siteId: number;
  task: WorkTask;
  /** The date the engine asks for (the crew's working days may move it). */
  askedDate: string;
  plannedHours: number;
  reason: string;
  details: Record<string, unknown>;
  /** Date by which it must be done (mowing: the one-third rule; lines: the last working day before the booking); null: by the week's end. */
  latestDate: string | null;
  /** First day a flexible order may go on (default: the first open day of the week). */
  earliestDate?: string;
  /** An order that may go on any working day from `earliestDate` to `latestDate`, to spread the work over crews and days. */
  flexible: boolean;
  /** Equipment kind the order needs, to suggest a unit. */
  equipmentKind: 'mower' | 'line_marker' | 'spreader' | null;
  /** Days a flexible order must not go on (a booking, or the day before it, for aeration). */
  avoidDates?: readonly string[];
}

export interface FieldWeekInput {
  field: PlanField;
  weather: PreparedWeather;
  weekStart: string;
  kept: readonly KeptOrder[];
  /** Days any crew of the district works (mowing can fall only on these). */
  workDays: readonly Weekday[];
  /** First day work can still be planned on (today, when the week has begun); default Monday. */
  notBefore?: string;
  mowers?: readonly PlanMower[];
  standards?: Standards;
  params?: DepartmentParameters;
}

export interface FieldWeekPlan {
  fieldId: number;
  orders: AskedOrder[];
  /** What to say about the field's week (e.g. weather projected past the last day on file); worded by `weekWarningText`. */
  warnings: WeekWarning[];
}

const round = (v: number, digits = 2) => Math.round(v * 10 ** digits) / 10 ** digits;
const WEEK_FROM_MONDAY: readonly Weekday[] = ['mon', 'tue', 'wed', 'thu', 'fri', 'sat', 'sun'];
const dayName = (iso: string) => ({ sun: 'Sunday', mon: 'Monday', tue: 'Tuesday', wed: 'Wednesday', thu: 'Thursday', fri: 'Friday', sat: 'Saturday' })[weekdayOf(iso)];

/** The seven dates of the week starting on a Monday; throws `engine/not_monday`. */
export function weekDates(weekStart: string): string[] {
  if (weekdayOf(weekStart) !== 'mon') fail('not_monday', `a plan week starts on a Monday (${weekStart} is a ${dayName(weekStart)})`);
  return Array.from({ length: 7 }, (_, i) => addDaysIso(weekStart, i));
}

/**
 * A daily growth series from the first day of weather to the end of the week. Days past the
 * last day on file (no forecast yet) repeat the mean of the last seven days (persistence),
 * and the plan says so.
 */
function growthThroughWeek(daily: number[], weather: PreparedWeather, weekEnd: string): { growth: number[]; projectedDays: number } {
  const last = weather.dates[weather.dates.length - 1] as string;
  const missing = Math.max(0, isoToDayNumber(weekEnd) - isoToDayNumber(last));
  if (missing === 0) return { growth: daily, projectedDays: 0 };
  const tail = daily.slice(-7);
  const mean = tail.reduce((s, v) => s + v, 0) / Math.max(1, tail.length);
  return { growth: [...daily, ...new Array<number>(missing).fill(mean)], projectedDays: missing };
}

/** Picks the mower for a HOC: the kind the HOC asks for whose range holds it, widest first; else the department default. */
export function chooseMower(hocMm: number, mowers: readonly PlanMower[], params: DepartmentParameters = DEFAULT_PARAMETERS, crewId: number | null = null): { spec: MowerSpec; mower: PlanMower | null } {
  const kind = mowerTypeFor(hocMm, params.mowerSettings ?? DEFAULT_PARAMETERS.mowerSettings);
  const fits = mowers
    .filter((m) => m.kind === kind && m.hocMinMm <= hocMm + 1e-9 && m.hocMaxMm >= hocMm - 1e-9)
    .sort((a, b) => Number(b.crewId === crewId && crewId !== null) - Number(a.crewId === crewId && crewId !== null) || b.widthM - a.widthM || a.id - b.id);
  const base = params.mowers[kind];
  const m = fits[0];
  if (!m) return { spec: base, mower: null };
  return { spec: { ...base, widthM: m.widthM, speedKmh: m.speedKmh, efficiency: m.efficiency, hocMinMm: m.hocMinMm, hocMaxMm: m.hocMaxMm }, mower: m };
}

/** Hours for one mowing: a stripe pass plan on rectangular sports fields, else area ÷ field capacity (as the field page shows). */
export function mowingHours(field: Pick<PlanField, 'geometry' | 'sport'>, mower: MowerSpec): { hours: number; method: 'pass_plan' | 'field_capacity' } {
  const corners = (field.geometry.coordinates[0]?.length ?? 1) - 1;
  if (corners === 4 && field.sport !== 'lawn' && field.sport !== 'multi_use') {
    const axis = longAxis(field.geometry);
    return { hours: stripePassPlan(axis.lengthM, axis.widthM, mower, 'side_to_side').hours, method: 'pass_plan' };
  }
  return { hours: hoursPerMowingPolygon(field.geometry, mower), method: 'field_capacity' };
}

/** What every part of one field's week reads, built once per field; `orders` and `warnings` collect in plan order. */
interface FieldWeekContext {
  input: FieldWeekInput;
  field: PlanField;
  weather: PreparedWeather;
  weekStart: string;
  weekEnd: string;
  dates: string[];
  /** First day new work can fall on. */
  start: string;
  standards: Standards;
  params: DepartmentParameters;
  planning: PlanningParameters;
  std: LevelStandard;
  level: Level;
  outlookField: OutlookField;
  /** First day of weather on file. */
  first: string | undefined;
  /** Index of a date in the growth series (may pass the weather's end: projected). */
  idx: (iso: string) => number;
  keptOf: (task: WorkTask) => KeptOrder[];
  orders: AskedOrder[];
  warnings: WeekWarning[];
}

/** What one field asks of the crews in the week. */
export function planFieldWeek(input: FieldWeekInput): FieldWeekPlan {
  const { field, weather, weekStart, kept } = input;
  const standards = input.standards ?? DEFAULT_STANDARDS;
  const params = input.params ?? DEFAULT_PARAMETERS;
  const dates = weekDates(weekStart);
  const weekEnd = dates[6] as string;
  // Days of the week already past cannot take new work: what they asked for moves to `start`.
  const start = input.notBefore && input.notBefore > weekStart ? (input.notBefore < weekEnd ? input.notBefore : weekEnd) : weekStart;
  const level = field.maintenanceLevel;
  const first = weather.dates[0];
  const day0 = first ? isoToDayNumber(first) : 0;
  const ctx: FieldWeekContext = {
    input,
    field,
    weather,
    weekStart,
    weekEnd,
    dates,
    start,
    standards,
    params,
    planning: params.planning ?? DEFAULT_PARAMETERS.planning,
    std: levelStandard(level, standards),
    level,
    outlookField: { id: field.id, areaM2: field.areaM2, sport: field.sport, grass: field.grass, maintenanceLevel: level, hocOverrideMm: field.hocOverrideMm, clippings: field.clippings, irrigation: field.irrigation },
    first,
    idx: (iso: string) => isoToDayNumber(iso) - day0,
    keptOf: (task: WorkTask) => kept.filter((k) => k.fieldId === field.id && k.task === task && k.status !== 'skipped'),
    orders: [],
    warnings: [],
  };
  // A retired field is no longer kept: nothing is asked of it, not even a field check.
  if (field.status === 'retired') return { fieldId: field.id, orders: [], warnings: [{ code: 'field_retired', fieldId: field.id }] };

  if (!first || first > weekEnd) ctx.warnings.push({ code: 'no_weather_before_week', fieldId: field.id, date: weekEnd });
  const daily = first && first <= weekEnd ? fieldDailySeries(ctx.outlookField, weather, standards, params) : null;
  const open = field.status !== 'closed';
  if (!open) ctx.warnings.push({ code: 'field_closed', fieldId: field.id });

  if (daily && open) {
    const { growth, weekGp } = weekGrowth(ctx, daily);
    mowingOrders(ctx, growth);
    lineOrders(ctx, weekGp);
    if (weekGp >= ctx.planning.dormantGp && ctx.keptOf('feed').length === 0) feedOrders(ctx, daily);
    if (daily.share > 0) irrigationOrders(ctx, daily);
    culturalOrders(ctx, weekGp);
  }
  fieldCheckOrders(ctx);
  return { fieldId: field.id, orders: ctx.orders, warnings: ctx.warnings };
}

/** The growth series through a week past Sunday, and the week's mean growth potential. */
function weekGrowth(ctx: FieldWeekContext, daily: FieldDailySeries): { growth: number[]; weekGp: number } {
  const { weather, weekStart, weekEnd, idx } = ctx;
  // The run looks a week past Sunday so Friday's cut sees the weekend's growth.
  const { growth, projectedDays: projectedAll } = growthThroughWeek(daily.growthMm, weather, addDaysIso(weekEnd, 7));
  const projectedDays = Math.max(0, projectedAll - 7);
  if (projectedDays > 0) ctx.warnings.push({ code: 'weather_projected', fieldId: ctx.field.id, date: weather.dates[weather.dates.length - 1]!, days: Math.min(7, projectedDays) });
  const w0 = Math.max(0, idx(weekStart));
  const gp = daily.gp;
  let gpSum = 0;
  let gpN = 0;
  for (let i = w0; i <= Math.min(idx(weekEnd), gp.length - 1); i++) {
    gpSum += gp[i] as number;
    gpN++;
  }
  return { growth, weekGp: gpN ? gpSum / gpN : gp.length ? (gp[gp.length - 1] as number) : 0 };
}

interface AskedCut {
  date: string;
  heightMm: number;
  reason: 'growth' | 'frequency' | 'overdue';
  overdueSince?: string;
}

/** Mowing: the one-third rule simulated from the last cut (on record or kept in this week). */
function mowingOrders(ctx: FieldWeekContext, growth: number[]): void {
  const { field, std, level, params } = ctx;
  const hocMm = hocFor(ctx.outlookField, ctx.standards);
  const trigger = mowTriggerHeightMm(hocMm);
  const { spec, mower } = chooseMower(hocMm, ctx.input.mowers ?? [], params);
  const plain = mowingHours(field, spec);
  const stripes = stripeHours(ctx, spec, plain.hours);
  const hours = stripes?.longer ? stripes.hours : plain.hours;
  const method = stripes?.longer ? 'stripe_plan' : plain.method;
  for (const a of askedCuts(ctx, growth, hocMm)) {
    const why =
      a.reason === 'overdue'
        ? `Overdue: the one-third rule asked for a cut on ${a.overdueSince} and none is on record`
        : a.reason === 'growth'
          ? `One-third rule: the grass would pass ${round(trigger, 0)} mm (1.5 × HOC ${round(hocMm, 0)} mm) before the next mowing day`
          : `Level ${level} (${LEVEL_NAMES[level]}) asks a cut at least every ${levelIntervalDays(std)} days`;
    ctx.orders.push({
      fieldId: field.id,
      siteId: field.siteId,
      task: 'mow',
      askedDate: a.date,
      plannedHours: round(hours),
      reason: stripes ? `${why}. ${stripes.note}` : why,
      details: {
        hocMm: round(hocMm, 3),
        triggerMm: round(trigger, 1),
        heightBeforeMm: round(a.heightMm, 1),
        mowerKind: spec.kind,
        mowerId: mower?.id ?? null,
        hoursMethod: method,
        overdueSince: a.overdueSince ?? null,
        ...(stripes ? { pattern: field.stripes!.pattern, passes: stripes.passes } : {}),
      },
      latestDate: a.date,
      flexible: false,
      equipmentKind: 'mower',
    });
  }
}

/**
 * The field's stripe pattern over its outline (`fieldStripePlan`) with the mower chosen for it
 * (else the plan's pick): its hours, whether they pass the plain mowing time, and the words for
 * the reason. Null without a pattern, or when the outline gives no plan.
 */
function stripeHours(ctx: FieldWeekContext, spec: MowerSpec, plainHours: number): { hours: number; passes: number; longer: boolean; note: string } | null {
  const stripes = ctx.field.stripes;
  if (!stripes) return null;
  const chosen = stripes.mowerId === null ? undefined : (ctx.input.mowers ?? []).find((m) => m.id === stripes.mowerId);
  const base = chosen ? ctx.params.mowers[chosen.kind === 'reel' ? 'reel' : 'rotary'] : spec;
  const mower = chosen ? { widthM: chosen.widthM, speedKmh: chosen.speedKmh, efficiency: chosen.efficiency, overlapM: base.overlapM, turnTimeS: base.turnTimeS } : spec;
  let plan;
  try {
    plan = fieldStripePlan(ctx.field.geometry, stripes.pattern, mower);
  } catch {
    return null;
  }
  const label = STRIPE_PATTERN_LABELS[stripes.pattern];
  const longer = plan.hours > plainHours;
  const note = longer
    ? `${label}: ${plan.passes} passes take ${round(plan.hours)} h, longer than the plain mowing time (${round(plainHours)} h), so the order is planned at the pass plan`
    : `${label}: ${plan.passes} passes (${round(plan.hours)} h, within the plain mowing time)`;
  return { hours: plan.hours, passes: plan.passes, longer, note };
}

/** The cuts the rule asks for in the week, stepping from one cut (asked or kept) to the next. */
function askedCuts(ctx: FieldWeekContext, growth: number[], hocMm: number): AskedCut[] {
  const { field, weekStart, weekEnd, start, idx } = ctx;
  const first = ctx.first as string;
  const horizon = addDaysIso(weekEnd, 7);
  const mowOptions = { ...mowingPolicy(hocMm, ctx.std), mowingDays: ctx.input.workDays.length ? ctx.input.workDays : WEEKDAYS };
  const keptCuts = new Set(ctx.keptOf('mow').map((k) => k.plannedDate));
  const asked: AskedCut[] = [];
  // A last cut on or after Monday belongs to a later week than the one planned (planning
  // back in time): the week is planned as if the rule had been kept up to it.
  const lastCut = field.lastMowedOn && field.lastMowedOn < weekStart ? field.lastMowedOn : null;
  let cutIdx = lastCut ? idx(lastCut) : -1;
  if (cutIdx >= growth.length) cutIdx = growth.length - 1;
  if (cutIdx < 0 && idx(weekStart) > 0) {
    // No cut on record since the weather began: assume the field was mowed as the rule
    // asked until this week (a season run from the first day of weather), not overdue.
    // The run goes on past the week's start, as the season outlook's does, so a cut late in
    // the week before sees the weekend's growth exactly as the outlook's run saw it.
    const season = simulateMowing(hocMm, growth.slice(0, idx(horizon) + 1), hocMm, { ...mowOptions, startDate: first });
    const lastAssumed = season.mowings.filter((m) => m.dayIndex < idx(weekStart)).pop();
    cutIdx = lastAssumed ? lastAssumed.dayIndex : -1;
    ctx.warnings.push({ code: 'mowing_assumed', fieldId: field.id, date: field.lastMowedOn && !lastCut ? field.lastMowedOn : null });
  }
  for (let guard = 0; guard < 20; guard++) {
    const from = Math.max(0, cutIdx + 1);
    if (from > idx(weekEnd)) break;
    // A cut on day c leaves the grass at HOC that morning; day c's growth follows the cut.
    const startHeight = cutIdx >= 0 && cutIdx < growth.length ? hocMm + (growth[cutIdx] as number) : hocMm;
    const sim = simulateMowing(hocMm, growth.slice(from, idx(horizon) + 1), startHeight, { ...mowOptions, startDate: addDaysIso(first, from), daysSinceCutAtStart: from - cutIdx - 1 });
    const next = sim.mowings[0];
    const nextKept = [...keptCuts].filter((d) => idx(d) >= from).sort()[0];
    if (nextKept && (!next || nextKept <= next.date)) {
      cutIdx = idx(nextKept);
      continue;
    }
    if (!next || next.date > weekEnd) break;
    if (next.date < start) {
      // The rule asked for a cut before now and none is on record: mow first thing.
      asked.push({ date: start, heightMm: next.heightBeforeMm, reason: 'overdue', overdueSince: next.date });
      cutIdx = idx(start);
      continue;
    }
    asked.push({ date: next.date, heightMm: next.heightBeforeMm, reason: next.reason });
    cutIdx = next.dayIndex + from;
  }
  return asked;
}

/** The paint orders a kept or recorded order names a booking with (`details.eventId`). */
function eventIdOf(o: { details?: Record<string, unknown> | null }): number | null {
  const id = o.details?.eventId;
  return typeof id === 'number' ? id : null;
}

/**
 * The day lines go on for a booking: the last working day of the district before it, on or
 * after `start`; the booking's own day only when no earlier day is left (`onEventDay`).
 * Looks back at most a week: a booking after a longer break is painted on its last working day.
 */
export function paintDayFor(eventOn: string, start: string, workDays: readonly Weekday[]): { date: string; onEventDay: boolean } {
  const days = workDays.length ? workDays : WEEKDAYS;
  for (let k = 1; k <= 7; k++) {
    const d = addDaysIso(eventOn, -k);
    if (d < start) break;
    if (days.includes(weekdayOf(d))) return { date: d, onEventDay: false };
  }
  return { date: eventOn < start ? start : eventOn, onEventDay: true };
}

/** Lines: before bookings (once each), and every repaint interval while the turf grows. */
function lineOrders(ctx: FieldWeekContext, weekGp: number): void {
  const { field, std, level, planning, weekStart, weekEnd, start } = ctx;
  const template = std.lineRepaintDays === null ? null : defaultTemplateFor(field.sport);
  if (!template || std.lineRepaintDays === null) return;
  const lp = linePlan(template, ctx.params.lines, { days: 1, repaintDays: std.lineRepaintDays });
  // Every painting on record or planned: done, kept in this week, and planned in the weeks before.
  const earlier = (field.paints ?? []).filter((p) => p.date < weekStart);
  const keptPaints = ctx.keptOf('paint_lines');
  const painted = [field.lastPaintedOn, ...keptPaints.map((k) => k.plannedDate), ...earlier.map((p) => p.date)].filter((d): d is string => d !== null).sort();
  const servedEvents = new Set<number>([...keptPaints.map(eventIdOf), ...earlier.map((p) => p.eventId)].filter((id): id is number => id !== null));
  const lastPaintBefore = (d: string) => [...painted].reverse().find((p) => p <= d) ?? null;
  const firstCoatAfter = planning.firstCoatAfterDays ?? DEFAULT_PARAMETERS.planning.firstCoatAfterDays;
  const paintOn = (date: string, reason: string, window: { earliest: string; latest: string | null }, extra: Record<string, unknown>) => {
    // A first coat where no lines show any more (none on record, or grown out); else a touch-up.
    const before = [...painted].reverse().find((p) => p < date) ?? null;
    const first = before === null || isoToDayNumber(date) - isoToDayNumber(before) > firstCoatAfter;
    const coat = first ? lp.firstCoat : lp.touchUp;
    painted.push(date);
    painted.sort();
    ctx.orders.push({
      fieldId: field.id,
      siteId: field.siteId,
      task: 'paint_lines',
      askedDate: date,
      earliestDate: window.earliest,
      plannedHours: round(coat.hours),
      reason,
      details: { template: template.name, coat: first ? 'first' : 'touch_up', lineLengthM: round(lp.lineLengthM, 0), mixedL: round(coat.mixedLitres, 1), paintL: round(coat.concentrateLitres, 1), ...extra },
      latestDate: window.latest,
      flexible: true,
      equipmentKind: 'line_marker',
    });
  };
  const nextMonday = addDaysIso(weekStart, 7);
  const events = [...field.events].filter((e) => e.startsOn >= start && e.startsOn <= nextMonday).sort((a, b) => (a.startsOn < b.startsOn ? -1 : a.startsOn > b.startsOn ? 1 : a.id - b.id));
  for (const e of events) {
    if (servedEvents.has(e.id)) continue;
    const target = paintDayFor(e.startsOn, start, ctx.input.workDays);
    // Lines painted from the freshness window (or the target day, when the last working day is further back) up to the booking serve it.
    const freshFrom = addDaysIso(e.startsOn, -planning.paintFreshDays);
    const servedFrom = target.date < freshFrom ? target.date : freshFrom;
    const last = lastPaintBefore(e.startsOn);
    if (last && last >= servedFrom) continue;
    if (target.date > weekEnd) continue; // next Monday's booking is painted on this week's days only if in reach
    if (target.onEventDay) ctx.warnings.push({ code: 'paint_on_event_day', fieldId: field.id, date: e.startsOn, eventTitle: e.title });
    const earliest = target.onEventDay ? target.date : servedFrom < start ? start : servedFrom;
    paintOn(target.date, `Lines for ${e.title} on ${dayName(e.startsOn)} ${e.startsOn}${target.onEventDay ? ' (no working day left before it: painted on the day)' : ''}`, { earliest, latest: target.date }, { eventId: e.id, eventTitle: e.title, eventOn: e.startsOn });
    servedEvents.add(e.id);
  }
  if (weekGp >= planning.dormantGp) {
    const last = lastPaintBefore(weekEnd);
    const due = last ? addDaysIso(last, std.lineRepaintDays) : weekStart;
    if (due <= weekEnd) {
      const date = due < start ? start : due;
      paintOn(date, last ? `Repaint: level ${level} repaints every ${std.lineRepaintDays} days (last painted ${last})` : `No painting on record: level ${level} keeps lines`, { earliest: date, latest: null }, {});
    }
  }
}

/** Mean growth potential of each month of the planned year, over the days of weather on file (null: no day). */
function monthlyMeanGp(ctx: FieldWeekContext, daily: FieldDailySeries, year: number): (number | null)[] {
  const monthGp: (number | null)[] = new Array<number | null>(12).fill(null);
  const monthDays = new Array<number>(12).fill(0);
  ctx.weather.dates.forEach((d, i) => {
    if (Number(d.slice(0, 4)) !== year) return;
    const m = monthOf(d) - 1;
    monthGp[m] = (monthGp[m] ?? 0) + (daily.gp[i] as number);
    monthDays[m] = (monthDays[m] as number) + 1;
  });
  return monthGp.map((g, m) => (g === null ? null : g / (monthDays[m] as number)));
}

/** Feed: the plan's application in this week (or one missed in the last fortnight). */
function feedOrders(ctx: FieldWeekContext, daily: FieldDailySeries): void {
  const { field, params, planning, weekStart, weekEnd, start } = ctx;
  const year = Number(weekStart.slice(0, 4));
  const meanGp = monthlyMeanGp(ctx, daily, year);
  const irrigated = daily.share > 0;
  const annual = annualNitrogen({ grass: field.grass, level: ctx.level, clippings: field.clippings, irrigated }, ctx.standards);
  const product = params.fertiliserProduct;
  const apps = planNApplications(monthlyNSplitByGp(annual.gPerM2, meanGp), { slowReleaseShare: product.slowReleaseShare, year, params });
  const fedAfter = field.lastFedOn ? addDaysIso(field.lastFedOn, 14) : null;
  const app = apps.find((a) => a.date !== null && a.date >= addDaysIso(weekStart, -14) && a.date <= weekEnd && (fedAfter === null || a.date > fedAfter));
  if (!app || !app.date) return;
  const need = productForArea(app.nGPerM2, product, field.areaM2, params.fertiliserBagKg, params.costs.fertiliserPerKg);
  const spreader = planning.spreader;
  const hours = hoursPerMowing(field.areaM2, spreader) + spreader.setupMin / 60;
  const date = app.date < start ? start : app.date;
  ctx.orders.push({
    fieldId: field.id,
    siteId: field.siteId,
    task: 'feed',
    askedDate: date,
    plannedHours: round(hours),
    reason: `Feed plan: ${round(app.nGPerM2, 2)} g N/m² planned for ${app.date}${app.date < weekStart ? ' (not yet applied)' : ''}`,
    details: { nGPerM2: round(app.nGPerM2, 3), product: `${product.n}-${product.p}-${product.k}`, productKg: round(need.productKg, 1), bags: need.bags },
    earliestDate: start,
    latestDate: null,
    flexible: true,
    equipmentKind: 'spreader',
  });
}

/** Water: the week's gross need as run times on the allowed days. */
function irrigationOrders(ctx: FieldWeekContext, daily: FieldDailySeries): void {
  const { field, params, planning, dates, start, idx } = ctx;
  let etc = 0;
  let eff = 0;
  for (const d of dates) {
    const i = idx(d);
    if (i < 0 || i >= daily.etcMm.length) continue;
    etc += daily.etcMm[i] as number;
    eff += ctx.weather.effectiveRainMm[i] as number;
  }
  const week = weekIrrigation(etc, eff, daily.share, daily.du, planning.minIrrigationMm);
  if (!week.scheduled) return;
  const gross = week.grossMm;
  const kept = ctx.keptOf('irrigate');
  const irr = { ...DEFAULT_PARAMETERS.irrigation, ...params.irrigation };
  const schedule = weeklyIrrigationSchedule({ grossMmPerWeek: gross, precipRateMmPerH: irr.precipRateMmPerH, allowedDays: planning.wateringDays, maxRunMinPerCycle: irr.maxRunMinPerCycle, maxCyclesPerDay: irr.maxCyclesPerDay });
  const runs = schedule.days.map((d) => ({ day: d.day, date: dates[WEEK_FROM_MONDAY.indexOf(d.day)] as string, cycles: d.cycles, minutesPerCycle: round(d.minutesPerCycle, 0), totalMinutes: round(d.totalMinutes, 0) }));
  const base = { grossMm: round(gross, 1), volumeL: round(irrigationVolumeLitres(schedule.appliedMm, field.areaM2), 0), shortfallMm: round(schedule.shortfallMm, 1) };
  if (field.irrigation === 'automatic') {
    // A controller is set once for the week; a kept setting stands.
    if (kept.length > 0) return;
    const firstRun = runs.map((r) => r.date).filter((d) => d >= start).sort()[0] ?? start;
    ctx.orders.push({
      fieldId: field.id,
      siteId: field.siteId,
      task: 'irrigate',
      askedDate: start < firstRun ? start : firstRun,
      plannedHours: planning.controllerSetHours,
      reason: `Water budget: ${round(gross, 1)} mm gross this week; set the controller to the run times`,
      details: { ...base, system: 'automatic', runs },
      latestDate: firstRun,
      flexible: false,
      equipmentKind: null,
    });
    return;
  }
  const covered = coveredRuns(runs.filter((r) => r.totalMinutes > 0).map((r) => r.date), kept);
  for (const run of runs) {
    if (covered.has(run.date) || run.totalMinutes <= 0 || run.date < start) continue;
    ctx.orders.push({
      fieldId: field.id,
      siteId: field.siteId,
      task: 'irrigate',
      askedDate: run.date,
      plannedHours: planning.quickCouplerHoursPerDay,
      reason: `Water budget: ${round(gross / runs.length, 1)} mm on ${dayName(run.date)} (${run.cycles} × ${run.minutesPerCycle} min, cycle and soak)`,
      details: { ...base, system: 'quick_coupler', runOn: run.date, runTimeMin: run.totalMinutes, cycles: run.cycles, minutesPerCycle: run.minutesPerCycle },
      latestDate: run.date,
      flexible: false,
      equipmentKind: null,
    });
  }
}

/**
 * Cultural work: each task of the level's program that is due this week (`culturalDue`:
 * in its window, fewer done this season than the program asks, its share of the window
 * reached) while the turf grows enough to recover, on a working day that is not a booking
 * or the day before one (aeration holes, seed and sand want a day clear of play).
 */
function culturalOrders(ctx: FieldWeekContext, weekGp: number): void {
  const { field, level, planning, weekStart, weekEnd, start } = ctx;
  const settings = planning.cultural ?? DEFAULT_PARAMETERS.planning.cultural!;
  const programs = culturalProgramsOf(ctx.std);
  const season = grassSeason(field.grass);
  const workDays = ctx.input.workDays.length ? ctx.input.workDays : WEEKDAYS;
  for (const task of CULTURAL_TASKS) {
    const program = programs[task];
    const kept = ctx.keptOf(task).map((k) => k.plannedDate);
    // Kept in this week: planned or done already, never asked twice.
    if (kept.length > 0) continue;
    const doneDates = (field.culturalDone?.[task] ?? []).filter((d) => d < weekStart || d > weekEnd);
    const due = culturalDue({ program, season, weekStart, weekEnd, doneDates });
    if (!due.due) continue;
    const needsGp = task === 'aerate' || task === 'overseed' ? settings.activeGrowthGp : planning.dormantGp;
    if (weekGp < needsGp) {
      ctx.warnings.push({ code: 'cultural_waits_growth', fieldId: field.id, task, gp: round(weekGp, 2), needs: needsGp });
      continue;
    }
    // Turf work that leaves holes, seed or sand on the surface keeps clear of bookings; weed control follows the label's re-entry interval instead.
    const avoid = new Set<string>();
    if (task !== 'weed_control') {
      for (const e of field.events) for (let k = 0; k <= settings.clearDaysBeforeBooking; k++) avoid.add(addDaysIso(e.startsOn, -k));
    }
    const earliest = [start, due.nextFrom, due.from].sort().pop() as string;
    const latest = due.to < weekEnd ? due.to : weekEnd;
    const days = ctx.dates.filter((d) => d >= earliest && d <= latest && workDays.includes(weekdayOf(d)) && !avoid.has(d));
    if (days.length === 0) {
      ctx.warnings.push({ code: 'cultural_no_day', fieldId: field.id, task });
      continue;
    }
    const share = task === 'overseed' ? overseedShare(field.lastWear?.barePct, settings.defaultOverseedShare) : 1;
    const areaM2 = field.areaM2 * share;
    const machine = settings.machines[task];
    const hours = hoursPerMowing(areaM2, machine) + machine.setupMin / 60;
    const nth = due.done + 1;
    const method = task === 'aerate' ? (program.method ?? 'core') : null;
    const what = method ? `${AERATION_METHOD_LABELS[method].toLowerCase()} aeration` : CULTURAL_TASK_WORDS[task];
    const wear =
      task === 'overseed'
        ? field.lastWear && field.lastWear.barePct > 0
          ? `; worn areas${field.lastWear.areas.length ? ` (${field.lastWear.areas.map((a) => a.replace(/_/g, ' ')).join(', ')})` : ''}: ${round(field.lastWear.barePct, 0)} % bare at the check of ${field.lastWear.checkedOn}`
          : `; goalmouths and centre, about ${round(settings.defaultOverseedShare * 100, 0)} % of the field (no bare share on record)`
        : '';
    const clear = avoid.size > 0 ? '; not on a booking day or the day before' : '';
    ctx.orders.push({
      fieldId: field.id,
      siteId: field.siteId,
      task,
      askedDate: days[0] as string,
      earliestDate: days[0] as string,
      plannedHours: round(hours),
      reason: `Level ${level} program: ${what} ${program.timesPerSeason}× a season in ${monthWindowWords(program[season])}; this is ${nth} of ${program.timesPerSeason} (${due.done} done)${wear}${clear}`,
      details: { nth, of: program.timesPerSeason, windowFrom: due.from, windowTo: due.to, areaM2: round(areaM2, 0), share: round(share, 3), weekGp: round(weekGp, 2), ...(method ? { method } : {}) },
      latestDate: latest,
      flexible: true,
      equipmentKind: null,
      ...(avoid.size > 0 ? { avoidDates: [...avoid].sort() } : {}),
    });
  }
}

/**
 * The watering runs that kept irrigation orders already stand for. An order names its run
 * (`details.runOn`): a crew that does not work the run's day does it on its working day
 * before, so the order's date is not the run's. An order without the name stands for the run
 * on its date, else the first run after it not yet covered (the scheduler only moves a run
 * earlier), else the last one before it.
 */
export function coveredRuns(runDates: readonly string[], kept: readonly Pick<KeptOrder, 'plannedDate' | 'details'>[]): Set<string> {
  const covered = new Set<string>();
  const runs = [...runDates].sort();
  const rest: typeof kept[number][] = [];
  for (const k of kept) {
    const named = k.details?.runOn;
    if (typeof named === 'string' && runs.includes(named) && !covered.has(named)) covered.add(named);
    else rest.push(k);
  }
  for (const k of [...rest].sort((a, b) => (a.plannedDate < b.plannedDate ? -1 : a.plannedDate > b.plannedDate ? 1 : 0))) {
    const run = runs.find((d) => d === k.plannedDate && !covered.has(d)) ?? runs.find((d) => d > k.plannedDate && !covered.has(d)) ?? [...runs].reverse().find((d) => d < k.plannedDate && !covered.has(d));
    if (run) covered.add(run);
  }
  return covered;
}

/** Field check by the level's frequency. */
function fieldCheckOrders(ctx: FieldWeekContext): void {
  const { field, std, weekStart, weekEnd, start } = ctx;
  if (ctx.keptOf('field_check').length > 0) return;
  const due = field.lastCheckedOn ? addDaysIso(field.lastCheckedOn, std.fieldCheckDays) : weekStart;
  if (due > weekEnd) return;
  const date = due < start ? start : due;
  ctx.orders.push({
    fieldId: field.id,
    siteId: field.siteId,
    task: 'field_check',
    askedDate: date,
    earliestDate: start,
    plannedHours: ctx.planning.fieldCheckHours,
    reason: field.lastCheckedOn ? `Level ${ctx.level} checks every ${std.fieldCheckDays} days (last ${field.lastCheckedOn})` : 'No field check on record',
    details: {},
    // A check falling due in the week is done by then; one already late goes on a day with room before the week ends.
    latestDate: due > start ? due : null,
    flexible: true,
    equipmentKind: null,
  });
}

// ---------------------------------------------------------------------------------------
// Crews: who does what, on which day, and the day's route.

export interface PlanCrewInput {
  id: number;
  hoursPerDay: number;
  workDays: readonly Weekday[];
}

export interface PlanEquipment {
  id: number;
  crewId: number | null;
  kind: 'mower' | 'line_marker' | 'spreader';
  /** For mowers: its kind and HOC range. */
  mowerKind?: 'reel' | 'rotary' | 'flail';
  hocMinMm?: number;
  hocMaxMm?: number;
}

export interface ScheduledOrder extends AskedOrder {
  plannedDate: string;
  crewId: number | null;
  equipmentId: number | null;
}

export interface AssignInput {
  weekStart: string;
  orders: readonly AskedOrder[];
  crews: readonly PlanCrewInput[];
  /** Hours already on each crew-day from kept orders: key `${crewId}|${date}`. */
  keptHours?: ReadonlyMap<string, number>;
  /** Crew-days cancelled (a rain-out), key `${crewId}|${date}`: no work goes on them. */
  closed?: ReadonlySet<string>;
  /** Sites of the kept orders on each crew-day (one entry per order), for the day's load/unload and drive. */
  keptSites?: ReadonlyMap<string, readonly number[]>;
  /** The crew that last worked each site (keeps sites with the crew that knows them). */
  siteCrewHint?: ReadonlyMap<number, number>;
  equipment?: readonly PlanEquipment[];
  sites: ReadonlyMap<number, LatLng>;
  yard: LatLng;
  travel: TravelSettings;
  /** First day work can still go on (today, when the week has begun). */
  notBefore?: string;
  /**
   * Where the last generation put the week's generated orders that are not kept (the plan the
   * foreman applied). Work with slack stays on its day and crew while that day is still in its
   * window and within the crew's hours, so generating again moves nothing whose inputs did not change.
   */
  previous?: ReadonlyArray<{ fieldId: number; task: WorkTask; plannedDate: string; crewId: number | null }>;
}

/**
 * Suggests a crew, a day and equipment for each asked order. Work tied to a day (mowing,
 * watering) keeps its site with one crew (the one that knows the site when it has room, else
 * the least loaded by share of its week), largest sites first, on the crew's latest working
 * day on or before its latest date, else the first after (noted). Work with slack (field
 * checks, feed, painting ahead of a booking) then goes, most urgent first, to the crew-day
 * in its window with the most room after it (work + load/unload + drive), within the crew's
 * hours where any day has room; the site's crew is preferred, a painting stays close to its
 * booking, and today takes only what is due today. Deterministic: ties break by date and id.
 */
export function assignWeek(input: AssignInput): { orders: ScheduledOrder[]; warnings: WeekWarning[] } {
  const week = weekDates(input.weekStart);
  const open = week.filter((d) => !input.notBefore || d >= input.notBefore);
  const dates = open.length ? open : week.slice(6);
  const warnings: WeekWarning[] = [];
  const crews = [...input.crews].filter((c) => c.workDays.length > 0).sort((a, b) => a.id - b.id);
  const closed = input.closed ?? new Set<string>();
  const crewOfSite = crewsForSites(input, crews, dates.filter((d) => crews.some((c) => !closed.has(`${c.id}|${d}`))));
  if (crews.length === 0 && input.orders.length > 0) warnings.push({ code: 'no_crew' });
  const openDay = (c: PlanCrewInput, d: string) => !closed.has(`${c.id}|${d}`);
  const spread = (o: AskedOrder) => o.flexible && crews.length > 0;
  const ledger = crewDayLedger(input);
  const fixed = input.orders.filter((o) => !spread(o)).map((o) => scheduleOrder(o, crewOfSite.get(o.siteId) ?? null, dates, warnings, openDay));
  const scheduled = placeFixed(fixed, crews, ledger, openDay);
  const lastOf = (o: AskedOrder) => o.latestDate ?? (dates[dates.length - 1] as string);
  const flexible = input.orders
    .filter(spread)
    .sort((a, b) => (lastOf(a) < lastOf(b) ? -1 : lastOf(a) > lastOf(b) ? 1 : 0) || b.plannedHours - a.plannedHours || a.siteId - b.siteId || a.fieldId - b.fieldId || (a.task < b.task ? -1 : a.task > b.task ? 1 : 0));
  const today = input.notBefore && dates[0] === input.notBefore ? input.notBefore : null;
  const previous = [...(input.previous ?? [])];
  for (const o of flexible) {
    const s =
      stayPut(o, previous, { crews, dates, ledger, open: openDay }) ??
      spreadOrder(o, { crews, dates, today, siteCrew: crewOfSite.get(o.siteId) ?? null, ledger, open: openDay }) ??
      scheduleOrder(o, crewOfSite.get(o.siteId) ?? null, dates, warnings, openDay);
    ledger.place(s);
    scheduled.push(s);
  }
  // A crew-day over its hours can only hold work due that day (nothing else had room): say so.
  for (const c of crews) {
    for (const d of dates) {
      const h = ledger.hoursOf(c.id, d);
      if (h > c.hoursPerDay + 1e-9 && scheduled.some((s) => s.crewId === c.id && s.plannedDate === d)) warnings.push({ code: 'crew_day_over', crewId: c.id, date: d, hours: round(h), available: c.hoursPerDay });
    }
  }
  for (const s of scheduled) s.equipmentId = suggestEquipment(s, input.equipment ?? []);
  scheduled.sort((a, b) => (a.plannedDate < b.plannedDate ? -1 : a.plannedDate > b.plannedDate ? 1 : a.siteId - b.siteId || a.fieldId - b.fieldId || (a.task < b.task ? -1 : a.task > b.task ? 1 : 0)));
  return { orders: scheduled, warnings: [...new Map(warnings.map((w) => [JSON.stringify(w), w])).values()] };
}

/**
 * Work tied to its day (mowing, watering) on the day the site's crew does it: the site's
 * orders of a day go together to the site's crew when they fit its hours (kept orders
 * counted), else together to the crew working that day with the most room they fit in, else
 * one by one; an order that fits no crew stays with the site's crew over its hours (it is due
 * that day). Larger site-days go first, so they stay whole.
 */
function placeFixed(fixed: readonly ScheduledOrder[], crews: readonly PlanCrewInput[], ledger: ReturnType<typeof crewDayLedger>, open: (c: PlanCrewInput, d: string) => boolean): ScheduledOrder[] {
  const groups = new Map<string, ScheduledOrder[]>();
  const out: ScheduledOrder[] = [];
  for (const s of fixed) {
    if (s.crewId === null) {
      out.push(s);
      continue;
    }
    const key = `${s.plannedDate}|${s.siteId}|${s.crewId}`;
    groups.set(key, [...(groups.get(key) ?? []), s]);
  }
  const sum = (list: readonly ScheduledOrder[]) => list.reduce((t, s) => t + s.plannedHours, 0);
  const ordered = [...groups.values()].sort((a, b) => {
    const x = a[0] as ScheduledOrder;
    const y = b[0] as ScheduledOrder;
    return (x.plannedDate < y.plannedDate ? -1 : x.plannedDate > y.plannedDate ? 1 : 0) || sum(b) - sum(a) || x.siteId - y.siteId || (x.crewId as number) - (y.crewId as number);
  });
  const crewById = new Map(crews.map((c) => [c.id, c]));
  /** The crew that takes `hours` at the site on the day within its hours: the site's crew first, else the one with the most room left. */
  const fitting = (own: number, date: string, siteId: number, hours: number): number | null => {
    const ownCrew = crewById.get(own);
    if (ownCrew && ledger.hoursWith(own, date, siteId, hours) <= ownCrew.hoursPerDay + 1e-9) return own;
    let best: { id: number; share: number } | null = null;
    for (const c of crews) {
      if (c.id === own || !c.workDays.includes(weekdayOf(date)) || !open(c, date)) continue;
      const after = ledger.hoursWith(c.id, date, siteId, hours);
      if (after > c.hoursPerDay + 1e-9) continue;
      const share = after / Math.max(1e-9, c.hoursPerDay);
      if (!best || share < best.share - 1e-9) best = { id: c.id, share };
    }
    return best?.id ?? null;
  };
  for (const list of ordered) {
    const first = list[0] as ScheduledOrder;
    const own = first.crewId as number;
    const whole = fitting(own, first.plannedDate, first.siteId, sum(list));
    const sorted = [...list].sort((a, b) => b.plannedHours - a.plannedHours || a.fieldId - b.fieldId || (a.task < b.task ? -1 : a.task > b.task ? 1 : 0));
    for (const s of sorted) {
      const crewId = whole ?? fitting(own, s.plannedDate, s.siteId, s.plannedHours) ?? own;
      const placed = { ...s, crewId };
      ledger.place(placed);
      out.push(placed);
    }
  }
  return out;
}

/** A crew that is not the site's own takes work only when it has clearly more room (share of a day). */
const OTHER_CREW_PENALTY = 0.15;
/** A painting moves earlier than the last working day before its booking only when that day is much fuller (share of a day per day earlier). */
const PAINT_EARLY_PENALTY = 0.3;

/**
 * The crew-day the last generation gave the same field's same task, when it is still open to
 * the order (in its window, not a day it avoids, the crew works it) and within the crew's
 * hours; the placement is used up so a second order of the task spreads on its own.
 */
function stayPut(
  o: AskedOrder,
  previous: Array<{ fieldId: number; task: WorkTask; plannedDate: string; crewId: number | null }>,
  env: { crews: readonly PlanCrewInput[]; dates: readonly string[]; ledger: ReturnType<typeof crewDayLedger>; open: (c: PlanCrewInput, d: string) => boolean },
): ScheduledOrder | null {
  const latest = o.latestDate ?? (env.dates[env.dates.length - 1] as string);
  const earliest = o.earliestDate && o.earliestDate > (env.dates[0] as string) ? o.earliestDate : (env.dates[0] as string);
  const k = previous.findIndex((p) => {
    if (p.fieldId !== o.fieldId || p.task !== o.task || p.crewId === null) return false;
    const d = p.plannedDate;
    if (d < earliest || d > latest || !env.dates.includes(d) || o.avoidDates?.includes(d)) return false;
    const c = env.crews.find((x) => x.id === p.crewId);
    return !!c && c.workDays.includes(weekdayOf(d)) && env.open(c, d) && env.ledger.hoursWith(c.id, d, o.siteId, o.plannedHours) <= c.hoursPerDay + 1e-9;
  });
  if (k < 0) return null;
  const [p] = previous.splice(k, 1);
  return { ...o, plannedDate: p!.plannedDate, crewId: p!.crewId, equipmentId: null };
}

/** The crew-day in the order's window with the most room after it; null when no crew works a day of the window. */
function spreadOrder(
  o: AskedOrder,
  env: { crews: readonly PlanCrewInput[]; dates: readonly string[]; today: string | null; siteCrew: PlanCrewInput | null; ledger: ReturnType<typeof crewDayLedger>; open: (c: PlanCrewInput, d: string) => boolean },
): ScheduledOrder | null {
  const latest = o.latestDate ?? (env.dates[env.dates.length - 1] as string);
  const earliest = o.earliestDate && o.earliestDate > (env.dates[0] as string) ? o.earliestDate : (env.dates[0] as string);
  const forEvent = o.task === 'paint_lines' && o.latestDate !== null;
  let best: { date: string; crewId: number; fits: boolean; notToday: boolean; score: number } | null = null;
  for (const date of env.dates) {
    if (date < earliest || date > latest || o.avoidDates?.includes(date)) continue;
    for (const c of env.crews) {
      if (!c.workDays.includes(weekdayOf(date)) || !env.open(c, date)) continue;
      const after = env.ledger.hoursWith(c.id, date, o.siteId, o.plannedHours);
      const share = after / Math.max(1e-9, c.hoursPerDay);
      const fits = after <= c.hoursPerDay + 1e-9;
      const notToday = date !== env.today || latest <= date;
      const score = share + (env.siteCrew && env.siteCrew.id !== c.id ? OTHER_CREW_PENALTY : 0) + (forEvent ? PAINT_EARLY_PENALTY * (isoToDayNumber(latest) - isoToDayNumber(date)) : 0);
      // Within hours first, then not today unless due today, then the most room.
      const better = !best || (fits !== best.fits ? fits : notToday !== best.notToday ? notToday : score < best.score - 1e-9);
      if (better) {
        best = { date, crewId: c.id, fits, notToday, score };
      }
    }
  }
  return best ? { ...o, plannedDate: best.date, crewId: best.crewId, equipmentId: null } : null;
}

/**
 * One crew per site, largest sites first: the crew that knows the site when it has room,
 * else the one whose week would be least full. Kept hours count as load from the start.
 */
function crewsForSites(input: AssignInput, crews: readonly PlanCrewInput[], dates: readonly string[]): Map<number, PlanCrewInput | null> {
  const bySite = new Map<number, AskedOrder[]>();
  for (const o of input.orders) {
    const list = bySite.get(o.siteId) ?? [];
    list.push(o);
    bySite.set(o.siteId, list);
  }
  const weekHours = (c: PlanCrewInput) => c.hoursPerDay * dates.filter((d) => c.workDays.includes(weekdayOf(d))).length;
  const load = new Map<number, number>(crews.map((c) => [c.id, 0]));
  for (const [key, h] of input.keptHours ?? []) {
    const id = Number(key.split('|')[0]);
    if (load.has(id)) load.set(id, (load.get(id) as number) + h);
  }
  const siteHours = (list: AskedOrder[]) => list.reduce((s, o) => s + o.plannedHours, 0) + input.travel.loadUnloadMin / 60;
  const sites = [...bySite.entries()].sort((a, b) => siteHours(b[1]) - siteHours(a[1]) || a[0] - b[0]);
  const crewOfSite = new Map<number, PlanCrewInput | null>();
  for (const [siteId, list] of sites) {
    const h = siteHours(list);
    const hint = input.siteCrewHint?.get(siteId);
    const hinted = crews.find((c) => c.id === hint);
    let chosen: PlanCrewInput | null = null;
    if (hinted && (load.get(hinted.id) as number) + h <= weekHours(hinted) + 1e-9) chosen = hinted;
    if (!chosen) {
      let bestShare = Infinity;
      for (const c of crews) {
        const share = ((load.get(c.id) as number) + h) / Math.max(1e-9, weekHours(c));
        if (share < bestShare - 1e-12) {
          chosen = c;
          bestShare = share;
        }
      }
    }
    crewOfSite.set(siteId, chosen);
    if (chosen) load.set(chosen.id, (load.get(chosen.id) as number) + h);
  }
  return crewOfSite;
}

/** The crew's latest working day in [asked, latest], else on or before latest, else the first after (noted as a missed due date). */
function scheduleOrder(o: AskedOrder, crew: PlanCrewInput | null, dates: readonly string[], warnings: WeekWarning[], open: (c: PlanCrewInput, d: string) => boolean = () => true): ScheduledOrder {
  let date = o.askedDate;
  if (crew) {
    const works = (d: string) => crew.workDays.includes(weekdayOf(d)) && open(crew, d);
    const latest = o.latestDate ?? o.askedDate;
    const onOrBefore = dates.filter((d) => d <= latest && d >= o.askedDate && works(d)).pop() ?? dates.filter((d) => d <= latest && works(d)).pop();
    const after = dates.find((d) => d > latest && works(d));
    date = onOrBefore ?? after ?? o.askedDate;
    if (!onOrBefore && after && o.latestDate) warnings.push({ code: 'due_date_missed', fieldId: o.fieldId, date: o.latestDate, task: o.task });
  }
  return { ...o, plannedDate: date, crewId: crew?.id ?? null, equipmentId: null };
}

/**
 * Each crew-day's hours as the board counts them (work + a load/unload per site + the drive
 * of its route), kept up to date as orders are placed, so each placement sees the days as
 * they stand after the ones before it. Kept orders count from the start.
 */
function crewDayLedger(input: AssignInput) {
  const unload = input.travel.loadUnloadMin / 60;
  const days = new Map<string, { hours: number; sites: Map<number, number>; drive: number }>();
  const dayOf = (crewId: number, date: string) => {
    const key = `${crewId}|${date}`;
    let d = days.get(key);
    if (!d) {
      d = { hours: input.keptHours?.get(key) ?? 0, sites: new Map(), drive: 0 };
      for (const siteId of input.keptSites?.get(key) ?? []) d.sites.set(siteId, (d.sites.get(siteId) ?? 0) + 1);
      d.drive = driveHours(d.sites);
      days.set(key, d);
    }
    return d;
  };
  const km = (a: LatLng, b: LatLng) => greatCircleKm(a, b) * input.travel.roadFactor;
  const driveHours = (sites: Map<number, number>) => {
    const stops = [...sites.keys()].sort((a, b) => a - b).flatMap((id) => {
      const p = input.sites.get(id);
      return p ? [{ id, lat: p.lat, lng: p.lng }] : [];
    });
    return stops.length ? planRoute(input.yard, stops, { roadFactor: input.travel.roadFactor, speedKmh: input.travel.speedKmh }).driveHours : 0;
  };
  const place = (s: ScheduledOrder) => {
    if (s.crewId === null) return;
    const d = dayOf(s.crewId, s.plannedDate);
    d.hours += s.plannedHours;
    const isNew = !d.sites.has(s.siteId);
    d.sites.set(s.siteId, (d.sites.get(s.siteId) ?? 0) + 1);
    if (isNew) d.drive = driveHours(d.sites);
  };
  /** The day's hours with one more order: a new site adds a load/unload and, at most, a detour from the nearest stop already on the route (or the yard) and back. */
  const hoursWith = (crewId: number, date: string, siteId: number, hours: number) => {
    const d = dayOf(crewId, date);
    if (d.sites.has(siteId)) return d.hours + hours + d.sites.size * unload + d.drive;
    const p = input.sites.get(siteId);
    let detourKm = 0;
    if (p) {
      detourKm = km(input.yard, p);
      for (const id of d.sites.keys()) {
        const q = input.sites.get(id);
        if (q) detourKm = Math.min(detourKm, km(q, p));
      }
    }
    return d.hours + hours + (d.sites.size + 1) * unload + d.drive + (2 * detourKm) / input.travel.speedKmh;
  };
  /** The day's hours as they stand (work, load/unload, drive). */
  const hoursOf = (crewId: number, date: string) => {
    const d = dayOf(crewId, date);
    return d.hours + d.sites.size * unload + d.drive;
  };
  return { place, hoursWith, hoursOf };
}

/** Equipment: the crew's own unit of the kind first, then the district pool; a mower must fit the kind and HOC asked. */
function suggestEquipment(s: ScheduledOrder, equipment: readonly PlanEquipment[]): number | null {
  if (!s.equipmentKind) return s.equipmentId;
  const hoc = typeof s.details.hocMm === 'number' ? s.details.hocMm : null;
  const kind = s.details.mowerKind;
  const candidates = equipment.filter(
    (e) => e.kind === s.equipmentKind && (e.kind !== 'mower' || ((kind === undefined || e.mowerKind === kind) && (hoc === null || ((e.hocMinMm ?? 0) <= hoc + 1e-9 && (e.hocMaxMm ?? Infinity) >= hoc - 1e-9)))),
  );
  const own = candidates.filter((e) => e.crewId === s.crewId && s.crewId !== null).sort((a, b) => a.id - b.id)[0];
  const pool = candidates.filter((e) => e.crewId === null).sort((a, b) => a.id - b.id)[0];
  return (own ?? pool)?.id ?? null;
}

/** One crew-day as the board shows it. */
export interface CrewDayLoad {
  crewId: number;
  date: string;
  availableHours: number;
  workHours: number;
  driveKm: number;
  driveHours: number;
  loadUnloadHours: number;
  totalHours: number;
  overloaded: boolean;
  /** Site ids in route order from the yard. */
  route: number[];
  orderIds: number[];
}

/**
 * Each crew-day's load: work hours + drive (yard → sites → yard, `planRoute`) + a
 * load/unload per site, against the crew's hours that day (0 on a day off).
 */
export function crewDayLoads(
  /** `siteId` null: a yard job (sharpening), worked at the yard: its hours count, it adds no stop. */
  orders: ReadonlyArray<{ id: number; crewId: number | null; plannedDate: string; siteId: number | null; plannedHours: number; status?: WorkStatus }>,
  crews: readonly PlanCrewInput[],
  sites: ReadonlyMap<number, LatLng>,
  yard: LatLng,
  travel: TravelSettings,
  weekStart: string,
): CrewDayLoad[] {
  const dates = weekDates(weekStart);
  const out: CrewDayLoad[] = [];
  const groups = new Map<string, typeof orders[number][]>();
  for (const o of orders) {
    if (o.crewId === null || o.status === 'skipped') continue;
    const key = `${o.crewId}|${o.plannedDate}`;
    const list = groups.get(key) ?? [];
    list.push(o);
    groups.set(key, list);
  }
  for (const crew of [...crews].sort((a, b) => a.id - b.id)) {
    for (const date of dates) {
      const list = groups.get(`${crew.id}|${date}`) ?? [];
      const siteIds = [...new Set(list.flatMap((o) => (o.siteId === null ? [] : [o.siteId])))].sort((a, b) => a - b);
      const stops = siteIds.flatMap((id) => {
        const p = sites.get(id);
        return p ? [{ id, lat: p.lat, lng: p.lng }] : [];
      });
      const route = planRoute(yard, stops, { roadFactor: travel.roadFactor, speedKmh: travel.speedKmh });
      const workHours = list.reduce((s, o) => s + o.plannedHours, 0);
      const loadUnloadHours = (siteIds.length * travel.loadUnloadMin) / 60;
      const availableHours = crew.workDays.includes(weekdayOf(date)) ? crew.hoursPerDay : 0;
      const totalHours = workHours + route.driveHours + loadUnloadHours;
      const rank = new Map(route.order.map((id, i) => [Number(id), i]));
      out.push({
        crewId: crew.id,
        date,
        availableHours,
        workHours: round(workHours),
        driveKm: round(route.totalKm, 1),
        driveHours: round(route.driveHours),
        loadUnloadHours: round(loadUnloadHours),
        totalHours: round(totalHours),
        overloaded: list.length > 0 && totalHours > availableHours + 1e-9,
        route: route.order.map(Number),
        // Yard jobs first: they are done before the crew leaves the yard.
        orderIds: [...list].sort((a, b) => (a.siteId === null ? -1 : (rank.get(a.siteId) ?? 0)) - (b.siteId === null ? -1 : (rank.get(b.siteId) ?? 0)) || a.id - b.id).map((o) => o.id),
      });
    }
  }
  return out;
}

// ---------------------------------------------------------------------------------------
// Re-generation: what stays, what goes, what changes.

/** An order of the week as it stands. */
export interface ExistingOrder {
  id: number;
  fieldId: number;
  task: WorkTask;
  plannedDate: string;
  plannedHours: number;
  crewId: number | null;
  equipmentId: number | null;
  status: WorkStatus;
  origin: 'generated' | 'manual';
  pinned: boolean;
  reason: string;
}

/** True when re-generating must leave the order as it is. */
export function isKept(o: Pick<ExistingOrder, 'pinned' | 'origin' | 'status'>): boolean {
  return o.pinned || o.origin === 'manual' || o.status === 'started' || o.status === 'done' || o.status === 'skipped';
}

export interface WeekReconciliation<E extends ExistingOrder, P> {
  insert: P[];
  update: Array<{ id: number; next: P; what: string[]; before: E }>;
  remove: E[];
  kept: E[];
  unchanged: E[];
}

/**
 * Matches a new plan against the week's orders: kept orders stay; the others are matched to
 * the new plan by field and task in date order — same day, hours and crew: unchanged; else
 * updated (with what changed); unmatched old ones are removed and new ones inserted.
 */
export function reconcileWeek<E extends ExistingOrder, P extends Pick<ScheduledOrder, 'fieldId' | 'task' | 'plannedDate' | 'plannedHours' | 'crewId' | 'equipmentId'>>(existing: readonly E[], plan: readonly P[]): WeekReconciliation<E, P> {
  const kept = existing.filter(isKept);
  const open = existing.filter((o) => !isKept(o));
  const key = (o: { fieldId: number; task: string }) => `${o.fieldId}|${o.task}`;
  const byKey = new Map<string, E[]>();
  for (const o of [...open].sort((a, b) => (a.plannedDate < b.plannedDate ? -1 : a.plannedDate > b.plannedDate ? 1 : a.id - b.id))) {
    const list = byKey.get(key(o)) ?? [];
    list.push(o);
    byKey.set(key(o), list);
  }
  const out: WeekReconciliation<E, P> = { insert: [], update: [], remove: [], kept, unchanged: [] };
  const sortedPlan = [...plan].sort((a, b) => (a.plannedDate < b.plannedDate ? -1 : a.plannedDate > b.plannedDate ? 1 : 0));
  for (const p of sortedPlan) {
    const list = byKey.get(key(p));
    const before = list?.shift();
    if (!before) {
      out.insert.push(p);
      continue;
    }
    const what: string[] = [];
    if (before.plannedDate !== p.plannedDate) what.push('date');
    if (Math.abs(before.plannedHours - p.plannedHours) > 0.005) what.push('hours');
    if (before.crewId !== p.crewId) what.push('crew');
    if (before.equipmentId !== p.equipmentId) what.push('equipment');
    if (what.length) out.update.push({ id: before.id, next: p, what, before });
    else out.unchanged.push(before);
  }
  for (const list of byKey.values()) out.remove.push(...list);
  out.remove.sort((a, b) => a.id - b.id);
  return out;
}
