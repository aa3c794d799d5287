/**
 * What the partner's pages and calendar feed say, in plain words: a school athletic director
 * reads them, not a turf manager. The surface score supports decisions; the local rules of
 * play and the sport's governing body decide.
 */
import { CAUTIONS } from './engine/cautions.ts';
import { LOW_SCORE_MARGIN } from './engine/closures.ts';
import type { ClosureStatus } from './vocabulary.ts';

export const PARTNER_STATUS_HEADLINES: Record<ClosureStatus, string> = {
  open: 'Open for play',
  restricted: 'Open for restricted play only',
  closed: 'Closed to play',
};

/** The cautions every partner page shows (common practice; NOAA's lightning advice from memory, see CAUTIONS). */
export const PARTNER_CAUTIONS: readonly string[] = [
  'Do not play on a wet or waterlogged field even when it shows as open: play tears the turf, compacts the soil and footing is poor. If water stands or the ground squelches underfoot, wait and tell the parks department.',
  CAUTIONS.lightning,
  'The surface score is decision support from the parks department’s latest field check, not a safety certificate: look at the field before play. Whether a game goes ahead is decided by your local rules, the officials and the sport’s governing body.',
];

/**
 * What a surface score means for play, in a sentence: at or above the level's target, within
 * `LOW_SCORE_MARGIN` points under it, or further under (the same margin that suggests resting
 * a field; department rule).
 * @param score surface score 0–100 of the latest field check
 * @param targetScore the score the field's maintenance level aims for (Standards)
 */
export function scoreMeaning(score: number, targetScore: number): string {
  if (score >= targetScore) return 'Good condition for this kind of field: the surface meets what the parks department aims for.';
  if (score >= targetScore - LOW_SCORE_MARGIN) return 'Fair condition: playable, with some wear the crews are working on.';
  return 'Worn: the surface is well under what the parks department aims for, and it may be rested or repaired.';
}
