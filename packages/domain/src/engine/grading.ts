/**
 * Grading: a recommended maintenance level from the department's rubric, a surface score
 * from a field check, and compliance of a field with its level. The rubric points, score
 * weights and thresholds are this product's department defaults, not published values.
 */
import type { HardnessDevice, IrrigationKind, Level, Rootzone } from '../vocabulary.ts';
import { HARDNESS_DEVICE_LABELS, HARDNESS_DEVICES, IRRIGATION_KINDS, ROOTZONES } from '../vocabulary.ts';
import { fail, requireNonNegative, requirePositive, requireRange } from './check.ts';
import { CAUTIONS } from './cautions.ts';
import { DEFAULT_PARAMETERS, DEFAULT_STANDARDS, levelStandard } from './standards.ts';
import type { HardnessRange, Standards } from './standards.ts';

export const PLAY_LEVELS = ['elite', 'varsity', 'league', 'recreation', 'informal'] as const;
export type PlayLevel = (typeof PLAY_LEVELS)[number];
export const VISIBILITY = ['high', 'medium', 'low'] as const;
export type Visibility = (typeof VISIBILITY)[number];

export interface LevelRubricInput {
  play: PlayLevel;
  weeklyUseHours: number;
  visibility: Visibility;
  rootzone: Rootzone;
  irrigation: IrrigationKind;
}

export interface LevelRecommendation {
  level: Level;
  points: number;
  reasons: string[];
}

const PLAY_POINTS: Record<PlayLevel, number> = { elite: 4, varsity: 3, league: 2, recreation: 1, informal: 0 };
const VIS_POINTS: Record<Visibility, number> = { high: 2, medium: 1, low: 0 };
const ROOT_POINTS: Record<Rootzone, number> = { sand_based: 1, sand_capped: 0.5, native_soil: 0 };
const IRR_POINTS: Record<IrrigationKind, number> = { automatic: 1, quick_coupler: 0.5, none: 0 };

/**
 * Recommended level from the rubric: points for play, weekly use (≥ 20 h: 2, ≥ 10 h: 1),
 * visibility, rootzone and irrigation; ≥ 8 → 1, ≥ 5 → 2, ≥ 2 → 3, else 4. A field without
 * irrigation is held at level 3 or lower (it cannot keep a Showcase or Competition surface
 * through dry spells). Department rubric.
 */
export function recommendLevel(input: LevelRubricInput): LevelRecommendation {
  if (!(input.play in PLAY_POINTS)) fail('invalid_rubric', `level of play must be one of ${PLAY_LEVELS.join(', ')}`);
  if (!(input.visibility in VIS_POINTS)) fail('invalid_rubric', `visibility must be one of ${VISIBILITY.join(', ')}`);
  if (!ROOTZONES.includes(input.rootzone)) fail('invalid_rubric', `rootzone must be one of ${ROOTZONES.join(', ')}`);
  if (!IRRIGATION_KINDS.includes(input.irrigation)) fail('invalid_rubric', `irrigation must be one of ${IRRIGATION_KINDS.join(', ')}`);
  requireRange(input.weeklyUseHours, 0, 168, 'invalid_rubric', 'weekly hours of use');
  const reasons: string[] = [];
  let points = PLAY_POINTS[input.play];
  reasons.push(`level of play "${input.play}": +${PLAY_POINTS[input.play]}`);
  const use = input.weeklyUseHours >= 20 ? 2 : input.weeklyUseHours >= 10 ? 1 : 0;
  points += use;
  reasons.push(`${input.weeklyUseHours} h of use per week: +${use}`);
  points += VIS_POINTS[input.visibility];
  reasons.push(`visibility "${input.visibility}": +${VIS_POINTS[input.visibility]}`);
  points += ROOT_POINTS[input.rootzone];
  reasons.push(`rootzone ${input.rootzone}: +${ROOT_POINTS[input.rootzone]}`);
  points += IRR_POINTS[input.irrigation];
  reasons.push(`irrigation ${input.irrigation}: +${IRR_POINTS[input.irrigation]}`);
  let level: Level = points >= 8 ? 1 : points >= 5 ? 2 : points >= 2 ? 3 : 4;
  if (input.irrigation === 'none' && level < 3) {
    level = 3;
    reasons.push('not irrigated: held at level 3 (Community) or lower');
  }
  return { level, points, reasons };
}

export interface FieldCheckInput {
  turfCoverPct: number;
  weedsPct: number;
  bareWornPct: number;
  heightMm: number;
  hocMm: number;
  /** Gmax reading; omit when not measured. */
  hardnessG?: number;
  /** The tester the reading was taken with; required with a reading (readings of different testers are not comparable). */
  hardnessDevice?: HardnessDevice;
  /** Evenness 1 (rough) to 5 (true). */
  evenness: number;
}

export interface ScoreComponent {
  key: 'cover' | 'weeds' | 'bare' | 'height' | 'hardness' | 'evenness';
  /** 0–100 for this component. */
  score: number;
  weight: number;
  points: number;
}

export type CheckFlag = 'close_field_caution' | 'hardness_above_target' | 'soft_surface' | 'overdue_mowing' | 'scalped' | 'low_cover';

export interface SurfaceScore {
  score: number;
  components: ScoreComponent[];
  flags: CheckFlag[];
  cautions: string[];
}

/** Component weights of the surface score (department defaults; sum 100). */
export const SCORE_WEIGHTS = { cover: 30, weeds: 15, bare: 15, height: 15, hardness: 15, evenness: 10 } as const;

const clamp = (v: number) => Math.max(0, Math.min(100, v));

/**
 * Surface score 0–100 from a field check, as a weighted sum of components (department
 * rubric): cover = cover %; weeds = 100 − 2 × weeds %; bare = 100 − 3 × bare %; height 100
 * between HOC and 1.5 × HOC, falling 200 points per unit of ratio outside; hardness 100
 * within the tester's range (up to its target where one is set), falling 2 points per G
 * outside; evenness (e − 1) × 25. Without a hardness reading its weight is spread over the
 * others. Hardness is judged against the range of the tester that took it: above the
 * limit flags a close-the-field caution, above the target (within the limit) a flag only.
 * Cover + weeds + bare/worn is the whole surface, so it cannot pass 100 %.
 */
export function surfaceScore(check: FieldCheckInput, ranges: Record<HardnessDevice, HardnessRange> = DEFAULT_PARAMETERS.hardnessRangesG): SurfaceScore {
  requireRange(check.turfCoverPct, 0, 100, 'invalid_check', 'turf cover (%)');
  requireRange(check.weedsPct, 0, 100, 'invalid_check', 'weeds (%)');
  requireRange(check.bareWornPct, 0, 100, 'invalid_check', 'bare/worn (%)');
  const whole = check.turfCoverPct + check.weedsPct + check.bareWornPct;
  if (whole > 100 + 1e-9) fail('invalid_check', `turf cover, weeds and bare/worn share one surface: together they cannot pass 100 % (got ${Math.round(whole * 10) / 10} %)`, { totalPct: whole });
  requirePositive(check.heightMm, 'invalid_height', 'measured height (mm)');
  requirePositive(check.hocMm, 'invalid_hoc', 'HOC (mm)');
  requireRange(check.evenness, 1, 5, 'invalid_check', 'evenness (1–5)');
  const ratio = check.heightMm / check.hocMm;
  const heightScore = ratio < 1 ? clamp(100 - (1 - ratio) * 200) : ratio <= 1.5 ? 100 : clamp(100 - (ratio - 1.5) * 200);
  const parts: Array<[ScoreComponent['key'], number]> = [
    ['cover', clamp(check.turfCoverPct)],
    ['weeds', clamp(100 - 2 * check.weedsPct)],
    ['bare', clamp(100 - 3 * check.bareWornPct)],
    ['height', heightScore],
  ];
  const flags: CheckFlag[] = [];
  const cautions: string[] = [];
  if (check.hardnessG !== undefined) {
    const g = requireNonNegative(check.hardnessG, 'invalid_hardness', 'hardness (Gmax)');
    const device = check.hardnessDevice;
    if (device === undefined) fail('hardness_device_required', 'name the tester the hardness reading was taken with: readings of different testers are not comparable');
    if (!(HARDNESS_DEVICES as readonly string[]).includes(device)) fail('unknown_hardness_device', `hardness tester must be one of ${HARDNESS_DEVICES.join(', ')} (got ${JSON.stringify(device)})`);
    const range = ranges[device];
    if (!range) fail('invalid_hardness_range', `no hardness range is set for ${HARDNESS_DEVICE_LABELS[device]}`);
    const upper = range.target ?? range.max;
    if ((range.min !== null && range.min >= upper) || upper > range.max) fail('invalid_hardness_range', `the hardness range of ${HARDNESS_DEVICE_LABELS[device]} must run from its minimum up to its target and limit`);
    const over = g > upper ? g - upper : range.min !== null && g < range.min ? range.min - g : 0;
    parts.push(['hardness', clamp(100 - 2 * over)]);
    if (g > range.max) {
      flags.push('close_field_caution');
      cautions.push(CAUTIONS.hardness);
    } else if (g > upper) {
      flags.push('hardness_above_target');
    } else if (range.min !== null && g < range.min) {
      flags.push('soft_surface');
      cautions.push(CAUTIONS.wetField);
    }
  }
  parts.push(['evenness', (check.evenness - 1) * 25]);
  const totalWeight = parts.reduce((s, [k]) => s + SCORE_WEIGHTS[k], 0);
  const components = parts.map(([key, score]) => {
    const weight = (SCORE_WEIGHTS[key] * 100) / totalWeight;
    return { key, score, weight, points: (score * weight) / 100 };
  });
  // A height entered in inches comes back as 1.5000000000000002 × a 2 in HOC: exactly 1.5 is not over.
  if (ratio > 1.5 + 1e-9) flags.push('overdue_mowing');
  if (ratio < 0.9) flags.push('scalped');
  if (check.turfCoverPct < 60) flags.push('low_cover');
  const score = components.reduce((s, c) => s + c.points, 0);
  return { score, components, flags, cautions };
}

export interface ComplianceInput {
  level: Level;
  plannedTasks: number;
  doneTasks: number;
  /** Latest surface score, or null when no check is on file. */
  latestScore: number | null;
}

export interface Compliance {
  /** done ÷ planned (1 when nothing was planned). */
  workShare: number;
  targetScore: number;
  scoreMet: boolean | null;
  status: 'compliant' | 'at_risk' | 'non_compliant';
  reasons: string[];
}

/**
 * Compliance with a level: work done vs planned and score vs the level's target. Compliant
 * when ≥ 90 % of the work is done and the score meets the target; non-compliant below 70 %
 * of the work or more than 10 points under the target; else at risk (department rule).
 */
export function compliance(input: ComplianceInput, standards: Standards = DEFAULT_STANDARDS): Compliance {
  const std = levelStandard(input.level, standards);
  requireNonNegative(input.plannedTasks, 'invalid_count', 'planned tasks');
  requireNonNegative(input.doneTasks, 'invalid_count', 'done tasks');
  const workShare = input.plannedTasks === 0 ? 1 : input.doneTasks / input.plannedTasks;
  const reasons: string[] = [`${input.doneTasks} of ${input.plannedTasks} planned tasks done (${Math.round(workShare * 100)} %)`];
  let scoreMet: boolean | null = null;
  let bad = workShare < 0.7;
  let risk = workShare < 0.9;
  if (input.latestScore !== null) {
    requireRange(input.latestScore, 0, 100, 'invalid_score', 'surface score');
    scoreMet = input.latestScore >= std.targetScore;
    reasons.push(`surface score ${Math.round(input.latestScore)} vs target ${std.targetScore}`);
    if (input.latestScore < std.targetScore - 10) bad = true;
    if (!scoreMet) risk = true;
  } else {
    reasons.push('no field check on file');
    risk = true;
  }
  return { workShare, targetScore: std.targetScore, scoreMet, status: bad ? 'non_compliant' : risk ? 'at_risk' : 'compliant', reasons };
}
