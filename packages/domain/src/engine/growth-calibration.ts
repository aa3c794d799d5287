/**
 * A field's growth calibration from its field checks. Each check with a measured height and a
 * known number of days since the last cut at a known HOC gives an observed clipping growth
 * (height − HOC); the engine predicts the growth of the same days (`fieldDailySeries`: the
 * grass's default maximum rate × GP × water modifier). Their ratio over the readings is the
 * field's calibration factor: how much faster or slower this field grows than the engine says.
 */
import { fail, requireFinite, requireNonNegative, requirePositive } from './check.ts';

/** One field check as a calibration reading. */
export interface GrowthReading {
  /** Day of the check, `YYYY-MM-DD`. */
  checkedOn: string;
  /** Measured grass height at the check, mm. */
  measuredHeightMm: number;
  /** HOC of the last cut, mm: the height the grass was left at. */
  hocMm: number;
  /** Days from the last cut to the check (the cut day's growth counts, the check day's does not). */
  daysSinceCut: number;
  /** The engine's predicted growth over those days at the grass's default rate, mm. */
  predictedGrowthMm: number;
}

export type CalibrationConfidence = 'none' | 'low' | 'medium' | 'high';

export interface GrowthCalibrationFactor {
  /** Observed ÷ predicted growth over the readings used (1 when there are none). */
  factor: number;
  /** Readings used (predicted growth at least `MIN_PREDICTED_GROWTH_MM`). */
  n: number;
  /** Sample standard deviation of the readings' own ratios (null with fewer than 2). */
  spread: number | null;
  confidence: CalibrationConfidence;
  /** Each reading used: its observed and predicted growth (mm) and their ratio. */
  readings: { checkedOn: string; daysSinceCut: number; measuredHeightMm: number; observedMm: number; predictedMm: number; ratio: number }[];
  /** Readings left out, with why. */
  skipped: { checkedOn: string; reason: string }[];
}

/** Below this predicted growth a reading says more about the ruler than about the grass (department rule). */
export const MIN_PREDICTED_GROWTH_MM = 2;
/** Readings longer after a cut than this are left out: the one-third rule would have cut by then (department rule). */
export const MAX_CALIBRATION_DAYS = 21;

/**
 * Calibration factor of a field's growth (see the module comment). Method (department rule,
 * no published source):
 * - observed growth of a reading = max(0, measured height − HOC), mm; a height below HOC
 *   (a scalp or a misread ruler) counts as no growth rather than negative growth;
 * - readings whose predicted growth is under `MIN_PREDICTED_GROWTH_MM` or whose days since
 *   the cut are outside 1–`MAX_CALIBRATION_DAYS` are left out;
 * - factor = Σ observed ÷ Σ predicted (a ratio of sums, so a reading after a long interval,
 *   which the ruler measures more precisely, weighs more than a one-day reading);
 * - spread = the sample standard deviation of the readings' own ratios observed ÷ predicted;
 * - confidence: none without readings; low with fewer than 3 readings or a spread above 0.5;
 *   medium with fewer than 6 or a spread above 0.25; else high.
 * The calibrated maximum rate is the grass's default rate × factor (mm/day at GP = 1).
 */
export function growthCalibrationFactor(readings: readonly GrowthReading[]): GrowthCalibrationFactor {
  const used: GrowthCalibrationFactor['readings'] = [];
  const skipped: GrowthCalibrationFactor['skipped'] = [];
  for (const r of readings) {
    requirePositive(r.measuredHeightMm, 'invalid_height', `measured height on ${r.checkedOn} (mm)`);
    requirePositive(r.hocMm, 'invalid_hoc', `HOC on ${r.checkedOn} (mm)`);
    requireNonNegative(r.predictedGrowthMm, 'invalid_growth', `predicted growth on ${r.checkedOn} (mm)`);
    requireFinite(r.daysSinceCut, 'invalid_observation', `days since the cut on ${r.checkedOn}`);
    if (r.daysSinceCut < 1 || r.daysSinceCut > MAX_CALIBRATION_DAYS) {
      skipped.push({ checkedOn: r.checkedOn, reason: `${r.daysSinceCut} days after the cut (readings of 1 to ${MAX_CALIBRATION_DAYS} days are used)` });
      continue;
    }
    if (r.predictedGrowthMm < MIN_PREDICTED_GROWTH_MM) {
      skipped.push({ checkedOn: r.checkedOn, reason: `too little growth predicted (${Math.round(r.predictedGrowthMm * 10) / 10} mm) to compare` });
      continue;
    }
    const observedMm = Math.max(0, r.measuredHeightMm - r.hocMm);
    used.push({ checkedOn: r.checkedOn, daysSinceCut: r.daysSinceCut, measuredHeightMm: r.measuredHeightMm, observedMm, predictedMm: r.predictedGrowthMm, ratio: observedMm / r.predictedGrowthMm });
  }
  const n = used.length;
  if (n === 0) return { factor: 1, n: 0, spread: null, confidence: 'none', readings: used, skipped };
  const sumObserved = used.reduce((s, r) => s + r.observedMm, 0);
  const sumPredicted = used.reduce((s, r) => s + r.predictedMm, 0);
  if (sumPredicted <= 0) fail('no_growth_days', 'the readings cover no predicted growth');
  const factor = sumObserved / sumPredicted;
  let spread: number | null = null;
  if (n >= 2) {
    const mean = used.reduce((s, r) => s + r.ratio, 0) / n;
    spread = Math.sqrt(used.reduce((s, r) => s + (r.ratio - mean) ** 2, 0) / (n - 1));
  }
  const confidence: CalibrationConfidence = n < 3 || (spread ?? Infinity) > 0.5 ? 'low' : n < 6 || spread! > 0.25 ? 'medium' : 'high';
  return { factor, n, spread, confidence, readings: used, skipped };
}
