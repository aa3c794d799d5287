/**
 * Growth potential and daily vertical growth.
 * GP = exp(−½((T − To)/σ)²) — Gelernter & Stowell (2005), Golf Course Management,
 * "Improved overseeding programs 1: the role of weather". To = 20 °C cool-season,
 * 31 °C warm-season (published); σ = 5.5 °C cool, 7 °C warm (from memory). The warm-season
 * curve is held at 1 from its optimum up, as in the model authors' later revision: warm-season
 * grasses do not slow down in the heat the way the bell curve's right side would say.
 */
import type { GrassSeason } from '../vocabulary.ts';
import { fail, requireFraction, requireNonNegative, requirePositive, requireTemperature } from './check.ts';

/**
 * Curve parameters: To published (Gelernter & Stowell 2005); σ from memory; the warm-season
 * plateau above To from the model authors' later revision.
 */
export const GP_CURVES: Record<GrassSeason, { optimumC: number; sigmaC: number; plateauAboveOptimum: boolean }> = {
  cool: { optimumC: 20, sigmaC: 5.5, plateauAboveOptimum: false },
  warm: { optimumC: 31, sigmaC: 7, plateauAboveOptimum: true },
};

/**
 * Growth potential 0–1 for a mean daily air temperature (°C) (Gelernter & Stowell 2005);
 * warm-season GP is 1 from its optimum (31 °C) up (the authors' later revision).
 */
export function growthPotential(tMeanC: number, season: GrassSeason): number {
  requireTemperature(tMeanC, 'mean temperature');
  const curve = GP_CURVES[season];
  if (!curve) fail('unknown_season', `grass season must be cool or warm (got ${JSON.stringify(season)})`);
  if (curve.plateauAboveOptimum && tMeanC >= curve.optimumC) return 1;
  const z = (tMeanC - curve.optimumC) / curve.sigmaC;
  return Math.exp(-0.5 * z * z);
}

/**
 * Mean temperature (°C) at which the cool- and warm-season curves give the same GP, between
 * the two optima: (T − To,cool)/σcool = (To,warm − T)/σwarm. Derived, about 24.8 °C.
 */
export function gpCrossoverC(): number {
  const c = GP_CURVES.cool;
  const w = GP_CURVES.warm;
  return (c.optimumC * w.sigmaC + w.optimumC * c.sigmaC) / (c.sigmaC + w.sigmaC);
}

/** Growth modifiers, each 0–1 (1 = not limiting). */
export interface GrowthModifiers {
  nitrogen?: number;
  water?: number;
}

/**
 * Daily vertical growth, mm/day = max rate (mm/day at GP = 1) × GP × N modifier × water
 * modifier. The product form is this product's model (no published source).
 */
export function dailyGrowthMm(maxRateMmPerDay: number, tMeanC: number, season: GrassSeason, modifiers: GrowthModifiers = {}): number {
  requireNonNegative(maxRateMmPerDay, 'invalid_growth_rate', 'maximum growth rate (mm/day)');
  const n = requireFraction(modifiers.nitrogen ?? 1, 'invalid_modifier', 'nitrogen modifier', true);
  const w = requireFraction(modifiers.water ?? 1, 'invalid_modifier', 'water modifier', true);
  return maxRateMmPerDay * growthPotential(tMeanC, season) * n * w;
}

/** Least water modifier: turf keeps some growth under drought until dormancy (department model). */
export const WATER_MODIFIER_FLOOR = 0.2;

/**
 * Water modifier from supply vs demand over a period: min(1, supply ÷ ETc), never below
 * `floor` (turf keeps some growth until dormancy). Department model, no published source.
 */
export function waterModifier(supplyMm: number, etcMm: number, floor = WATER_MODIFIER_FLOOR): number {
  requireNonNegative(supplyMm, 'invalid_water', 'water supply (mm)');
  requireNonNegative(etcMm, 'invalid_water', 'ETc (mm)');
  if (etcMm === 0) return 1;
  return Math.max(floor, Math.min(1, supplyMm / etcMm));
}

/**
 * Nitrogen modifier from N applied vs planned in the recent period: 0.5 + 0.5 × min(1, ratio).
 * Department model, no published source: unfed turf still grows at about half rate.
 */
export function nitrogenModifier(appliedGPerM2: number, plannedGPerM2: number): number {
  requireNonNegative(appliedGPerM2, 'invalid_rate', 'N applied (g/m²)');
  requireNonNegative(plannedGPerM2, 'invalid_rate', 'N planned (g/m²)');
  if (plannedGPerM2 === 0) return 1;
  return 0.5 + 0.5 * Math.min(1, appliedGPerM2 / plannedGPerM2);
}

/** Daily growth series (mm/day) from daily mean temperatures, ready for `simulateMowing`. */
export function dailyGrowthSeriesMm(maxRateMmPerDay: number, dailyMeanC: readonly number[], season: GrassSeason, modifiers: GrowthModifiers = {}): number[] {
  return dailyMeanC.map((t) => dailyGrowthMm(maxRateMmPerDay, t, season, modifiers));
}

/** Growth (mm) over a series of daily mean temperatures at a given max rate. */
export function growthOverDaysMm(maxRateMmPerDay: number, dailyMeanC: readonly number[], season: GrassSeason, modifiers: GrowthModifiers = {}): number {
  let sum = 0;
  for (const t of dailyMeanC) sum += dailyGrowthMm(maxRateMmPerDay, t, season, modifiers);
  return sum;
}

/** One field check used to calibrate a field's maximum growth rate. */
export interface GrowthObservation {
  /** Measured grass height at the check, mm. */
  measuredHeightMm: number;
  /** HOC of the last cut, mm. */
  hocAfterCutMm: number;
  /** Days since that cut; must equal the length of `dailyMeanC`. */
  daysSinceCut: number;
  /** Mean daily air temperatures (°C) of each day between the cut and the check. */
  dailyMeanC: readonly number[];
  /** Growth modifiers for the period (default 1). */
  modifiers?: GrowthModifiers;
}

export interface GrowthCalibration {
  /** Fitted maximum vertical growth rate, mm/day at GP = 1. */
  maxRateMmPerDay: number;
  n: number;
  /** Coefficient of determination of the fit (can be negative for a very poor fit). */
  rSquared: number;
  /** Standard error of the fitted rate, mm/day (NaN when n < 2). */
  standardError: number;
  confidence: 'low' | 'medium' | 'high';
  /** Residuals (observed − fitted growth, mm) in the order of the observations. */
  residualsMm: number[];
}

/**
 * Least-squares fit of a field's own maximum growth rate from field checks: the model is
 * growth = Gmax × Σ(GP × modifiers) (regression through the origin; Gmax = Σxy / Σx²).
 * Confidence is low when n < 3 or R² < 0.5, medium when n < 6 or R² < 0.8, else high
 * (department rule).
 */
export function calibrateMaxGrowthRate(observations: readonly GrowthObservation[], season: GrassSeason): GrowthCalibration {
  if (observations.length === 0) fail('no_observations', 'calibration needs at least one field check');
  const xs: number[] = [];
  const ys: number[] = [];
  for (const [i, o] of observations.entries()) {
    requirePositive(o.hocAfterCutMm, 'invalid_hoc', `observation ${i + 1}: HOC after cut (mm)`);
    requirePositive(o.measuredHeightMm, 'invalid_height', `observation ${i + 1}: measured height (mm)`);
    if (o.dailyMeanC.length !== o.daysSinceCut || o.daysSinceCut < 1) {
      fail('invalid_observation', `observation ${i + 1}: days since cut (${o.daysSinceCut}) must be ≥ 1 and match the ${o.dailyMeanC.length} daily temperatures`);
    }
    xs.push(growthOverDaysMm(1, o.dailyMeanC, season, o.modifiers));
    ys.push(o.measuredHeightMm - o.hocAfterCutMm);
  }
  let sxy = 0;
  let sxx = 0;
  for (let i = 0; i < xs.length; i++) {
    sxy += (xs[i] as number) * (ys[i] as number);
    sxx += (xs[i] as number) ** 2;
  }
  if (sxx === 0) fail('no_growth_days', 'the observations cover no growing days (GP = 0 throughout)');
  const rate = Math.max(0, sxy / sxx);
  const residualsMm = ys.map((y, i) => y - rate * (xs[i] as number));
  const ssRes = residualsMm.reduce((s, r) => s + r * r, 0);
  const meanY = ys.reduce((s, y) => s + y, 0) / ys.length;
  const ssTot = ys.reduce((s, y) => s + (y - meanY) ** 2, 0);
  const n = ys.length;
  const rSquared = ssTot === 0 ? (ssRes === 0 ? 1 : 0) : 1 - ssRes / ssTot;
  const standardError = n < 2 ? Number.NaN : Math.sqrt(ssRes / (n - 1) / sxx);
  const confidence = n < 3 || rSquared < 0.5 ? 'low' : n < 6 || rSquared < 0.8 ? 'medium' : 'high';
  return { maxRateMmPerDay: rate, n, rSquared, standardError, confidence, residualsMm };
}
