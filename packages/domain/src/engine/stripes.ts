/**
 * Stripe patterns: the pass plan of a mowing in a chosen pattern over a field outline, its
 * number of passes, the distance driven and the time it takes.
 *
 * Works in the field's own frame (`fieldFrame`: x along the long axis, y across it, metres).
 * Passes of one direction are parallel centre lines spaced by the effective width
 * (cutting width − overlap); n passes cover n × width − (n − 1) × overlap, so a strip
 * `across` metres wide takes ⌈(across − overlap) ÷ (width − overlap)⌉ passes (as
 * `stripePassPlan`). Each pass is as long as its centre line inside the outline.
 *
 * Time = distance ÷ (speed × field efficiency) + turns × turn time. Field efficiency (ASABE
 * EP496 / D497: mowers 75–90 %, from memory) stands here for what slows the mower on the
 * straight (emptying, obstacles, overlap at the edges); the headland turns between passes are
 * counted on their own because a pattern changes how many there are.
 */
import type { Polygon } from '../schemas/common.ts';
import { fieldFrame } from '../geometry.ts';
import type { EquipmentKind, Sport, StripePattern } from '../vocabulary.ts';
import { STRIPE_PATTERN_LABELS, STRIPE_PATTERNS } from '../vocabulary.ts';
import { fail, requireFraction, requireNonNegative, requirePositive } from './check.ts';
import type { DepartmentParameters, MowerSpec } from './standards.ts';

type XY = [number, number];

/** What a pass plan needs of a mower. */
export type StripeMower = Pick<MowerSpec, 'widthM' | 'overlapM' | 'speedKmh' | 'efficiency' | 'turnTimeS'>;

/** One pass: its centre line in the field frame (m) and its length inside the outline (m). */
export interface StripePass {
  /** Pieces of the centre line inside the outline (one for a convex outline), metres. */
  pieces: Array<{ from: XY; to: XY }>;
  lengthM: number;
}

/** The passes of one direction of a pattern. */
export interface StripeDirectionPlan {
  /** Direction of travel, degrees from the long axis (0 length-wise, 90 side to side, 45 diagonal). */
  angleDeg: number;
  passes: StripePass[];
  /** Width of outline the passes cover, measured across them, m. */
  acrossM: number;
  lengthM: number;
  turns: number;
}

export interface StripePlan {
  pattern: StripePattern;
  directions: StripeDirectionPlan[];
  /** Passes in all directions (a checkerboard: both directions' passes). */
  passes: number;
  turns: number;
  /** Sum of pass lengths, m. */
  distanceM: number;
  /** Cutting width − overlap, m. */
  effectiveWidthM: number;
  /** Time on the straight: distance ÷ (speed × efficiency), h. */
  driveHours: number;
  /** Turns × turn time, h. */
  turnHours: number;
  /** driveHours + turnHours, h. */
  hours: number;
  /** Turn time used, s. */
  turnTimeS: number;
}

/** Directions of travel of each pattern, degrees from the long axis. */
export const STRIPE_PATTERN_ANGLES: Record<StripePattern, readonly number[]> = {
  lengthwise: [0],
  side_to_side: [90],
  checkerboard: [0, 90],
  diagonal: [45],
};

export function isStripePattern(value: unknown): value is StripePattern {
  return typeof value === 'string' && (STRIPE_PATTERNS as readonly string[]).includes(value);
}

/** Length (m) of the line v = `v` inside a ring given in (u, v) coordinates, and its pieces. */
function chord(ring: XY[], v: number): Array<[number, number]> {
  const us: number[] = [];
  for (let i = 0; i < ring.length; i++) {
    const a = ring[i]!;
    const b = ring[(i + 1) % ring.length]!;
    // Half-open test so a corner exactly on the line is counted once.
    if (a[1] <= v !== b[1] <= v) us.push(a[0] + ((v - a[1]) / (b[1] - a[1])) * (b[0] - a[0]));
  }
  us.sort((x, y) => x - y);
  const out: Array<[number, number]> = [];
  for (let i = 0; i + 1 < us.length; i += 2) out.push([us[i]!, us[i + 1]!]);
  return out;
}

function direction(points: XY[], angleDeg: number, widthM: number, overlapM: number): StripeDirectionPlan {
  const t = (angleDeg * Math.PI) / 180;
  const c = Math.cos(t);
  const s = Math.sin(t);
  // (u, v): u along the direction of travel, v across it.
  const ring = points.map(([x, y]) => [x * c + y * s, -x * s + y * c] as XY);
  const vs = ring.map((p) => p[1]);
  const vMin = Math.min(...vs);
  const vMax = Math.max(...vs);
  const across = vMax - vMin;
  const effective = widthM - overlapM;
  const n = Math.max(1, Math.ceil((across - overlapM) / effective - 1e-9));
  const passes: StripePass[] = [];
  for (let i = 0; i < n; i++) {
    // The first pass runs a half width in from the edge, each next one an effective width on;
    // the last keeps a half width off the far edge (it overlaps more when the width does not divide).
    const v = across <= widthM ? (vMin + vMax) / 2 : Math.min(vMin + widthM / 2 + i * effective, vMax - widthM / 2);
    const pieces = chord(ring, v).map(([u0, u1]) => ({ from: [u0 * c - v * s, u0 * s + v * c] as XY, to: [u1 * c - v * s, u1 * s + v * c] as XY, len: u1 - u0 }));
    passes.push({ pieces: pieces.map(({ from, to }) => ({ from, to })), lengthM: pieces.reduce((sum, p) => sum + p.len, 0) });
  }
  return { angleDeg, passes, acrossM: across, lengthM: passes.reduce((sum, p) => sum + p.lengthM, 0), turns: n - 1 };
}

/**
 * Pass plan of a pattern over an outline in the field frame (`fieldFrame(...).points`, m).
 * Passes per direction = max(1, ⌈(across − overlap) ÷ (width − overlap)⌉); turns = passes − 1
 * per direction; hours = distance (km) ÷ (speed km/h × efficiency) + turns × turn time (s) ÷ 3600.
 * A rectangle L × W mowed length-wise takes ⌈(W − o) ÷ (w − o)⌉ passes of L m.
 */
export function stripePlan(points: ReadonlyArray<readonly [number, number]>, pattern: StripePattern, mower: StripeMower): StripePlan {
  if (!isStripePattern(pattern)) fail('invalid_pattern', `stripe pattern must be one of ${STRIPE_PATTERNS.join(', ')} (got ${JSON.stringify(pattern)})`);
  if (points.length < 3) fail('invalid_outline', 'a pass plan needs an outline of three corners or more');
  requirePositive(mower.widthM, 'invalid_width', 'cutting width (m)');
  requireNonNegative(mower.overlapM, 'invalid_overlap', 'overlap (m)');
  requirePositive(mower.speedKmh, 'invalid_speed', 'speed (km/h)');
  requireFraction(mower.efficiency, 'invalid_efficiency', 'field efficiency');
  requireNonNegative(mower.turnTimeS, 'invalid_turn_time', 'turn time (s)');
  if (!(mower.widthM - mower.overlapM > 0)) fail('invalid_overlap', `overlap (${mower.overlapM} m) must be smaller than the cutting width (${mower.widthM} m)`);
  const ring = points.map(([x, y]) => [x, y] as XY);
  const directions = STRIPE_PATTERN_ANGLES[pattern].map((a) => direction(ring, a, mower.widthM, mower.overlapM));
  const passes = directions.reduce((s, d) => s + d.passes.length, 0);
  const turns = directions.reduce((s, d) => s + d.turns, 0);
  const distanceM = directions.reduce((s, d) => s + d.lengthM, 0);
  const driveHours = distanceM / 1000 / (mower.speedKmh * mower.efficiency);
  const turnHours = (turns * mower.turnTimeS) / 3600;
  return { pattern, directions, passes, turns, distanceM, effectiveWidthM: mower.widthM - mower.overlapM, driveHours, turnHours, hours: driveHours + turnHours, turnTimeS: mower.turnTimeS };
}

/** Pass plan of a pattern over a field outline (GeoJSON WGS84), in the field's frame (`fieldFrame`). */
export function fieldStripePlan(polygon: Polygon, pattern: StripePattern, mower: StripeMower): StripePlan & { lengthM: number; widthM: number } {
  const frame = fieldFrame(polygon);
  return { ...stripePlan(frame.points, pattern, mower), lengthM: frame.lengthM, widthM: frame.widthM };
}

/** A unit of equipment as the pass plan reads it (null figures fall back to the department's mower of that kind). */
export interface StripeUnit {
  kind: EquipmentKind;
  cuttingWidthM: number | null;
  speedKmh: number | null;
  fieldEfficiency: number | null;
}

/**
 * The mower figures of a pass plan: the unit's width, speed and efficiency, with the overlap and
 * turn time of the department's mower of its kind (reel for reel mowers, rotary otherwise);
 * the department's mower itself when no unit is named.
 */
export function stripeMowerOf(unit: StripeUnit | null, params: Pick<DepartmentParameters, 'mowers'>, fallback: 'reel' | 'rotary' = 'rotary'): StripeMower {
  const base = params.mowers[unit ? (unit.kind === 'reel_mower' ? 'reel' : 'rotary') : fallback];
  return {
    widthM: unit?.cuttingWidthM ?? base.widthM,
    speedKmh: unit?.speedKmh ?? base.speedKmh,
    efficiency: unit?.fieldEfficiency ?? base.efficiency,
    overlapM: base.overlapM,
    turnTimeS: base.turnTimeS,
  };
}

/**
 * What officials tend to ask of a soccer or football field's pattern (common practice: plain
 * stripes across the field keep offside and yard lines easy to judge by eye). Null when the
 * sport or the pattern gives no reason for a note.
 */
export function stripeOfficialsNote(sport: Sport, pattern: StripePattern): string | null {
  if (sport !== 'soccer' && sport !== 'football') return null;
  if (pattern === 'side_to_side' || pattern === 'lengthwise') return null;
  const lines = sport === 'soccer' ? 'offside' : 'yard';
  return `Match officials on ${sport} fields usually prefer plain stripes: stripes running side to side help them read the ${lines} lines by eye, and a busy pattern can hide them. Check with the league before a game day (common practice).`;
}

/** The caution shown with every pattern: on a slope the slope, not the pattern, sets the direction. */
export const STRIPE_SLOPE_CAUTION =
  'On a bank or slope the slope sets the direction, not the pattern: ride-on mowers usually go up and down a slope rather than across it, walk-behind mowers across it. Check the grade against the mower maker’s limit and follow the operator’s manual and local practice (common practice).';

/** An order's `details.pattern` in words: the label of a known pattern, else the text as written; null for none. */
export function stripePatternText(value: unknown): string | null {
  if (typeof value !== 'string' || !value) return null;
  return isStripePattern(value) ? STRIPE_PATTERN_LABELS[value] : value;
}
