import { describe, expect, test } from 'vitest';
import { actualBudgetFigures, outlookBudgetFigures, productKgApplied } from './budget.ts';
import { DEFAULT_COSTS } from './costs.ts';

const costs = { ...DEFAULT_COSTS, labourRatePerHour: 40, fuelPricePerL: 1.5, crewRates: [{ crewId: 7, ratePerHour: 55 }] };

describe('outlookBudgetFigures', () => {
  test('should price the outlook with the cost settings (hand-worked)', () => {
    const f = outlookBudgetFigures(
      [
        { mowingHours: 10, lineHours: 2, labourHours: 12, nKg: 20, waterM3: 100, paintConcentrateL: 30, mowerKind: 'reel' },
        { mowingHours: 4, lineHours: 0, labourHours: 4, nKg: 5, waterM3: 0, paintConcentrateL: 0, mowerKind: 'rotary' },
      ],
      costs,
    );
    // 16 h × 40; fuel 10 × 4 + 2 × 0.5 + 4 × 6 = 65 L × 1.5; N 25 kg × 4.5; 100 m³ × 1.3; 30 L × 3.2.
    expect(f.labour).toEqual({ quantity: 16, cost: 640 });
    expect(f.fuel).toEqual({ quantity: 65, cost: 97.5 });
    expect(f.fertiliser).toEqual({ quantity: 25, cost: 112.5 });
    expect(f.water.quantity).toBe(100);
    expect(f.water.cost).toBeCloseTo(130, 9);
    expect(f.paint.cost).toBeCloseTo(96, 9);
    expect(f.seed).toEqual({ quantity: 0, cost: 0 });
    expect(f.equipment).toEqual({ quantity: 16, cost: null });
  });
});

describe('actualBudgetFigures', () => {
  test('should price each crew at its own rate and fuel by the kind of machine (hand-worked)', () => {
    const f = actualBudgetFigures(
      { hoursByCrew: [{ crewId: 7, hours: 2 }, { crewId: null, hours: 3 }], hoursByEquipment: [{ kind: 'sprayer', hours: 1.5 }], nKg: 2, waterM3: 10, paintConcentrateL: 4, seedKg: 5 },
      costs,
    );
    // 2 h × 55 + 3 h × 40; 1.5 h × 2 L/h = 3 L × 1.5.
    expect(f.labour).toEqual({ quantity: 5, cost: 230 });
    expect(f.fuel).toEqual({ quantity: 3, cost: 4.5 });
    expect(f.seed).toEqual({ quantity: 5, cost: 45 });
    expect(f.equipment).toEqual({ quantity: 1.5, cost: null });
  });
});

describe('productKgApplied', () => {
  test('should convert label rates by weight and refuse the others', () => {
    expect(productKgApplied(25, 'g/m²', 1000)).toBe(25);
    expect(productKgApplied(250, 'kg/ha', 1000)).toBe(25);
    // 1 lb/1,000 ft² over 1,000 ft² (92.90304 m², exact) is one pound, 0.45359237 kg.
    expect(productKgApplied(1, 'lb/1000 ft²', 92.90304)).toBeCloseTo(0.45359237, 12);
    expect(productKgApplied(16, 'oz/1000 ft²', 92.90304)).toBeCloseTo(0.45359237, 12);
    expect(productKgApplied(3, 'L/ha', 1000)).toBeNull();
  });
});
