import { DEFAULT_COSTS, L_PER_US_GALLON } from '@swardwise/domain';
import { describe, expect, test } from 'vitest';
import { bodyFrom, modelFrom } from './costsForm.ts';

const stored = { ...DEFAULT_COSTS, crewRates: [{ crewId: 9, ratePerHour: 50 }] };

describe('costs form', () => {
  test('should show prices per gallon, 1,000 gallons and pound in imperial units', () => {
    const m = modelFrom(stored, [3, 9], 'imperial');
    expect(m.prices.fuelPricePerL).toBe(3.79); // $1.00/L × 3.785 L/gal
    expect(m.prices.waterPricePerM3).toBe(4.92); // $1.30/m³ × 3.785 m³ per 1,000 gal
    expect(m.prices.seedPricePerKg).toBe(4.08); // $9/kg × 0.4536 kg/lb
    expect(m.fuel.reel_mower).toBe(1.06); // 4 L/h ÷ 3.785
    expect(m.crewRates).toEqual({ 3: null, 9: 50 });
  });

  test('should send untouched values exactly as stored, so display rounding never changes a price', () => {
    const m = modelFrom(stored, [3, 9], 'imperial');
    const body = bodyFrom(m, stored, 4, 'imperial');
    const { version, ...costs } = body;
    expect(version).toBe(4);
    expect(costs).toEqual(stored);
  });

  test('should convert a changed price back to SI and keep other crews’ rates', () => {
    const m = modelFrom(stored, [3], 'imperial');
    m.prices.fuelPricePerL = 4;
    m.crewRates[3] = 44;
    const body = bodyFrom(m, stored, 1, 'imperial');
    expect(body.fuelPricePerL).toBeCloseTo(4 / L_PER_US_GALLON, 6);
    expect(body.crewRates).toEqual([
      { crewId: 9, ratePerHour: 50 },
      { crewId: 3, ratePerHour: 44 },
    ]);
  });
});
