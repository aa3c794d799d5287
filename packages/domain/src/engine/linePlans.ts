/**
 * A field's line plan: layouts from the templates in lines.ts placed on the field's own frame
 * (x along the long axis, y across, metres; geometry.ts `fieldFrame`), each with its
 * dimensions inside the governing body's limits, its colour, offset and turn, and the whole
 * plan shifted a few metres each season to spread goalmouth wear. From it: the segments to
 * draw, the totals of line, paint, water and labour, the string-line set-out sheet and the
 * repaint schedule.
 */
import { addDaysIso, isoToDayNumber } from './dates.ts';
import { fail } from './check.ts';
import { coatPlan, LINE_LAYOUTS, type LineLayout, type LineSegment, type LineSettings, type LineTemplate, type PaintSettings, type Point } from './lines.ts';
import { ftToM } from './units.ts';

/** One dimension a layout may be given, with its allowed range and where the range comes from. */
export interface LayoutDimension {
  key: 'lengthM' | 'widthM';
  label: string;
  minM: number;
  maxM: number;
  defaultM: number;
  source: string;
}

const yd = ftToM(3);
const r2 = (v: number) => Math.round(v * 100) / 100;

/**
 * The dimensions each layout may be given, metres. A range with min = max is fixed by the
 * rules. Sources: IFAB Laws of the Game, Law 1 (soccer 90–120 × 45–90 m); the small-sided
 * ranges are the youth formats' usual sizes (from memory; the league's own rules govern);
 * NFHS football 360 × 160 ft; FIH field hockey 91.40 × 55.00 m; lacrosse 110 × 60 yd (from
 * memory); baseball foul lines of 320 ft or more preferred (Official Baseball Rules 2.01;
 * the template accepts 150–450 ft for youth and park diamonds, department choice);
 * softball 100–350 ft (from memory).
 */
export const LAYOUT_DIMENSIONS: Record<LineLayout, LayoutDimension[]> = {
  soccer_full: [
    { key: 'lengthM', label: 'Touchline', minM: 90, maxM: 120, defaultM: 105, source: 'IFAB Laws of the Game, Law 1' },
    { key: 'widthM', label: 'Goal line', minM: 45, maxM: 90, defaultM: 68, source: 'IFAB Laws of the Game, Law 1' },
  ],
  soccer_9v9: [
    { key: 'lengthM', label: 'Touchline', minM: r2(70 * yd), maxM: r2(80 * yd), defaultM: 73, source: 'youth 9v9, 70–80 yd (from memory; league rules govern)' },
    { key: 'widthM', label: 'Goal line', minM: r2(45 * yd), maxM: r2(55 * yd), defaultM: 46, source: 'youth 9v9, 45–55 yd (from memory; league rules govern)' },
  ],
  soccer_7v7: [
    { key: 'lengthM', label: 'Touchline', minM: r2(55 * yd), maxM: r2(65 * yd), defaultM: 55, source: 'youth 7v7, 55–65 yd (from memory; league rules govern)' },
    { key: 'widthM', label: 'Goal line', minM: r2(35 * yd), maxM: r2(45 * yd), defaultM: 36, source: 'youth 7v7, 35–45 yd (from memory; league rules govern)' },
  ],
  football: [
    { key: 'lengthM', label: 'Sideline (with end zones)', minM: r2(ftToM(360)), maxM: r2(ftToM(360)), defaultM: r2(ftToM(360)), source: 'NFHS, 360 ft (secondary sources)' },
    { key: 'widthM', label: 'End line', minM: r2(ftToM(160)), maxM: r2(ftToM(160)), defaultM: r2(ftToM(160)), source: 'NFHS, 160 ft (secondary sources)' },
  ],
  lacrosse: [
    { key: 'lengthM', label: 'Sideline', minM: r2(110 * yd), maxM: r2(110 * yd), defaultM: r2(110 * yd), source: '110 yd (from memory)' },
    { key: 'widthM', label: 'End line', minM: r2(60 * yd), maxM: r2(60 * yd), defaultM: r2(60 * yd), source: '60 yd (from memory)' },
  ],
  field_hockey: [
    { key: 'lengthM', label: 'Sideline', minM: 91.4, maxM: 91.4, defaultM: 91.4, source: 'FIH Rules of Hockey' },
    { key: 'widthM', label: 'Backline', minM: 55, maxM: 55, defaultM: 55, source: 'FIH Rules of Hockey' },
  ],
  baseball: [{ key: 'lengthM', label: 'Foul line', minM: r2(ftToM(150)), maxM: r2(ftToM(450)), defaultM: r2(ftToM(325)), source: 'Official Baseball Rules 2.01 (320 ft or more preferred); shorter for youth diamonds, department choice' }],
  softball: [{ key: 'lengthM', label: 'Foul line', minM: r2(ftToM(100)), maxM: r2(ftToM(350)), defaultM: r2(ftToM(200)), source: 'from memory' }],
};

/** Diamonds are laid out from home plate along the foul lines; the rest are rectangles. */
export function isDiamond(layout: LineLayout): boolean {
  return layout === 'baseball' || layout === 'softball';
}

/** A layout's dimension outside its range, in words with the allowed range; null when fine. */
export function dimensionProblem(layout: LineLayout, key: 'lengthM' | 'widthM', value: number): string | null {
  const d = LAYOUT_DIMENSIONS[layout].find((x) => x.key === key);
  if (!d) return null;
  if (!Number.isFinite(value)) return `${d.label} must be a number of metres`;
  if (value >= d.minM - 1e-9 && value <= d.maxM + 1e-9) return null;
  return d.minM === d.maxM ? `${d.label} is fixed at ${d.minM} m (${d.source})` : `${d.label} must be between ${d.minM} and ${d.maxM} m (${d.source}); got ${value} m`;
}

/** The template of a layout at the given dimensions (metres); out-of-range sizes are refused with the range. */
export function layoutTemplate(layout: LineLayout, dims: { lengthM?: number | null; widthM?: number | null } = {}): LineTemplate {
  const spec = LAYOUT_DIMENSIONS[layout];
  if (!spec) fail('unknown_template', `unknown layout ${JSON.stringify(layout)}`);
  const value = (key: 'lengthM' | 'widthM') => {
    const d = spec.find((x) => x.key === key);
    const v = dims[key] ?? d?.defaultM ?? 0;
    const problem = dimensionProblem(layout, key, v);
    if (problem) fail('invalid_dimension', problem, { min: d?.minM, max: d?.maxM, value: v });
    return v;
  };
  const L = value('lengthM');
  const W = value('widthM');
  return LINE_LAYOUTS[layout].template({ lengthM: L, widthM: W });
}

/** One layout of a plan as saved: the template, its size, colour and place on the field. */
export interface PlanLayout {
  layout: LineLayout;
  lengthM: number | null;
  widthM: number | null;
  /** Paint colour, #rrggbb. */
  colour: string;
  /** The layout's centre from the field's centre, metres along the long axis and across it. */
  alongM: number;
  acrossM: number;
  /** Turn of the layout on the field, degrees counter-clockwise in the plan view (90: across the field). */
  rotationDeg: number;
}

/** The whole plan's shift for one season, metres; a few metres each season spreads goalmouth wear. */
export interface SeasonShift {
  alongM: number;
  acrossM: number;
}

/** Largest seasonal shift either way, m: "a few metres" (common practice). */
export const MAX_SEASON_SHIFT_M = 5;

/** A placement: template frame → field frame. */
export interface Placement {
  /** Field-frame point of a template point. */
  at: (p: Point) => [number, number];
  rotationRad: number;
}

/** Template-frame box the layout is centred on: the playing rectangle, or a diamond's painted lines. */
function templateBox(t: LineTemplate, diamond: boolean): { minX: number; minY: number; maxX: number; maxY: number } {
  if (!diamond) return { minX: 0, minY: 0, maxX: t.lengthM, maxY: t.widthM };
  const xs: number[] = [];
  const ys: number[] = [];
  for (const s of t.segments) {
    if (s.kind !== 'line') continue;
    xs.push(s.from[0], s.to[0]);
    ys.push(s.from[1], s.to[1]);
  }
  return { minX: Math.min(...xs), minY: Math.min(...ys), maxX: Math.max(...xs), maxY: Math.max(...ys) };
}

/**
 * Where a layout sits on a field of `fieldLengthM` × `fieldWidthM` (its frame): the template's
 * box centred on the field's centre, turned by `rotationDeg`, moved by the layout's offset and
 * the season's shift.
 */
export function placement(t: LineTemplate, l: Pick<PlanLayout, 'layout' | 'alongM' | 'acrossM' | 'rotationDeg'>, field: { lengthM: number; widthM: number }, shift: SeasonShift = { alongM: 0, acrossM: 0 }): Placement {
  const box = templateBox(t, isDiamond(l.layout));
  const cx = (box.minX + box.maxX) / 2;
  const cy = (box.minY + box.maxY) / 2;
  const a = (l.rotationDeg * Math.PI) / 180;
  const c = Math.cos(a);
  const s = Math.sin(a);
  const ox = field.lengthM / 2 + l.alongM + shift.alongM;
  const oy = field.widthM / 2 + l.acrossM + shift.acrossM;
  return {
    rotationRad: a,
    at: ([x, y]) => {
      const dx = x - cx;
      const dy = y - cy;
      return [ox + dx * c - dy * s, oy + dx * s + dy * c];
    },
  };
}

/** The template's segments in the field's frame. */
export function placedSegments(t: LineTemplate, p: Placement): LineSegment[] {
  return t.segments.map((s) =>
    s.kind === 'line' ? { ...s, from: p.at(s.from), to: p.at(s.to) } : { ...s, center: p.at(s.center), startRad: s.startRad + p.rotationRad, endRad: s.endRad + p.rotationRad },
  );
}

/** One point of the set-out sheet. */
export interface SetOutPoint {
  name: string;
  /** From the reference corner along the layout's length and across it, m. */
  alongM: number;
  acrossM: number;
  /** In the field's frame (x along the field's long axis, y across), m. */
  fieldX: number;
  fieldY: number;
}

/** A check of squareness the crew measures with a tape: two distances that must agree. */
export interface SetOutCheck {
  label: string;
  /** Between which named points. */
  between: [string, string];
  /** What it should measure, m. */
  expectedM: number;
}

export interface SetOutSheet {
  reference: string;
  points: SetOutPoint[];
  checks: SetOutCheck[];
}

/** Labels whose ends and centres a crew pegs out; hash marks, numerals and dashes follow from them. */
const KEY_LINES = new Set(['halfway line', 'goal area', 'penalty area', 'midline', 'restraining line', 'wing line', 'goal line', 'yard line', 'centre line', '23 m line', 'shooting circle', 'first base foul line', 'third base foul line', "batter's box"]);
const KEY_CENTRES: Record<string, string> = { 'centre circle': 'centre spot', 'penalty arc': 'penalty mark', 'goal crease': 'crease centre' };

/**
 * The string-line set-out sheet of a placed layout: the reference corner (a rectangle's
 * corner at the start of its length; home plate on a diamond), the four corners and the ends
 * of the key lines, each as (along, across) distances from the reference and as field-frame
 * coordinates; and the tape checks that the rectangle closes: equal diagonals (√(L² + W²))
 * and a 3-4-5 triangle scaled ×3 at the reference corner (9 m along, 12 m across, 15 m
 * between: Pythagoras; common practice). A diamond's check is the distance between the foul
 * lines' ends, f√2 for a right angle at home plate.
 */
export function setOutSheet(t: LineTemplate, l: Pick<PlanLayout, 'layout'>, p: Placement): SetOutSheet {
  const points: SetOutPoint[] = [];
  const seen = new Set<string>();
  const add = (name: string, q: Point): boolean => {
    const key = `${q[0].toFixed(2)},${q[1].toFixed(2)}`;
    if (seen.has(key)) return false;
    seen.add(key);
    const [fx, fy] = p.at(q);
    points.push({ name, alongM: q[0], acrossM: q[1], fieldX: fx, fieldY: fy });
    return true;
  };
  const diamond = isDiamond(l.layout);
  const checks: SetOutCheck[] = [];
  if (diamond) {
    add('Home plate (reference)', [0, 0]);
    const first = t.segments.find((s) => s.kind === 'line' && s.label === 'first base foul line');
    const third = t.segments.find((s) => s.kind === 'line' && s.label === 'third base foul line');
    if (first?.kind === 'line' && third?.kind === 'line') {
      add('First base foul pole', first.to);
      add('Third base foul pole', third.to);
      checks.push({ label: 'Foul poles apart (right angle at home plate)', between: ['First base foul pole', 'Third base foul pole'], expectedM: Math.hypot(first.to[0] - third.to[0], first.to[1] - third.to[1]) });
    }
  } else {
    const L = t.lengthM;
    const W = t.widthM;
    add('Corner A (reference)', [0, 0]);
    add('Corner B', [L, 0]);
    add('Corner C', [L, W]);
    add('Corner D', [0, W]);
    add('3-4-5 mark along (9 m)', [9, 0]);
    add('3-4-5 mark across (12 m)', [0, 12]);
    const diag = Math.hypot(L, W);
    checks.push({ label: 'Diagonal A–C', between: ['Corner A (reference)', 'Corner C'], expectedM: diag });
    checks.push({ label: 'Diagonal B–D (equal to A–C when square)', between: ['Corner B', 'Corner D'], expectedM: diag });
    checks.push({ label: '3-4-5 ×3 at corner A', between: ['3-4-5 mark along (9 m)', '3-4-5 mark across (12 m)'], expectedM: 15 });
  }
  const counts = new Map<string, number>();
  for (const s of t.segments) {
    if (s.kind === 'line' && KEY_LINES.has(s.label)) {
      for (const q of [s.from, s.to]) {
        const n = (counts.get(s.label) ?? 0) + 1;
        if (add(`${s.label[0]!.toUpperCase()}${s.label.slice(1)} ${n}`, q)) counts.set(s.label, n);
      }
    } else if (s.kind === 'arc' && KEY_CENTRES[s.label]) {
      const name = KEY_CENTRES[s.label]!;
      const n = (counts.get(name) ?? 0) + 1;
      if (add(`${name[0]!.toUpperCase()}${name.slice(1)} ${n}`, s.center)) counts.set(name, n);
    }
  }
  return { reference: diamond ? 'Home plate apex; along = towards second base' : 'Corner A: the start of the touchline/sideline; along = the length, across = the width', points, checks };
}

/** The paint choices of a plan: dilution, coats and passes, the marker's speed. */
export interface PlanPaint {
  /** Parts water per part concentrate (1:1 to 4:1 common practice). */
  dilutionWaterPerPaint: number;
  /** Coats of one painting. */
  coats: number;
  /** Marker passes per coat (two directions is common practice). */
  passes: number;
}

/**
 * A coat at the plan's dilution and passes: the department's first coat's coverage of
 * finished line is for its own passes, so one pass covers `passes` times as much and the
 * plan's coat covers that ÷ its passes.
 */
export function planCoat(settings: LineSettings, paint: PlanPaint): PaintSettings {
  const perPass = settings.firstCoat.coverageM2PerMixedL * settings.firstCoat.passes;
  return { coverageM2PerMixedL: perPass / paint.passes, dilutionWaterPerPaint: paint.dilutionWaterPerPaint, passes: paint.passes };
}

/** Totals of one layout (or of the plan) for one painting. */
export interface LineTotals {
  lineLengthM: number;
  paintedAreaM2: number;
  mixedLitres: number;
  concentrateLitres: number;
  waterLitres: number;
  /** Marking time, h (all coats and passes, set-up once per layout). */
  hours: number;
}

/** One painting of a layout: `coats` coats at the plan's dilution and passes with the marker. */
export function layoutTotals(t: LineTemplate, settings: LineSettings, paint: PlanPaint, markerSpeedKmh: number): LineTotals {
  const coat = coatPlan(t, planCoat(settings, paint), { markerSpeedKmh, setupMin: 0 });
  return {
    lineLengthM: coat.lineLengthM,
    paintedAreaM2: coat.paintedAreaM2,
    mixedLitres: coat.mixedLitres * paint.coats,
    concentrateLitres: coat.concentrateLitres * paint.coats,
    waterLitres: coat.waterLitres * paint.coats,
    hours: coat.hours * paint.coats + settings.setupMin / 60,
  };
}

/** Sum of totals. */
export function addTotals(list: LineTotals[]): LineTotals {
  const z: LineTotals = { lineLengthM: 0, paintedAreaM2: 0, mixedLitres: 0, concentrateLitres: 0, waterLitres: 0, hours: 0 };
  for (const t of list) for (const k of Object.keys(z) as Array<keyof LineTotals>) z[k] += t[k];
  return z;
}

/** One painting in the season's schedule. */
export interface RepaintDate {
  date: string;
  reason: 'season start' | 'level' | 'event';
  note: string;
}

/**
 * The season's paintings: the full layout at the season start, a repaint every
 * `intervalDays` of the field's maintenance level (Standards), and one the day before each
 * event that a level repaint in the 2 days before it does not already cover (common practice).
 */
export function repaintSchedule(startIso: string, endIso: string, intervalDays: number | null, events: ReadonlyArray<{ date: string; title: string }>): RepaintDate[] {
  const end = isoToDayNumber(endIso);
  if (end < isoToDayNumber(startIso)) fail('invalid_duration', 'the season must end on or after its start');
  const out: RepaintDate[] = [{ date: startIso, reason: 'season start', note: 'All layouts painted afresh' }];
  if (intervalDays !== null && intervalDays > 0) {
    for (let d = addDaysIso(startIso, intervalDays); isoToDayNumber(d) <= end; d = addDaysIso(d, intervalDays)) out.push({ date: d, reason: 'level', note: `Every ${intervalDays} days (Standards)` });
  }
  for (const e of events) {
    const day = isoToDayNumber(e.date);
    if (day <= isoToDayNumber(startIso) || day > end) continue;
    const covered = out.some((r) => {
      const rd = isoToDayNumber(r.date);
      return rd < day && rd >= day - 2;
    });
    if (!covered) out.push({ date: addDaysIso(e.date, -1), reason: 'event', note: `Before ${e.title}` });
  }
  return out.sort((a, b) => a.date.localeCompare(b.date));
}

/** Default colours of a plan's layouts, in order (white first; the others for secondary layouts). */
export const LINE_COLOURS = ['#ffffff', '#f2c200', '#1f6fd1', '#d1341f', '#7a3fb8', '#111111'] as const;

/** Layout names for lists. */
export function layoutName(layout: LineLayout): string {
  return LINE_LAYOUTS[layout].name;
}

/** One layout of a plan with everything worked out for a season. */
export interface PlacedLayout {
  index: number;
  layout: LineLayout;
  name: string;
  source: string;
  colour: string;
  template: LineTemplate;
  segments: LineSegment[];
  sheet: SetOutSheet;
  totals: LineTotals;
  /** True when a corner of the layout's box lies outside the field's enclosing rectangle. */
  overhangs: boolean;
}

export interface LinePlanFigures {
  season: string;
  shift: SeasonShift;
  layouts: PlacedLayout[];
  /** One painting of every layout (the season's first). */
  totals: LineTotals;
  schedule: RepaintDate[];
  /** One touch-up of every layout (the department's touch-up coat, one coat). */
  touchUp: LineTotals;
  /** First painting + touch-ups on the other dates of the schedule. */
  seasonTotals: LineTotals;
}

/**
 * Everything a line plan works out for `season` (a year) on a field of the given frame size:
 * each layout placed with the season's shift, its segments, set-out sheet and totals; one
 * painting of the plan; the repaint schedule from the level's interval and the events in the
 * season window; the season's totals (the first painting, then touch-ups).
 */
export function linePlanFigures(
  plan: { layouts: PlanLayout[]; paint: PlanPaint; seasonStart: string; seasonEnd: string; shifts: Record<string, SeasonShift> },
  field: { lengthM: number; widthM: number },
  season: string,
  settings: LineSettings,
  markerSpeedKmh: number,
  repaintDays: number | null,
  events: ReadonlyArray<{ date: string; title: string }>,
): LinePlanFigures {
  const shift = plan.shifts[season] ?? { alongM: 0, acrossM: 0 };
  const touchPaint: PlanPaint = { dilutionWaterPerPaint: settings.touchUp.dilutionWaterPerPaint, coats: 1, passes: settings.touchUp.passes };
  const layouts = plan.layouts.map((l, index): PlacedLayout & { touch: LineTotals } => {
    const template = layoutTemplate(l.layout, l);
    const p = placement(template, l, field, shift);
    const box = templateBox(template, isDiamond(l.layout));
    const corners = [p.at([box.minX, box.minY]), p.at([box.maxX, box.minY]), p.at([box.maxX, box.maxY]), p.at([box.minX, box.maxY])];
    const tol = 0.01;
    return {
      index,
      layout: l.layout,
      name: template.name,
      source: template.source,
      colour: l.colour,
      template,
      segments: placedSegments(template, p),
      sheet: setOutSheet(template, l, p),
      totals: layoutTotals(template, settings, plan.paint, markerSpeedKmh),
      touch: layoutTotals(template, { ...settings, firstCoat: settings.touchUp }, touchPaint, markerSpeedKmh),
      overhangs: corners.some(([x, y]) => x < -tol || y < -tol || x > field.lengthM + tol || y > field.widthM + tol),
    };
  });
  const year = Number(season);
  const start = `${season}-${plan.seasonStart}`;
  const endYear = plan.seasonEnd < plan.seasonStart ? year + 1 : year;
  const end = `${endYear}-${plan.seasonEnd}`;
  const schedule = layouts.length ? repaintSchedule(start, end, repaintDays, events.filter((e) => e.date >= start && e.date <= end)) : [];
  const totals = addTotals(layouts.map((l) => l.totals));
  const touchUp = addTotals(layouts.map((l) => l.touch));
  const later = Math.max(0, schedule.length - 1);
  const seasonTotals = addTotals([schedule.length ? totals : addTotals([]), ...Array.from({ length: later }, () => touchUp)]);
  return { season, shift, layouts: layouts.map(({ touch: _touch, ...l }) => l), totals, schedule, touchUp, seasonTotals };
}
