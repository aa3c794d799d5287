/**
 * Feed plan: annual N, a monthly split by growth potential, applications within the
 * soluble-N limit, product mass from the analysis, and P and K from a soil test.
 */
import type { Grass, GrassSeason, Level } from '../vocabulary.ts';
import { fail, requireFraction, requireNonNegative, requirePositive, requireRange } from './check.ts';
import { growthPotential } from './growth.ts';
import { DEFAULT_PARAMETERS, DEFAULT_STANDARDS, grassSeason, levelStandard } from './standards.ts';
import type { DepartmentParameters, Standards } from './standards.ts';
import { gPerM2ToLbPer1000Ft2, lbPer1000Ft2ToGPerM2 } from './units.ts';

/** Annual N ranges per grass, lb N/1000 ft²/yr, with their sources. */
export const ANNUAL_N_RANGES_LB: Record<Grass, { low: number; high: number; source: string }> = {
  kentucky_bluegrass: { low: 3, high: 4, source: 'Penn State Extension, Nitrogen fertilizer programs for cool-season turfgrasses' },
  perennial_ryegrass: { low: 3, high: 4, source: 'Penn State Extension, Nitrogen fertilizer programs for cool-season turfgrasses' },
  fine_fescue: { low: 2, high: 2, source: 'Penn State Extension (about 2)' },
  tall_fescue: { low: 2, high: 4, source: 'University of Illinois (1995)' },
  bermudagrass: { low: 5, high: 7, source: 'LSU AgCenter (2003), athletic fields on native soil' },
  zoysiagrass: { low: 1, high: 3, source: 'from memory' },
  st_augustinegrass: { low: 2, high: 4, source: 'from memory' },
};

/**
 * How much returned clippings cut the N need as the turf ages (Qian et al. 2003, J. Environ.
 * Qual. 32:1694, a model study of Kentucky bluegrass lawns): about 25 % in the first ten
 * years, up to about 60 % after 50 years (published); the steps between, 33 % at 11–25 years
 * and 50 % at 26–50 years, are from memory.
 */
export const CLIPPINGS_N_REDUCTION_BY_AGE: ReadonlyArray<{ upToYears: number; reduction: number }> = [
  { upToYears: 10, reduction: 0.25 },
  { upToYears: 25, reduction: 0.33 },
  { upToYears: 50, reduction: 0.5 },
  { upToYears: Infinity, reduction: 0.6 },
];

/** Turf age assumed when a field's age is not known, years: young turf, the smallest reduction (stated default). */
export const DEFAULT_TURF_AGE_YEARS = 5;

/** Share (0–1) by which returned clippings cut the N need at a turf age (Qian et al. 2003; unknown age: young turf, 25 %). */
export function clippingsNReduction(turfAgeYears: number | null = null): number {
  const age = turfAgeYears === null ? DEFAULT_TURF_AGE_YEARS : requireNonNegative(turfAgeYears, 'invalid_turf_age', 'turf age (years)');
  return (CLIPPINGS_N_REDUCTION_BY_AGE.find((r) => age <= r.upToYears) ?? { reduction: 0.6 }).reduction;
}

/** Returned clippings on young turf cut the N need by about 25 % (Qian et al. 2003). */
export const CLIPPINGS_RETURNED_N_FACTOR = 1 - clippingsNReduction(null);

export interface AnnualNInput {
  grass: Grass;
  level: Level;
  clippings: 'returned' | 'removed';
  irrigated: boolean;
  /** Years since the turf was established; unknown (null or omitted): young turf is assumed. */
  turfAgeYears?: number | null;
}

export interface AnnualN {
  gPerM2: number;
  lbPer1000Ft2: number;
  rangeLb: { low: number; high: number; source: string };
  /** False when the level's share takes the rate below the published range (a department choice, not a published rate). */
  withinPublishedRange: boolean;
  reasons: string[];
}

const lbText = (lb: number) => String(Math.round(lb * 100) / 100);

/**
 * Annual N (g N/m²/yr) = base × level share × (1 − clippings reduction), where base is the
 * upper end of the grass's published range when irrigated and the lower end when not
 * (department rule), the level share comes from the Standards, and returned clippings cut
 * the need by 25–60 % with the age of the turf (Qian et al. 2003). Where the level's share
 * takes the rate below the published range (low-maintenance turf), the reasons say so: the
 * rate is then the department's choice, not the published one.
 */
export function annualNitrogen(input: AnnualNInput, standards: Standards = DEFAULT_STANDARDS): AnnualN {
  grassSeason(input.grass);
  const range = ANNUAL_N_RANGES_LB[input.grass];
  const std = levelStandard(input.level, standards);
  if (input.clippings !== 'returned' && input.clippings !== 'removed') fail('invalid_clippings', `clippings must be returned or removed (got ${JSON.stringify(input.clippings)})`);
  const reasons: string[] = [];
  const base = input.irrigated ? range.high : range.low;
  let lb = base * std.annualNShare;
  const below = lb < range.low - 1e-9;
  if (below) {
    reasons.push(`${lbText(lb)} lb N/1000 ft²/yr: level ${std.level} (${std.name}) receives ${Math.round(std.annualNShare * 100)} % of ${base} lb, below the published ${range.low}–${range.high} lb for maintained turf (${range.source}); a department choice for low-maintenance turf, not a published rate`);
  } else {
    reasons.push(`${input.irrigated ? 'irrigated: upper' : 'not irrigated: lower'} end of ${range.low}–${range.high} lb N/1000 ft²/yr (${range.source})`);
    reasons.push(`level ${std.level} (${std.name}) receives ${Math.round(std.annualNShare * 100)} %`);
  }
  if (input.clippings === 'returned') {
    const cut = clippingsNReduction(input.turfAgeYears ?? null);
    lb *= 1 - cut;
    const age = input.turfAgeYears === null || input.turfAgeYears === undefined ? 'turf age not recorded: young turf assumed' : `turf ${input.turfAgeYears} years old`;
    reasons.push(`clippings returned: −${Math.round(cut * 100)} % (${age}; Qian et al. 2003)`);
  }
  return { gPerM2: lbPer1000Ft2ToGPerM2(lb), lbPer1000Ft2: lb, rangeLb: range, withinPublishedRange: !below, reasons };
}

/**
 * Monthly split of annual N in proportion to growth potential over monthly mean temperatures
 * (Gelernter & Stowell 2005 curve). Months with GP below `minGp` (default 0.1, department rule:
 * dormant turf is not fed) get none and their share goes to the others.
 */
export function monthlyNSplit(annualGPerM2: number, monthlyMeanC: readonly number[], season: GrassSeason, minGp = 0.1): number[] {
  requireNonNegative(annualGPerM2, 'invalid_rate', 'annual N (g/m²)');
  if (monthlyMeanC.length !== 12) fail('invalid_monthly_series', `monthly mean temperatures need 12 values (got ${monthlyMeanC.length})`);
  const gp = monthlyMeanC.map((t) => growthPotential(t, season));
  const w = gp.map((g) => (g >= minGp ? g : 0));
  const sum = w.reduce((s, v) => s + v, 0);
  if (sum === 0) return w.map(() => 0);
  return w.map((v) => (annualGPerM2 * v) / sum);
}

/**
 * Monthly split of annual N in proportion to each month's mean daily growth potential (from
 * daily weather, Gelernter & Stowell 2005 curve). A month without weather (null) or with GP
 * below `minGp` (default 0.1, department rule: dormant turf is not fed) gets none and its
 * share goes to the others.
 */
export function monthlyNSplitByGp(annualGPerM2: number, monthlyMeanGp: readonly (number | null)[], minGp = 0.1): number[] {
  requireNonNegative(annualGPerM2, 'invalid_rate', 'annual N (g/m²)');
  if (monthlyMeanGp.length !== 12) fail('invalid_monthly_series', `monthly growth potential needs 12 values (got ${monthlyMeanGp.length})`);
  const w = monthlyMeanGp.map((g) => {
    if (g === null) return 0;
    requireFraction(g, 'invalid_gp', 'growth potential', true);
    return g >= minGp ? g : 0;
  });
  const sum = w.reduce((s, v) => s + v, 0);
  if (sum === 0) return w.map(() => 0);
  return w.map((v) => (annualGPerM2 * v) / sum);
}

/**
 * Largest N per application (g/m²). The soluble part of an application stays within the
 * soluble-N limit (LSU AgCenter: ≤ 1 lb N/1000 ft²): with slow-release share s of the
 * product's N, rate ≤ limit ÷ (1 − s), never above the department's slow-release ceiling
 * (this product's rule, no published source).
 */
export function maxNPerApplication(slowReleaseShare: number, params: Pick<DepartmentParameters, 'solubleNLimitGPerM2' | 'slowReleaseNCeilingGPerM2'> = DEFAULT_PARAMETERS): number {
  requireFraction(slowReleaseShare, 'invalid_share', 'slow-release share', true);
  const soluble = requirePositive(params.solubleNLimitGPerM2, 'invalid_rate', 'soluble-N limit (g/m²)');
  const ceiling = Math.max(soluble, params.slowReleaseNCeilingGPerM2);
  if (slowReleaseShare >= 1) return ceiling;
  return Math.min(ceiling, soluble / (1 - slowReleaseShare));
}

export interface NApplication {
  month: number;
  /** ISO date when a year is given. */
  date: string | null;
  nGPerM2: number;
}

/**
 * Applications for a monthly N plan: each month's N in ⌈N ÷ limit⌉ equal applications, spread
 * evenly through the month; no application exceeds `maxNPerApplication`.
 */
export function planNApplications(
  monthlyGPerM2: readonly number[],
  options: { slowReleaseShare?: number; year?: number; params?: Pick<DepartmentParameters, 'solubleNLimitGPerM2' | 'slowReleaseNCeilingGPerM2'> & Partial<Pick<DepartmentParameters, 'minNPerApplicationGPerM2'>> } = {},
): NApplication[] {
  if (monthlyGPerM2.length !== 12) fail('invalid_monthly_series', `monthly N (g/m²) needs 12 values (got ${monthlyGPerM2.length})`);
  const params = options.params ?? DEFAULT_PARAMETERS;
  const limit = maxNPerApplication(options.slowReleaseShare ?? 0, params);
  // Amounts too small for a spreader pass are carried forward into the next application.
  const minimum = Math.min(params.minNPerApplicationGPerM2 ?? 0, limit);
  const out: NApplication[] = [];
  const emit = (month: number, n: number) => {
    const count = Math.ceil(n / limit - 1e-9);
    const days = options.year === undefined ? 30 : new Date(Date.UTC(options.year, month, 0)).getUTCDate();
    for (let k = 0; k < count; k++) {
      const day = Math.min(days, Math.max(1, Math.round(((k + 0.5) * days) / count)));
      const date = options.year === undefined ? null : `${String(options.year).padStart(4, '0')}-${String(month).padStart(2, '0')}-${String(day).padStart(2, '0')}`;
      out.push({ month, date, nGPerM2: n / count });
    }
  };
  let carry = 0;
  let lastMonthWithN = 0;
  monthlyGPerM2.forEach((n, i) => {
    requireNonNegative(n, 'invalid_rate', 'monthly N (g/m²)');
    if (n <= 1e-9) return;
    lastMonthWithN = i + 1;
    carry += n;
    if (carry + 1e-9 < minimum) return;
    emit(i + 1, carry);
    carry = 0;
  });
  if (carry > 1e-9) {
    // The season's last small remainder joins the last application when it fits under the
    // limit; else the last application and the remainder are shared out in equal parts, each
    // above half the limit (so at or above the department's minimum wherever the minimum is at
    // most half the limit), never a small last pass below the minimum.
    const last = out[out.length - 1];
    if (!last) emit(lastMonthWithN, carry);
    else if (last.nGPerM2 + carry <= limit + 1e-9) last.nGPerM2 += carry;
    else {
      // The remainder comes from months after the last application (a month that reached the
      // minimum would have been applied), so the shares fall in the last application's month
      // and in the last month with N.
      const total = last.nGPerM2 + carry;
      const parts = Math.ceil(total / limit - 1e-9);
      last.nGPerM2 = total / parts;
      emit(lastMonthWithN, (total * (parts - 1)) / parts);
    }
  }
  return out;
}

/** A fertiliser's N–P–K analysis in percent by mass (P as P2O5, K as K2O, as on the label). */
export interface Analysis {
  n: number;
  p: number;
  k: number;
}

/** Product rate (same unit as the N rate) = N wanted ÷ (N % ÷ 100) (UNL Extension, Lawn fertilizer calculations). */
export function productRate(nRate: number, nPercent: number): number {
  requireNonNegative(nRate, 'invalid_rate', 'N rate');
  requireRange(nPercent, 0.1, 100, 'invalid_analysis', 'N percentage');
  return nRate / (nPercent / 100);
}

export interface ProductNeed {
  productGPerM2: number;
  productKg: number;
  bags: number;
  cost: number;
  /** P2O5 and K2O that come along, g/m². */
  p2o5GPerM2: number;
  k2oGPerM2: number;
}

/** Product mass, whole bags and cost for an N rate (g/m²) over an area (m²). */
export function productForArea(nGPerM2: number, analysis: Analysis, areaM2: number, bagKg: number, pricePerKg: number): ProductNeed {
  requireNonNegative(areaM2, 'invalid_area', 'area (m²)');
  requirePositive(bagKg, 'invalid_bag', 'bag size (kg)');
  requireNonNegative(pricePerKg, 'invalid_price', 'price per kg');
  for (const [k, v] of Object.entries(analysis)) requireRange(v, 0, 100, 'invalid_analysis', `${k.toUpperCase()} percentage`);
  if (analysis.n + analysis.p + analysis.k > 100) fail('invalid_analysis', 'N + P + K cannot exceed 100 %');
  const productGPerM2 = productRate(nGPerM2, analysis.n);
  const productKg = (productGPerM2 * areaM2) / 1000;
  return {
    productGPerM2,
    productKg,
    bags: Math.ceil(productKg / bagKg - 1e-9),
    cost: productKg * pricePerKg,
    p2o5GPerM2: (productGPerM2 * analysis.p) / 100,
    k2oGPerM2: (productGPerM2 * analysis.k) / 100,
  };
}

export interface SoilTest {
  /** Extractable P, ppm (the lab's method as the department uses it). */
  pPpm: number;
  /** Extractable K, ppm. */
  kPpm: number;
}

export interface PkRecommendation {
  p2o5GPerM2: number;
  k2oGPerM2: number;
  basis: 'soil_test' | 'no_soil_test';
  notes: string[];
}

/**
 * P and K from a soil test by a simple sufficiency rule: below the department's sufficiency
 * level, apply its maintenance rate; at or above, none. The levels and rates are department
 * parameters, not published values. Without a soil test, no P (many places restrict P
 * without a test) and no K; the note asks for a test.
 */
export function phosphorusPotassium(test: SoilTest | null, params: Pick<DepartmentParameters, 'soilTest'> = DEFAULT_PARAMETERS): PkRecommendation {
  const s = params.soilTest;
  if (!test) return { p2o5GPerM2: 0, k2oGPerM2: 0, basis: 'no_soil_test', notes: ['no soil test on file: no P or K recommended; take a soil test'] };
  requireNonNegative(test.pPpm, 'invalid_soil_test', 'soil P (ppm)');
  requireNonNegative(test.kPpm, 'invalid_soil_test', 'soil K (ppm)');
  const notes: string[] = [];
  const p = test.pPpm < s.pSufficientPpm ? s.p2o5RateGPerM2 : 0;
  const k = test.kPpm < s.kSufficientPpm ? s.k2oRateGPerM2 : 0;
  notes.push(p > 0 ? `P ${test.pPpm} ppm is below the department's sufficiency level (${s.pSufficientPpm} ppm)` : `P ${test.pPpm} ppm is sufficient`);
  notes.push(k > 0 ? `K ${test.kPpm} ppm is below the department's sufficiency level (${s.kSufficientPpm} ppm)` : `K ${test.kPpm} ppm is sufficient`);
  return { p2o5GPerM2: p, k2oGPerM2: k, basis: 'soil_test', notes };
}

/** Monthly N in lb N/1000 ft², for display alongside g/m². */
export function monthlyNInLb(monthlyGPerM2: readonly number[]): number[] {
  return monthlyGPerM2.map(gPerM2ToLbPer1000Ft2);
}
