/**
 * A field check as a crew records it on the field: cover, weeds, bare/worn areas and where,
 * measured height, hardness at several points with the tester used, evenness, divots and the
 * leaf tips. `judgeFieldCheck` turns it into the surface score of `surfaceScore` and the flags
 * the office acts on.
 */
import type { HardnessDevice, Level } from '../vocabulary.ts';
import { CAUTIONS } from './cautions.ts';
import { fail, requireNonNegative, requireRange } from './check.ts';
import { surfaceScore, type CheckFlag, type SurfaceScore } from './grading.ts';
import type { HardnessRange } from './standards.ts';

/** Where a field wears bare: the goalmouths, the centre, the wings or a diamond's infield. */
export const WEAR_AREAS = ['goalmouths', 'centre', 'wings', 'infield'] as const;
export type WearArea = (typeof WEAR_AREAS)[number];
export const WEAR_AREA_LABELS: Record<WearArea, string> = { goalmouths: 'Goalmouths', centre: 'Centre', wings: 'Wings', infield: 'Infield' };

/**
 * Turf cover (%) each level aims for. Department defaults (common practice: a showcase
 * surface is near full cover, an open-space lawn tolerates more thin turf); not a published value.
 */
export const COVER_TARGET_PCT: Record<Level, number> = { 1: 95, 2: 90, 3: 80, 4: 70 };

/** Hardness readings a check takes at most (one per goalmouth, centre, wings and spares). */
export const MAX_HARDNESS_READINGS = 12;

export interface FieldCheckRecord {
  turfCoverPct: number;
  weedsPct: number;
  bareWornPct: number;
  /** Where the bare or worn turf is. */
  bareAreas: WearArea[];
  /** Measured grass height, mm. */
  heightMm: number;
  /** Hardness readings (G) at several points, with the tester they were taken with. */
  hardnessReadingsG: number[];
  hardnessDevice: HardnessDevice | null;
  /** Evenness 1 (rough) to 5 (true). */
  evenness: number;
  /** Divots 1 (torn up) to 5 (none). */
  divots: number;
  /** Torn or browned leaf tips seen after mowing. */
  tornLeafTips: boolean;
}

export type FieldCheckFlag = CheckFlag | 'cover_below_target' | 'check_blade_sharpness' | 'divots_to_repair';

export interface FieldCheckResult extends Omit<SurfaceScore, 'flags'> {
  flags: FieldCheckFlag[];
  /** Mean of the readings (G), the value the score uses; null without readings. */
  hardnessG: number | null;
  /** The highest and lowest readings (G), judged against the tester's range point by point. */
  hardnessMaxG: number | null;
  hardnessMinG: number | null;
  /** The cover target of the level (%). */
  coverTargetPct: number;
  /** What each flag means for the crew and the office, in the order of `flags`. */
  advice: string[];
}

const ADVICE: Record<FieldCheckFlag, string> = {
  close_field_caution: 'A hardness reading is above the limit for the tester used: consider closing the field until it is corrected (local policy decides).',
  hardness_above_target: 'Hardness is above the target for the tester used: plan aeration and watering before play.',
  soft_surface: 'A hardness reading is below the tester’s range: the surface is soft or wet; restrict play until it drains (local policy decides).',
  overdue_mowing: 'Grass is taller than 1.5 × HOC: bring it down in steps (one-third rule), not in one cut.',
  scalped: 'Grass is below 0.9 × HOC: check the mower’s height setting.',
  low_cover: 'Turf cover is below 60 %: plan overseeding and rest for the worn areas.',
  cover_below_target: 'Turf cover is below the level’s target: plan overseeding or topdressing of the worn areas.',
  check_blade_sharpness: 'Torn or browned leaf tips: check the mower blades’ sharpness before suspecting disease.',
  divots_to_repair: 'Divots are many: replace or fill them and seed before the next game.',
};

/**
 * Judges a crew's field check (see the module comment). The score is `surfaceScore` with the
 * mean hardness reading; each reading is also judged on its own against the tester's range,
 * since one hard spot is enough for a head injury (above the limit: the close-field caution;
 * below the minimum: the wet-field caution). Flags: height above 1.5 × HOC (one-third rule,
 * common practice), cover below the level's target (`COVER_TARGET_PCT`), torn or browned leaf
 * tips → check blade sharpness before suspecting disease (common practice: a dull blade tears
 * the leaf and its tips brown within a day or two), divots rated 2 or worse.
 */
export function judgeFieldCheck(check: FieldCheckRecord, context: { hocMm: number; level: Level; ranges: Record<HardnessDevice, HardnessRange> }): FieldCheckResult {
  requireRange(check.divots, 1, 5, 'invalid_check', 'divots (1–5)');
  if (check.hardnessReadingsG.length > MAX_HARDNESS_READINGS) fail('invalid_check', `take at most ${MAX_HARDNESS_READINGS} hardness readings (got ${check.hardnessReadingsG.length})`);
  for (const g of check.hardnessReadingsG) requireNonNegative(g, 'invalid_hardness', 'hardness reading (G)');
  const readings = check.hardnessReadingsG;
  const mean = readings.length ? readings.reduce((s, g) => s + g, 0) / readings.length : null;
  if (mean !== null && check.hardnessDevice === null) fail('hardness_device_required', 'name the tester the hardness readings were taken with: readings of different testers are not comparable');
  const scored = surfaceScore(
    {
      turfCoverPct: check.turfCoverPct,
      weedsPct: check.weedsPct,
      bareWornPct: check.bareWornPct,
      heightMm: check.heightMm,
      hocMm: context.hocMm,
      ...(mean !== null && check.hardnessDevice ? { hardnessG: mean, hardnessDevice: check.hardnessDevice } : {}),
      evenness: check.evenness,
    },
    context.ranges,
  );
  const flags: FieldCheckFlag[] = [...scored.flags];
  const cautions = [...scored.cautions];
  const hardnessMaxG = readings.length ? Math.max(...readings) : null;
  const hardnessMinG = readings.length ? Math.min(...readings) : null;
  if (check.hardnessDevice && hardnessMaxG !== null && hardnessMinG !== null) {
    const range = context.ranges[check.hardnessDevice];
    if (hardnessMaxG > range.max && !flags.includes('close_field_caution')) {
      // One spot over the limit outweighs a mean merely over the target.
      const above = flags.indexOf('hardness_above_target');
      if (above >= 0) flags.splice(above, 1);
      flags.push('close_field_caution');
      cautions.push(CAUTIONS.hardness);
    }
    if (range.min !== null && hardnessMinG < range.min && !flags.includes('soft_surface')) {
      flags.push('soft_surface');
      cautions.push(CAUTIONS.wetField);
    }
  }
  const coverTargetPct = COVER_TARGET_PCT[context.level];
  if (check.turfCoverPct < coverTargetPct) flags.push('cover_below_target');
  if (check.tornLeafTips) flags.push('check_blade_sharpness');
  if (check.divots <= 2) flags.push('divots_to_repair');
  return { ...scored, flags, cautions, hardnessG: mean, hardnessMaxG, hardnessMinG, coverTargetPct, advice: flags.map((f) => ADVICE[f]) };
}
