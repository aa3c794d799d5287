import { describe, expect, test } from 'vitest';
import { crewRatePerHour, DEFAULT_COSTS, fuelRateForUnits, fuelRateFromUnits, priceForUnits, priceFromUnits, priceUnit } from './costs.ts';
import { costSettingsSchema } from './schemas/costs.ts';

describe('costs and rates', () => {
  test('should start from values the schema accepts', () => {
    expect(costSettingsSchema.parse(DEFAULT_COSTS)).toEqual(DEFAULT_COSTS);
  });

  test('should take a crew’s own rate, else the department’s', () => {
    const costs = { labourRatePerHour: 38, crewRates: [{ crewId: 4, ratePerHour: 55 }] };
    expect(crewRatePerHour(costs, 4)).toBe(55);
    expect(crewRatePerHour(costs, 5)).toBe(38);
    expect(crewRatePerHour(costs, null)).toBe(38);
  });

  // 1 US gallon = 3.785411784 L exactly (231 in³; NIST Handbook 44, Appendix C); 1 lb = 0.45359237 kg exactly.
  test('should show prices per gallon, 1,000 gallons and pound in imperial units, and back', () => {
    expect(priceForUnits(1, 'litre', 'imperial')).toBeCloseTo(3.785411784, 9);
    expect(priceForUnits(1.3, 'cubic_metre', 'imperial')).toBeCloseTo(4.921, 3);
    expect(priceForUnits(9, 'kilogram', 'imperial')).toBeCloseTo(4.082, 3);
    expect(priceForUnits(9, 'kilogram', 'metric')).toBe(9);
    for (const basis of ['litre', 'cubic_metre', 'kilogram'] as const) expect(priceFromUnits(priceForUnits(2.5, basis, 'imperial'), basis, 'imperial')).toBeCloseTo(2.5, 12);
    expect(priceUnit('cubic_metre', 'imperial')).toBe('1,000 gal');
    expect(priceUnit('litre', 'metric')).toBe('L');
    expect(fuelRateForUnits(3.785411784, 'imperial')).toBeCloseTo(1, 12);
    expect(fuelRateFromUnits(fuelRateForUnits(6, 'imperial'), 'imperial')).toBeCloseTo(6, 12);
  });
});
