import { describe, expect, test } from 'vitest';
import { DEFAULT_COSTS } from './costs.ts';
import { addDaysIso } from './engine/dates.ts';
import { aggregateOutlooks, fieldOutlook, prepareWeather, type DailyWeather, type OutlookField } from './engine/outlook.ts';
import { DEFAULT_PARAMETERS, DEFAULT_STANDARDS } from './engine/standards.ts';
import { whatIf } from './what-if.ts';

function season(days: number): DailyWeather[] {
  return Array.from({ length: days }, (_, i) => {
    const t = 13 - 12 * Math.cos((2 * Math.PI * (i - 15)) / 365);
    return { date: addDaysIso('2025-03-01', i), tmaxC: t + 8, tminC: t - 4, rainMm: i % 6 === 0 ? 9 : 0 };
  });
}
const weather = prepareWeather(season(200), { latDeg: 38, elevationM: 100 });
const base = { sport: 'soccer', grass: 'tall_fescue', clippings: 'returned', irrigation: 'automatic' } as const;
const fields: OutlookField[] = [
  { ...base, id: 1, districtId: 'north', areaM2: 7000, maintenanceLevel: 2 },
  { ...base, id: 2, districtId: 'north', areaM2: 5000, maintenanceLevel: 3, sport: 'lawn' },
  { ...base, id: 3, districtId: 'south', areaM2: 8000, maintenanceLevel: 3 },
  { ...base, id: 4, districtId: 'south', areaM2: 6000, maintenanceLevel: 1 },
];
const inputs = fields.map((field) => ({ field, weather }));
const costs = { ...DEFAULT_COSTS, labourRatePerHour: 40 };

/** Two outlooks worked out independently by the engine, field by field. */
function outlookOf(fs: OutlookField[], standards = DEFAULT_STANDARDS) {
  return aggregateOutlooks(fs.map((f) => fieldOutlook(f, weather, standards, DEFAULT_PARAMETERS)));
}

describe('whatIf', () => {
  test('should give as the change the difference of the two engine outlooks, when fields move and a level changes', () => {
    const afterStandards = { ...DEFAULT_STANDARDS, 3: { ...DEFAULT_STANDARDS[3], minMowingsPerWeek: 2, annualNShare: 0.9, lineRepaintDays: 7 } };
    const r = whatIf(inputs, DEFAULT_STANDARDS, DEFAULT_PARAMETERS, costs, { moves: [{ fieldId: 1, level: 4 }, { fieldId: 4, level: 2 }], standards: { 3: { minMowingsPerWeek: 2, annualNShare: 0.9, lineRepaintDays: 7 } } });
    const before = outlookOf(fields);
    const after = outlookOf(
      fields.map((f) => (f.id === 1 ? { ...f, maintenanceLevel: 4 as const } : f.id === 4 ? { ...f, maintenanceLevel: 2 as const } : f)),
      afterStandards,
    );
    expect(r.fieldsTouched).toBe(4);
    for (const k of ['mowings', 'mowingHours', 'lineHours', 'labourHours', 'nKg', 'waterM3', 'paintConcentrateL'] as const) {
      expect(r.delta.totals[k]).toBeCloseTo(after.department[k] - before.department[k], 9);
      expect(r.byDistrict.south!.delta[k]).toBeCloseTo(after.byDistrict.south![k] - before.byDistrict.south![k], 9);
    }
    // The scenario changes the season: moving a level-2 field to 4 cuts its mowings.
    expect(r.delta.totals.mowings).not.toBe(0);
    // The change is priced with the cost settings: hours × the labour rate.
    expect(r.delta.lines.labour.cost).toBeCloseTo((after.department.labourHours - before.department.labourHours) * 40, 6);
    expect(r.delta.lines.water.cost).toBeCloseTo((after.department.waterM3 - before.department.waterM3) * DEFAULT_COSTS.waterPricePerM3, 6);
  });

  test('should change nothing for an empty scenario or a move to the same level, and leave the stored Standards as they were', () => {
    const level3 = { ...DEFAULT_STANDARDS[3] };
    const r = whatIf(inputs, DEFAULT_STANDARDS, DEFAULT_PARAMETERS, costs, { moves: [{ fieldId: 2, level: 3 }] });
    expect(r.fieldsTouched).toBe(0);
    expect(r.delta.totals.mowings).toBe(0);
    expect(r.delta.lines.labour).toEqual({ quantity: 0, cost: 0 });
    whatIf(inputs, DEFAULT_STANDARDS, DEFAULT_PARAMETERS, costs, { moves: [], standards: { 3: { minMowingsPerWeek: 4 } } });
    expect(DEFAULT_STANDARDS[3]).toEqual(level3);
  });
});
