/**
 * Line plan: layout templates per sport with the governing bodies' dimensions (or labelled
 * "from memory" / "common practice"), total line length, painted area, paint and water,
 * labour and repaints. Coordinates are metres in the field's own frame: x along the length
 * from one end line, y across from one side line.
 */
import type { Sport } from '../vocabulary.ts';
import { fail, requireNonNegative, requirePositive, requireRange } from './check.ts';
import { ftToM, mToFt } from './units.ts';

export type Point = readonly [number, number];

export type LineSegment =
  | { kind: 'line'; from: Point; to: Point; label: string; /** Painted width when not the template's line width (e.g. a numeral's stroke), m. */ widthM?: number }
  | { kind: 'arc'; center: Point; radiusM: number; startRad: number; endRad: number; label: string };

export interface LineTemplate {
  id: string;
  sport: Sport;
  name: string;
  /** Where the dimensions come from (governing body, or "from memory" / "common practice"). */
  source: string;
  lengthM: number;
  widthM: number;
  /** Line width, m. */
  lineWidthM: number;
  /** How far markings reach outside the field's frame (team areas, limit lines), m; 0 when none. */
  marginM?: number;
  segments: LineSegment[];
}

/** Length (m) of one segment: straight distance, or r × swept angle for an arc. */
export function segmentLengthM(s: LineSegment): number {
  if (s.kind === 'line') return Math.hypot(s.to[0] - s.from[0], s.to[1] - s.from[1]);
  return s.radiusM * Math.abs(s.endRad - s.startRad);
}

/** Total line length of a template, m. */
export function totalLineLengthM(t: Pick<LineTemplate, 'segments'>): number {
  return t.segments.reduce((s, seg) => s + segmentLengthM(seg), 0);
}

/** Painted area of one segment, m²: its length × its own width, else the template's line width. */
export function segmentPaintedAreaM2(s: LineSegment, lineWidthM: number): number {
  return segmentLengthM(s) * (s.kind === 'line' && s.widthM !== undefined ? s.widthM : lineWidthM);
}

/** Painted area of a template, m². */
export function templatePaintedAreaM2(t: Pick<LineTemplate, 'segments' | 'lineWidthM'>): number {
  return t.segments.reduce((s, seg) => s + segmentPaintedAreaM2(seg, t.lineWidthM), 0);
}

/** One element of a layout (all segments with one label) and what it adds to a repaint. */
export interface LineElement {
  label: string;
  /** Pieces painted (lines, arcs, marks or numeral strokes). */
  count: number;
  lengthM: number;
  paintedAreaM2: number;
  /** Length of template-width line that takes the same paint (painted area ÷ line width), m. */
  equivalentLengthM: number;
}

/** What each total of a layout includes: its elements in the order they are drawn. */
export function lineElements(t: Pick<LineTemplate, 'segments' | 'lineWidthM'>): LineElement[] {
  const out = new Map<string, LineElement>();
  for (const seg of t.segments) {
    const e = out.get(seg.label) ?? { label: seg.label, count: 0, lengthM: 0, paintedAreaM2: 0, equivalentLengthM: 0 };
    const area = segmentPaintedAreaM2(seg, t.lineWidthM);
    e.count += 1;
    e.lengthM += segmentLengthM(seg);
    e.paintedAreaM2 += area;
    e.equivalentLengthM += area / t.lineWidthM;
    out.set(seg.label, e);
  }
  return [...out.values()];
}

const line = (x1: number, y1: number, x2: number, y2: number, label: string): LineSegment => ({ kind: 'line', from: [x1, y1], to: [x2, y2], label });
const arc = (cx: number, cy: number, r: number, a: number, b: number, label: string): LineSegment => ({ kind: 'arc', center: [cx, cy], radiusM: r, startRad: a, endRad: b, label });

function boundary(L: number, W: number, ends = 'goal line', sides = 'touchline'): LineSegment[] {
  return [line(0, 0, L, 0, sides), line(L, 0, L, W, ends), line(L, W, 0, W, sides), line(0, W, 0, 0, ends)];
}

/** A box on an end line at x = 0 (mirrored to x = L when `far`), `width` wide, `depth` deep, centred. */
function endBox(L: number, W: number, width: number, depth: number, far: boolean, label: string): LineSegment[] {
  const y1 = W / 2 - width / 2;
  const y2 = W / 2 + width / 2;
  const x0 = far ? L : 0;
  const x1 = far ? L - depth : depth;
  return [line(x0, y1, x1, y1, label), line(x1, y1, x1, y2, label), line(x1, y2, x0, y2, label)];
}

interface SoccerDims {
  centreCircleR: number;
  goalAreaWidth: number;
  goalAreaDepth: number;
  penaltyAreaWidth: number;
  penaltyAreaDepth: number;
  penaltyMarkM: number;
  penaltyArcR: number;
  cornerArcR: number;
}

function soccerSegments(L: number, W: number, d: SoccerDims): LineSegment[] {
  const segs: LineSegment[] = [...boundary(L, W), line(L / 2, 0, L / 2, W, 'halfway line'), arc(L / 2, W / 2, d.centreCircleR, 0, 2 * Math.PI, 'centre circle')];
  for (const far of [false, true]) {
    segs.push(...endBox(L, W, d.goalAreaWidth, d.goalAreaDepth, far, 'goal area'));
    segs.push(...endBox(L, W, d.penaltyAreaWidth, d.penaltyAreaDepth, far, 'penalty area'));
    // The penalty arc is the part of the circle round the mark that lies outside the area.
    const outside = d.penaltyAreaDepth - d.penaltyMarkM;
    if (outside < d.penaltyArcR) {
      const half = Math.acos(outside / d.penaltyArcR);
      const cx = far ? L - d.penaltyMarkM : d.penaltyMarkM;
      const mid = far ? Math.PI : 0;
      segs.push(arc(cx, W / 2, d.penaltyArcR, mid - half, mid + half, 'penalty arc'));
    }
  }
  const r = d.cornerArcR;
  segs.push(arc(0, 0, r, 0, Math.PI / 2, 'corner arc'), arc(L, 0, r, Math.PI / 2, Math.PI, 'corner arc'), arc(L, W, r, Math.PI, 1.5 * Math.PI, 'corner arc'), arc(0, W, r, 1.5 * Math.PI, 2 * Math.PI, 'corner arc'));
  return segs;
}

/**
 * Full-size soccer (IFAB Laws of the Game, Law 1): touchline 90–120 m, goal line 45–90 m;
 * centre circle r 9.15 m; goal area 5.5 m from each post and 5.5 m deep; penalty area
 * 16.5 m from each post and 16.5 m deep; penalty mark 11 m, arc r 9.15 m; corner arc r 1 m;
 * goal 7.32 m; lines ≤ 12 cm. International matches: 100–110 × 64–75 m. Derived total:
 * 2L + 3W + 302.94 m.
 */
export function soccerTemplate(lengthM = 105, widthM = 68, lineWidthM = 0.12, options: { international?: boolean } = {}): LineTemplate {
  if (options.international) {
    requireRange(lengthM, 100, 110, 'invalid_dimension', 'international touchline length (m, IFAB Law 1: 100–110)');
    requireRange(widthM, 64, 75, 'invalid_dimension', 'international goal line length (m, IFAB Law 1: 64–75)');
  }
  requireRange(lengthM, 90, 120, 'invalid_dimension', 'soccer touchline length (m, IFAB Law 1: 90–120)');
  requireRange(widthM, 45, 90, 'invalid_dimension', 'soccer goal line length (m, IFAB Law 1: 45–90)');
  if (widthM >= lengthM) fail('invalid_dimension', 'the touchline must be longer than the goal line (IFAB Law 1)');
  requireRange(lineWidthM, 0.01, 0.12, 'invalid_line_width', 'line width (m, IFAB Law 1: ≤ 0.12)');
  const goal = 7.32;
  return {
    id: `soccer_${lengthM}x${widthM}`,
    sport: 'soccer',
    name: `Soccer ${lengthM} × ${widthM} m`,
    source: 'IFAB Laws of the Game, Law 1',
    lengthM,
    widthM,
    lineWidthM,
    segments: soccerSegments(lengthM, widthM, {
      centreCircleR: 9.15,
      goalAreaWidth: goal + 2 * 5.5,
      goalAreaDepth: 5.5,
      penaltyAreaWidth: goal + 2 * 16.5,
      penaltyAreaDepth: 16.5,
      penaltyMarkM: 11,
      penaltyArcR: 9.15,
      cornerArcR: 1,
    }),
  };
}

/** Small-sided soccer formats. Dimensions are common practice / from memory: the league's own rules govern. */
export const SMALL_SIDED_SOCCER = {
  '7v7': { lengthM: 55, widthM: 36, centreCircleR: 6, goalAreaWidth: 11, goalAreaDepth: 4, penaltyAreaWidth: 22, penaltyAreaDepth: 11, penaltyMarkM: 8, penaltyArcR: 6, cornerArcR: 1 },
  '9v9': { lengthM: 73, widthM: 46, centreCircleR: 7.3, goalAreaWidth: 14.6, goalAreaDepth: 4.5, penaltyAreaWidth: 32, penaltyAreaDepth: 13, penaltyMarkM: 9, penaltyArcR: 7.3, cornerArcR: 1 },
} as const;

/**
 * Small-sided soccer layout (7v7 or 9v9; common practice / from memory). `size` changes the
 * touchline and goal line; the areas, circle and marks keep the format's sizes.
 */
export function smallSidedSoccerTemplate(format: keyof typeof SMALL_SIDED_SOCCER, lineWidthM = 0.1, size?: { lengthM: number; widthM: number }): LineTemplate {
  const d = SMALL_SIDED_SOCCER[format];
  if (!d) fail('unknown_template', `unknown small-sided format ${JSON.stringify(format)}`);
  const L = size?.lengthM ?? d.lengthM;
  const W = size?.widthM ?? d.widthM;
  if (W <= d.penaltyAreaWidth || L <= 2 * d.penaltyAreaDepth) fail('invalid_dimension', `a ${format} field must be wider than its penalty area (${d.penaltyAreaWidth} m) and longer than two of them (${2 * d.penaltyAreaDepth} m)`);
  return {
    id: size ? `soccer_${format}_${L}x${W}` : `soccer_${format}`,
    sport: 'soccer',
    name: size ? `Soccer ${format} ${L} × ${W} m` : `Soccer ${format}`,
    source: 'common practice / from memory (league rules govern)',
    lengthM: L,
    widthM: W,
    lineWidthM,
    segments: soccerSegments(L, W, d),
  };
}

/** Seven-segment strokes of the numerals a football field carries (0–5), as [u1, v1, u2, v2] in a 4 × 6 box (ft). */
const NUMERAL_STROKES: Record<string, ReadonlyArray<readonly [number, number, number, number]>> = (() => {
  const seg = { a: [0, 6, 4, 6], b: [4, 6, 4, 3], c: [4, 3, 4, 0], d: [0, 0, 4, 0], e: [0, 0, 0, 3], f: [0, 3, 0, 6], g: [0, 3, 4, 3] } as const;
  const of = (keys: string) => [...keys].map((k) => seg[k as keyof typeof seg]);
  return { '0': of('abcdef'), '1': of('bc'), '2': of('abged'), '3': of('abgcd'), '4': of('fgbc'), '5': of('afgcd') };
})();

/** Options of the football layout. */
export interface FootballOptions {
  /** Hash marks (inbounds lines) from each sideline, ft: NFHS 53 ft 4 in, NCAA 60 ft. */
  hashFromSidelineFt?: number;
  /** Yard-line numerals (default true). */
  numbers?: boolean;
  /** Team boxes, coaching lines and limit lines outside the field (default true). */
  teamAreas?: boolean;
}

/**
 * American football, NFHS (secondary sources): 360 × 160 ft including 30 ft end zones,
 * 4 in lines; goal lines and yard lines every 5 yd across the field; hash marks (inbounds
 * lines) 24 in long at every other yard, 53 ft 4 in from each sideline (NCAA 60 ft).
 * From memory (NFHS rule book, not confirmed in print here): 24 in short marks at each yard
 * line 4 in inside each sideline; 12 in nine-yard marks 9 yd from each sideline at every
 * 10-yd line; numerals 6 ft high and 4 ft wide every 10 yd, tops 9 yd from the sideline,
 * drawn here as seven-segment strokes 8 in wide; limit lines 6 ft outside the sidelines and
 * end lines as 12 in dashes with 24 in gaps; between the 25-yd lines a solid coaching line
 * 6 ft and a team-box line 12 ft outside each sideline, closed at both ends. Direction
 * arrows, end-zone and mid-field decoration are not included.
 */
export function footballTemplate(hashFromSidelineFt: number | FootballOptions = 53 + 4 / 12): LineTemplate {
  const o: FootballOptions = typeof hashFromSidelineFt === 'number' ? { hashFromSidelineFt } : hashFromSidelineFt;
  const numbers = o.numbers ?? true;
  const teamAreas = o.teamAreas ?? true;
  const ft = ftToM;
  const L = ft(360);
  const W = ft(160);
  const ez = ft(30);
  const yd = ft(3);
  const xAt = (yardLine: number) => ez + yardLine * yd;
  const segs: LineSegment[] = boundary(L, W, 'end line', 'sideline');
  for (let k = 0; k <= 100; k += 5) segs.push(line(xAt(k), 0, xAt(k), W, k === 0 || k === 100 ? 'goal line' : 'yard line'));
  const hashLen = ft(2);
  const h1 = ft(o.hashFromSidelineFt ?? 53 + 4 / 12);
  const inset = ft(4 / 12);
  for (let k = 1; k < 100; k++) {
    if (k % 5 === 0) continue;
    const x = xAt(k);
    segs.push(line(x, h1, x, h1 + hashLen, 'hash mark'), line(x, W - h1, x, W - h1 - hashLen, 'hash mark'));
    segs.push(line(x, inset, x, inset + hashLen, 'sideline short mark'), line(x, W - inset, x, W - inset - hashLen, 'sideline short mark'));
  }
  for (let k = 10; k <= 90; k += 10) {
    const x = xAt(k);
    const nine = 9 * yd;
    segs.push(line(x, nine - ft(1), x, nine, 'nine-yard mark'), line(x, W - nine + ft(1), x, W - nine, 'nine-yard mark'));
  }
  if (numbers) {
    const stroke = ft(8 / 12);
    const gap = ft(1);
    for (let k = 10; k <= 90; k += 10) {
      const digits = String(Math.min(k, 100 - k)).split('');
      const x = xAt(k);
      // Near side reads from the near sideline (bottom 7 yd, top 9 yd out); far side turned half round.
      for (const far of [false, true]) {
        digits.forEach((digit, i) => {
          const u0 = i === 0 ? -gap / 2 - ft(4) : gap / 2;
          for (const [u1, v1, u2, v2] of NUMERAL_STROKES[digit] ?? []) {
            const px = (u: number) => (far ? x - (u0 + ft(u)) : x + u0 + ft(u));
            const py = (v: number) => (far ? W - 7 * yd - ft(v) : 7 * yd + ft(v));
            segs.push({ kind: 'line', from: [px(u1), py(v1)], to: [px(u2), py(v2)], label: 'number', widthM: stroke });
          }
        });
      }
    }
  }
  let marginM = 0;
  if (teamAreas) {
    const out6 = ft(6);
    const out12 = ft(12);
    marginM = out12;
    const x25 = xAt(25);
    const x75 = xAt(75);
    // Limit lines: dashes along the ends and the sidelines, solid coaching line between the 25s.
    const dashes = (x1: number, y1: number, x2: number, y2: number) => {
      const len = Math.hypot(x2 - x1, y2 - y1);
      for (let a = 0; a + ft(1) <= len + 1e-9; a += ft(3)) {
        const t1 = a / len;
        const t2 = (a + ft(1)) / len;
        segs.push(line(x1 + (x2 - x1) * t1, y1 + (y2 - y1) * t1, x1 + (x2 - x1) * t2, y1 + (y2 - y1) * t2, 'limit line'));
      }
    };
    for (const y of [-out6, W + out6]) {
      dashes(-out6, y, x25, y);
      dashes(x75, y, L + out6, y);
      segs.push(line(x25, y, x75, y, 'coaching line'));
    }
    dashes(-out6, -out6 + ft(3), -out6, W + out6 - ft(3));
    dashes(L + out6, -out6 + ft(3), L + out6, W + out6 - ft(3));
    for (const [yc, yt] of [
      [-out6, -out12],
      [W + out6, W + out12],
    ] as const) {
      segs.push(line(x25, yt, x75, yt, 'team box'), line(x25, yc, x25, yt, 'team box'), line(x75, yc, x75, yt, 'team box'));
    }
  }
  return {
    id: 'football_nfhs',
    sport: 'football',
    name: 'American football (NFHS)',
    source: 'NFHS (secondary sources); short marks, nine-yard marks, numerals, team areas and hash-mark length from memory',
    lengthM: L,
    widthM: W,
    lineWidthM: ft(4 / 12),
    marginM,
    segments: segs,
  };
}

/**
 * Men's lacrosse, 110 × 60 yd (from memory): boundary, midline, restraining lines 20 yd
 * either side of the midline, wing lines 10 yd long 10 yd in from each sideline, goal lines
 * 6 ft wide 15 yd from each end line, goal creases r 9 ft. All dimensions from memory.
 */
export function lacrosseTemplate(): LineTemplate {
  const yd = ftToM(3);
  const L = 110 * yd;
  const W = 60 * yd;
  const segs: LineSegment[] = [...boundary(L, W, 'end line', 'sideline'), line(L / 2, 0, L / 2, W, 'midline')];
  for (const x of [L / 2 - 20 * yd, L / 2 + 20 * yd]) segs.push(line(x, 0, x, W, 'restraining line'));
  for (const y of [10 * yd, W - 10 * yd]) segs.push(line(L / 2 - 5 * yd, y, L / 2 + 5 * yd, y, 'wing line'));
  const crease = ftToM(9);
  const goalHalf = ftToM(3);
  for (const x of [15 * yd, L - 15 * yd]) {
    segs.push(line(x, W / 2 - goalHalf, x, W / 2 + goalHalf, 'goal line'), arc(x, W / 2, crease, 0, 2 * Math.PI, 'goal crease'));
  }
  return { id: 'lacrosse_men', sport: 'lacrosse', name: "Men's lacrosse", source: 'from memory', lengthM: L, widthM: W, lineWidthM: ftToM(4 / 12), segments: segs };
}

/**
 * Field hockey (FIH): 91.40 × 55.00 m, lines 75 mm, 22.90 m lines, shooting circle r 14.63 m
 * drawn round each goal post and joined by a straight as long as the goal (3.66 m, from memory).
 * The dashed 5 m circle and marks are not included.
 */
export function fieldHockeyTemplate(): LineTemplate {
  const L = 91.4;
  const W = 55;
  const r = 14.63;
  const halfGoal = 3.66 / 2;
  const segs: LineSegment[] = [...boundary(L, W, 'backline', 'sideline'), line(L / 2, 0, L / 2, W, 'centre line'), line(22.9, 0, 22.9, W, '23 m line'), line(L - 22.9, 0, L - 22.9, W, '23 m line')];
  for (const far of [false, true]) {
    const x0 = far ? L : 0;
    const xs = far ? L - r : r;
    segs.push(line(xs, W / 2 - halfGoal, xs, W / 2 + halfGoal, 'shooting circle'));
    if (far) segs.push(arc(L, W / 2 + halfGoal, r, Math.PI / 2, Math.PI, 'shooting circle'), arc(L, W / 2 - halfGoal, r, Math.PI, 1.5 * Math.PI, 'shooting circle'));
    else segs.push(arc(x0, W / 2 + halfGoal, r, 0, Math.PI / 2, 'shooting circle'), arc(x0, W / 2 - halfGoal, r, -Math.PI / 2, 0, 'shooting circle'));
  }
  return { id: 'field_hockey_fih', sport: 'field_hockey', name: 'Field hockey (FIH)', source: 'FIH Rules of Hockey; goal width from memory', lengthM: L, widthM: W, lineWidthM: 0.075, segments: segs };
}

function diamond(opts: { id: string; sport: Sport; name: string; source: string; foulLineFt: number; boxWFt: number; boxLFt: number; boxGapFt: number; runningLaneFt: number | null; lineWidthIn: number }): LineTemplate {
  const f = ftToM(opts.foulLineFt);
  const c = Math.SQRT1_2;
  // Home plate apex at the origin; foul lines at ±45° from the line to second base (x axis).
  const segs: LineSegment[] = [line(0, 0, f * c, -f * c, 'first base foul line'), line(0, 0, f * c, f * c, 'third base foul line')];
  const bw = ftToM(opts.boxWFt);
  const bl = ftToM(opts.boxLFt);
  const gap = ftToM(opts.boxGapFt);
  for (const side of [-1, 1]) {
    const y0 = side * gap;
    const y1 = side * (gap + bw);
    const x0 = -bl / 2;
    const x1 = bl / 2;
    segs.push(line(x0, y0, x1, y0, "batter's box"), line(x1, y0, x1, y1, "batter's box"), line(x1, y1, x0, y1, "batter's box"), line(x0, y1, x0, y0, "batter's box"));
  }
  if (opts.runningLaneFt !== null) {
    const start = ftToM(opts.runningLaneFt);
    const end = ftToM(opts.runningLaneFt * 2);
    const off = ftToM(3);
    // Official Baseball Rules 5.09(a)(11): the lane lies in foul territory beside the
    // first-base line, from half-way to first base, 3 ft wide. The first-base line runs
    // along (c, −c); foul territory is on the side of (−c, −c), away from second base.
    const px = (d: number) => d * c - off * c;
    const py = (d: number) => -d * c - off * c;
    segs.push(line(px(start), py(start), px(end), py(end), 'running lane'), line(start * c, -start * c, px(start), py(start), 'running lane'));
  }
  return { id: opts.id, sport: opts.sport, name: opts.name, source: opts.source, lengthM: f * c, widthM: 2 * f * c, lineWidthM: ftToM(opts.lineWidthIn / 12), segments: segs };
}

/**
 * Baseball (Official Baseball Rules 2.01): foul lines from home plate, 320 ft or more
 * preferred (default 325 ft, department choice); 90 ft bases; running lane in foul territory
 * beside the first-base line from 45 ft to first base, 3 ft wide (Official Baseball Rules
 * 5.09(a)(11)). Batter's boxes 4 × 6 ft, 6 in from the plate: from memory.
 */
export function baseballTemplate(foulLineFt = 325): LineTemplate {
  requireRange(foulLineFt, 150, 450, 'invalid_dimension', 'foul line length (ft)');
  return diamond({ id: 'baseball_obr', sport: 'baseball', name: 'Baseball', source: 'Official Baseball Rules 2.01; box sizes from memory', foulLineFt, boxWFt: 4, boxLFt: 6, boxGapFt: 0.5 + 17 / 24, runningLaneFt: 45, lineWidthIn: 3 });
}

/** Softball: 60 ft bases, 200 ft foul lines, batter's boxes 3 × 7 ft — all from memory. */
export function softballTemplate(foulLineFt = 200): LineTemplate {
  requireRange(foulLineFt, 100, 350, 'invalid_dimension', 'foul line length (ft)');
  return diamond({ id: 'softball', sport: 'softball', name: 'Softball', source: 'from memory', foulLineFt, boxWFt: 3, boxLFt: 7, boxGapFt: 0.5 + 17 / 24, runningLaneFt: 30, lineWidthIn: 3 });
}

/**
 * The default template for a sport (its first layout in `LINE_LAYOUTS` at the template's own
 * size), or null for sports without lines (lawn, multi-use).
 */
export function defaultTemplateFor(sport: Sport): LineTemplate | null {
  const layout = LINE_LAYOUT_IDS.find((id) => LINE_LAYOUTS[id].sport === sport);
  return layout ? LINE_LAYOUTS[layout].template() : null;
}

/**
 * One coat of line paint. Coverage means the finished line of that coat, all its passes
 * together: the trade press's "about 200 linear ft of 4 in line per mixed gallon" is a
 * finished line painted in two directions, not one pass.
 */
export interface PaintSettings {
  /** Area of finished line one litre of mixed paint gives in this coat (all passes), m²/L. */
  coverageM2PerMixedL: number;
  /** Parts water per part paint concentrate (1:1 to 4:1 common practice). */
  dilutionWaterPerPaint: number;
  /** Passes of the marker in this coat (labour; the paint is in the coverage). */
  passes: number;
}

/** The department's line-marking settings: a first coat, a touch-up coat, the marker. */
export interface LineSettings {
  /** A layout painted afresh (start of the season, lines no longer showing). */
  firstCoat: PaintSettings;
  /** A repaint over lines that still show: lighter and often more dilute. */
  touchUp: PaintSettings;
  markerSpeedKmh: number;
  setupMin: number;
}

export interface PaintNeed {
  lineLengthM: number;
  paintedAreaM2: number;
  mixedLitres: number;
  concentrateLitres: number;
  waterLitres: number;
}

/**
 * Paint for a line length in one coat: painted area = length × width; mixed = area ÷ the
 * coat's coverage (finished line, all passes); concentrate = mixed ÷ (1 + dilution); water =
 * mixed − concentrate.
 */
export function paintNeed(lineLengthM: number, lineWidthM: number, s: PaintSettings): PaintNeed {
  requireNonNegative(lineLengthM, 'invalid_length', 'line length (m)');
  requirePositive(lineWidthM, 'invalid_line_width', 'line width (m)');
  requirePositive(s.coverageM2PerMixedL, 'invalid_coverage', 'coverage (m²/L)');
  requireRange(s.dilutionWaterPerPaint, 0, 10, 'invalid_dilution', 'dilution (parts water per part paint)');
  requirePositive(s.passes, 'invalid_passes', 'passes');
  const paintedAreaM2 = lineLengthM * lineWidthM;
  const mixedLitres = paintedAreaM2 / s.coverageM2PerMixedL;
  const concentrateLitres = mixedLitres / (1 + s.dilutionWaterPerPaint);
  return { lineLengthM, paintedAreaM2, mixedLitres, concentrateLitres, waterLitres: mixedLitres - concentrateLitres };
}

/** Marking labour, h = length × passes ÷ marker speed + setup time. */
export function markingHours(lineLengthM: number, passes: number, markerSpeedKmh: number, setupMin = 0): number {
  requireNonNegative(lineLengthM, 'invalid_length', 'line length (m)');
  requirePositive(passes, 'invalid_passes', 'passes');
  requirePositive(markerSpeedKmh, 'invalid_speed', 'marker speed (km/h)');
  requireNonNegative(setupMin, 'invalid_duration', 'setup time (min)');
  return (lineLengthM * passes) / 1000 / markerSpeedKmh + setupMin / 60;
}

/** Repaints in a season: one at the start, then every `intervalDays`, plus one per extra event. */
export function repaintsInSeason(seasonDays: number, intervalDays: number | null, extraEvents = 0): number {
  requireNonNegative(seasonDays, 'invalid_duration', 'season length (days)');
  requireNonNegative(extraEvents, 'invalid_events', 'extra events');
  if (intervalDays === null) return extraEvents;
  requirePositive(intervalDays, 'invalid_interval', 'repaint interval (days)');
  return (seasonDays > 0 ? Math.ceil(seasonDays / intervalDays) : 0) + extraEvents;
}

/** Paint and labour of one coat of a whole layout. */
export interface CoatPlan extends PaintNeed {
  /** Marking hours of the coat (passes × equivalent length ÷ speed + set-up). */
  hours: number;
}

interface TemplateMeasures {
  lengthM: number;
  areaM2: number;
  equivalentLengthM: number;
  elements: LineElement[];
}
const measured = new WeakMap<LineTemplate, TemplateMeasures>();
/**
 * Length, painted area and elements of a layout, measured once per template object: a season
 * outlook asks them for every field, and a football layout has some 900 pieces.
 */
function measuresOf(template: LineTemplate): TemplateMeasures {
  let m = measured.get(template);
  if (!m) {
    const areaM2 = templatePaintedAreaM2(template);
    m = { lengthM: totalLineLengthM(template), areaM2, equivalentLengthM: areaM2 / template.lineWidthM, elements: lineElements(template) };
    measured.set(template, m);
  }
  return m;
}

/** One coat of a whole layout: paint from its painted area (numerals are wider strokes), labour from its equivalent length. */
export function coatPlan(template: LineTemplate, coat: PaintSettings, marker: { markerSpeedKmh: number; setupMin: number }): CoatPlan {
  const { lengthM, equivalentLengthM } = measuresOf(template);
  return { ...paintNeed(equivalentLengthM, template.lineWidthM, coat), lineLengthM: lengthM, hours: markingHours(equivalentLengthM, coat.passes, marker.markerSpeedKmh, marker.setupMin) };
}

export interface LinePlan {
  templateId: string;
  lineLengthM: number;
  paintedAreaM2: number;
  /** Length of template-width line that takes the same paint as the whole layout, m (numerals are wider strokes). */
  equivalentLengthM: number;
  /** What the totals include, element by element. */
  elements: LineElement[];
  firstCoat: CoatPlan;
  touchUp: CoatPlan;
  /** Paintings in the season: first coats + touch-ups. */
  repaints: number;
  firstCoats: number;
  touchUps: number;
  seasonMixedLitres: number;
  seasonConcentrateLitres: number;
  seasonWaterLitres: number;
  seasonHours: number;
}

/**
 * A season's line plan for one template: one first coat at the start of the season (or
 * `firstCoats`), then touch-ups every repaint interval and for extra events.
 */
export function linePlan(template: LineTemplate, s: LineSettings, season: { days: number; repaintDays: number | null; extraEvents?: number; firstCoats?: number }): LinePlan {
  const firstCoat = coatPlan(template, s.firstCoat, s);
  const touchUp = coatPlan(template, s.touchUp, s);
  const repaints = repaintsInSeason(season.days, season.repaintDays, season.extraEvents ?? 0);
  const firstCoats = Math.min(repaints, requireNonNegative(season.firstCoats ?? 1, 'invalid_events', 'first coats'));
  const touchUps = repaints - firstCoats;
  return {
    templateId: template.id,
    lineLengthM: firstCoat.lineLengthM,
    paintedAreaM2: firstCoat.paintedAreaM2,
    equivalentLengthM: measuresOf(template).equivalentLengthM,
    // Shared between the plans of one template: read it, do not change it.
    elements: measuresOf(template).elements,
    firstCoat,
    touchUp,
    repaints,
    firstCoats,
    touchUps,
    seasonMixedLitres: firstCoat.mixedLitres * firstCoats + touchUp.mixedLitres * touchUps,
    seasonConcentrateLitres: firstCoat.concentrateLitres * firstCoats + touchUp.concentrateLitres * touchUps,
    seasonWaterLitres: firstCoat.waterLitres * firstCoats + touchUp.waterLitres * touchUps,
    seasonHours: firstCoat.hours * firstCoats + touchUp.hours * touchUps,
  };
}

/** A layout's size, metres: touchline / sideline (a diamond's foul line) and goal / end line. */
export interface LayoutSize {
  lengthM: number;
  widthM: number;
}

/**
 * The layouts a partner may ask lines for, each one of the templates above (dimensions and
 * sources as there). `sport` is the sport the layout is played on; its first layout here is
 * the sport's default. `template(size)` builds the layout at a size in metres (a diamond's
 * length is its foul line; fixed-size layouts ignore it), or at the template's own size.
 */
export const LINE_LAYOUTS = {
  soccer_full: { sport: 'soccer', name: 'Soccer, full size (105 × 68 m)', template: (size?: LayoutSize) => soccerTemplate(size?.lengthM, size?.widthM) },
  soccer_9v9: { sport: 'soccer', name: 'Soccer 9v9', template: (size?: LayoutSize) => smallSidedSoccerTemplate('9v9', 0.1, size) },
  soccer_7v7: { sport: 'soccer', name: 'Soccer 7v7', template: (size?: LayoutSize) => smallSidedSoccerTemplate('7v7', 0.1, size) },
  football: { sport: 'football', name: 'American football (NFHS)', template: () => footballTemplate() },
  lacrosse: { sport: 'lacrosse', name: "Men's lacrosse", template: () => lacrosseTemplate() },
  field_hockey: { sport: 'field_hockey', name: 'Field hockey (FIH)', template: () => fieldHockeyTemplate() },
  baseball: { sport: 'baseball', name: 'Baseball', template: (size?: LayoutSize) => baseballTemplate(size && mToFt(size.lengthM)) },
  softball: { sport: 'softball', name: 'Softball', template: (size?: LayoutSize) => softballTemplate(size && mToFt(size.lengthM)) },
} as const satisfies Record<string, { sport: Sport; name: string; template: (size?: LayoutSize) => LineTemplate }>;
export type LineLayout = keyof typeof LINE_LAYOUTS;
export const LINE_LAYOUT_IDS = Object.keys(LINE_LAYOUTS) as LineLayout[];

/**
 * The layouts that can go on a field of `sport`: the sport's own, or every layout on a
 * multi-use field or lawn (a school lawn lined for a small-sided game).
 */
export function layoutsForSport(sport: Sport): LineLayout[] {
  const own = LINE_LAYOUT_IDS.filter((id) => LINE_LAYOUTS[id].sport === sport);
  return own.length ? own : LINE_LAYOUT_IDS;
}
