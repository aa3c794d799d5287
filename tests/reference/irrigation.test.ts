/** Irrigation reference checks; each value names its source or label. */
import { describe, expect, test } from 'vitest';
import * as e from '@swardwise/domain/engine';

describe('water volume arithmetic', () => {
  test('should give 623.4 US gallons for 1 inch over 1,000 ft² (arithmetic)', () => {
    expect(e.depthMmOverAreaToUsGallons(25.4, e.ft2ToM2(1000))).toBeCloseTo(623.4, 1);
  });

  test('should give 27,154 gallons per acre-inch (arithmetic)', () => {
    expect(e.depthMmOverAreaToUsGallons(25.4, e.acresToM2(1))).toBeCloseTo(27154, 0);
  });
});

describe('precipitation rate = 96.25 × gpm ÷ ft² (common practice)', () => {
  test('should give 0.9625 in/h for 10 gpm over 1,000 ft² and the same in mm/h metrically', () => {
    expect(e.precipitationRateInPerH(10, 1000)).toBeCloseTo(0.9625, 12);
    const mm = e.precipitationRateMmPerH(e.usGallonsToLitres(10), e.ft2ToM2(1000));
    expect(e.mmToIn(mm)).toBeCloseTo(0.9625, 6);
  });
});

describe('distribution uniformity (UC Davis catch-can audits) and scheduling multiplier', () => {
  test('should give DU_LQ as the low-quarter mean over the overall mean', () => {
    // 12 cans, lowest quarter = 3 cans (0.20, 0.22, 0.24 → 0.22); mean 0.3.
    const cans = [0.2, 0.22, 0.24, 0.28, 0.3, 0.3, 0.32, 0.32, 0.34, 0.34, 0.36, 0.38];
    expect(e.distributionUniformityLowQuarter(cans)).toBeCloseTo(0.22 / 0.3, 9);
  });

  test('should give SM 1.22 at DU 0.70 (from memory)', () => {
    expect(e.schedulingMultiplier(0.7)).toBeCloseTo(1.22, 2);
  });

  test('should take the gross need as net × SM with SM(0.7) = 1.2195, one method (irrigation associations; REFERENCES, added after the first audit)', () => {
    expect(e.schedulingMultiplier(0.7)).toBeCloseTo(1.2195, 4);
    expect(e.grossIrrigationMm(10, 0.7)).toBeCloseTo(12.195, 3);
    expect(e.DEFAULT_PARAMETERS.irrigation.distributionUniformity).toBe(0.7);
  });
});

describe('turf crop coefficients for irrigation budgets (University of California ANR turfgrass water guidance; Meyer et al. 1985)', () => {
  test('should default to about 0.8 cool-season and 0.6 warm-season, below FAO-56 Table 12 for a full grass cover', () => {
    expect(e.DEFAULT_PARAMETERS.turfKc.cool).toBe(0.8);
    expect(e.DEFAULT_PARAMETERS.turfKc.warm).toBe(0.6);
    expect(e.departmentTurfKc('cool', false, e.DEFAULT_PARAMETERS.turfKc)).toBeLessThan(e.turfKc('cool', { stage: 'mid' }));
    expect(e.departmentTurfKc('warm', false, e.DEFAULT_PARAMETERS.turfKc)).toBeLessThan(e.turfKc('warm', { stage: 'mid' }));
  });

  test('should take 0.10 off where a level keeps growth slow (FAO-56 Table 12 note)', () => {
    expect(e.departmentTurfKc('cool', true, e.DEFAULT_PARAMETERS.turfKc)).toBeCloseTo(0.7, 12);
  });
});

describe('effective rain (Texas A&M TexasET network rule)', () => {
  test('should lose the first 0.1 in', () => {
    expect(e.effectiveRainMm(e.inToMm(0.1))).toBe(0);
  });

  test('should count 0.40 in of a 0.5 in rain (derived)', () => {
    expect(e.mmToIn(e.effectiveRainMm(e.inToMm(0.5)))).toBeCloseTo(0.4, 9);
  });

  test('should count 1.23 in of a 1.5 in rain (derived)', () => {
    expect(e.mmToIn(e.effectiveRainMm(e.inToMm(1.5)))).toBeCloseTo(1.23, 2);
  });

  test('should count nothing more above 2 in', () => {
    expect(e.effectiveRainMm(e.inToMm(3))).toBeCloseTo(e.effectiveRainMm(e.inToMm(2)), 9);
  });
});
