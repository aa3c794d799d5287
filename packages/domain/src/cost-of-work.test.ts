import { describe, expect, test } from 'vitest';
import { costOfWork, NO_QUANTITIES } from './cost-of-work.ts';
import { DEFAULT_COSTS } from './costs.ts';

describe('costOfWork', () => {
  test('should price nothing at nothing', () => {
    expect(costOfWork(NO_QUANTITIES, DEFAULT_COSTS)).toEqual({ labour: 0, fuel: 0, fertiliser: 0, water: 0, paint: 0, seed: 0, colourant: 0, inputs: 0, total: 0 });
  });

  test('should price hours at the crew’s own rate and the rest at the department’s', () => {
    const costs = { ...DEFAULT_COSTS, labourRatePerHour: 40, crewRates: [{ crewId: 7, ratePerHour: 50 }] };
    // By hand: 10 h × $50 (crew 7) + 4 h × $40 (crew 8, no own rate) + 2.5 h × $40 (no crew) = 500 + 160 + 100 = $760.
    const cost = costOfWork({ ...NO_QUANTITIES, labour: [{ crewId: 7, hours: 10 }, { crewId: 8, hours: 4 }, { crewId: null, hours: 2.5 }] }, costs);
    expect(cost.labour).toBeCloseTo(760, 9);
    expect(cost.total).toBeCloseTo(760, 9);
  });

  test('should price fuel by machine kind and every input at its price', () => {
    const costs = { ...DEFAULT_COSTS, fuelPricePerL: 1.5, fuelLPerHour: { reel_mower: 4, spreader: 1 } };
    const cost = costOfWork(
      // A sprayer hour has no fuel rate set here: it burns nothing on the bill.
      { ...NO_QUANTITIES, machineHours: { reel_mower: 10, spreader: 2, sprayer: 3 }, fertiliserKgN: 20, waterM3: 100, paintL: 12, seedKg: 5, colourantL: 2 },
      costs,
    );
    // By hand: fuel (10 h × 4 L/h + 2 h × 1 L/h) × $1.50/L = 42 L × 1.5 = $63.
    expect(cost.fuel).toBeCloseTo(63, 9);
    // By hand with the starting prices: 20 kg N × $4.50 = 90; 100 m³ × $1.30 = 130; 12 L × $3.20 = 38.4; 5 kg × $9 = 45; 2 L × $8 = 16.
    expect(cost.fertiliser).toBeCloseTo(90, 9);
    expect(cost.water).toBeCloseTo(130, 9);
    expect(cost.paint).toBeCloseTo(38.4, 9);
    expect(cost.seed).toBeCloseTo(45, 9);
    expect(cost.colourant).toBeCloseTo(16, 9);
    expect(cost.inputs).toBeCloseTo(319.4, 9);
    expect(cost.total).toBeCloseTo(382.4, 9);
  });
});
