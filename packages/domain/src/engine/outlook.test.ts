import { describe, expect, test } from 'vitest';
import { addDaysIso } from './dates.ts';
import { aggregateOutlooks, fieldDailySeries, fieldOutlook, levelChangeDelta, prepareWeather } from './outlook.ts';
import type { DailyWeather, OutlookField } from './outlook.ts';

function season(days: number, opts: { rainEvery?: number; humid?: boolean } = {}): DailyWeather[] {
  const out: DailyWeather[] = [];
  for (let i = 0; i < days; i++) {
    const t = 13 - 12 * Math.cos((2 * Math.PI * (i - 15)) / 365);
    const d: DailyWeather = { date: addDaysIso('2025-01-01', i), tmaxC: t + 6, tminC: t - 6, rainMm: opts.rainEvery && i % opts.rainEvery === 0 ? 10 : 0 };
    if (opts.humid) Object.assign(d, { rhMaxPct: 90, rhMinPct: 50, windMs: 2 });
    out.push(d);
  }
  return out;
}

const field: OutlookField = { id: 'f1', districtId: 'north', areaM2: 7000, sport: 'soccer', grass: 'perennial_ryegrass', maintenanceLevel: 2, clippings: 'returned', irrigation: 'automatic' };

describe('outlook', () => {
  test('should prepare weather with Hargreaves when only temperatures exist', () => {
    const w = prepareWeather(season(30), { latDeg: 38, elevationM: 100 });
    expect(w.hargreavesDays).toBe(30);
    const pm = prepareWeather(season(30, { humid: true }), { latDeg: 38, elevationM: 100 });
    expect(pm.hargreavesDays).toBe(0);
    expect(pm.et0Mm[0]).toBeGreaterThan(0);
  });

  test('should give the daily series the outlook totals are made of', () => {
    const w = prepareWeather(season(120, { rainEvery: 5, humid: true }), { latDeg: 38, elevationM: 100 });
    const o = fieldOutlook(field, w);
    const d = fieldDailySeries(field, w);
    // The department's turf Kc (0.8 cool-season), not FAO-56 Table 12's 0.95 for a full grass cover.
    expect(d.kc).toBe(0.8);
    expect(d.share).toBe(0.8);
    expect(d.growthMm).toHaveLength(120);
    // Monday-to-Sunday weeks as the week plan's: 2025-01-01 is a Wednesday, so 5 + 16 × 7 + 3 days.
    expect(d.weeklyGrossMm).toHaveLength(18);
    expect(d.weeklyGrossMm.reduce((s, v) => s + v, 0)).toBeCloseTo(Array.from(d.irrigationMm).reduce((s, v) => s + v, 0), 9);
    expect(d.weeklyGrossMm.reduce((s, v) => s + v, 0)).toBeCloseTo(o.grossIrrigationMm, 9);
    expect(Array.from(d.etcMm).reduce((s, v) => s + v, 0)).toBeCloseTo(o.etcMm, 9);
    const dry = fieldDailySeries({ ...field, irrigation: 'none' }, w);
    expect(dry.share).toBe(0);
    expect(Math.max(...dry.grossNeedMm)).toBe(0);
  });

  test('should project a season with mowings, hours, N, water, paint and cost', () => {
    const w = prepareWeather(season(365, { rainEvery: 6 }), { latDeg: 38, elevationM: 100 });
    const o = fieldOutlook(field, w);
    expect(o.hocMm).toBe(31.75); // 1¼ in
    expect(o.mowerKind).toBe('rotary');
    expect(o.mowings).toBeGreaterThan(40);
    expect(o.mowingHours).toBeGreaterThan(0);
    expect(o.waterM3).toBeGreaterThan(0);
    expect(o.paintConcentrateL).toBeGreaterThan(0);
    expect(o.nKg).toBeCloseTo((o.nGPerM2 * 7000) / 1000, 9);
    expect(o.cost.total).toBeCloseTo(o.cost.labour + o.cost.water + o.cost.paint + o.cost.fertiliser, 9);
    expect(o.overdueDays).toBe(0);
  });

  test("should use a field's calibrated growth rate: faster growth, more mowings", () => {
    const w = prepareWeather(season(365, { rainEvery: 6 }), { latDeg: 38, elevationM: 100 });
    const slow = fieldOutlook({ ...field, maxGrowthMmPerDay: 2 }, w);
    const fast = fieldOutlook({ ...field, maxGrowthMmPerDay: 8 }, w);
    expect(fast.mowings).toBeGreaterThan(slow.mowings);
    expect(fast.mowingHours).toBeGreaterThan(slow.mowingHours);
  });

  test('should grow less without irrigation in a dry spell', () => {
    const w = prepareWeather(season(365), { latDeg: 38, elevationM: 100 });
    const wet = fieldOutlook({ ...field, maintenanceLevel: 3 }, w);
    const dry = fieldOutlook({ ...field, maintenanceLevel: 3, irrigation: 'none' }, w);
    expect(dry.mowings).toBeLessThan(wet.mowings);
    expect(dry.waterM3).toBe(0);
  });

  test('should cost less at a lower level and give the delta', () => {
    const w = prepareWeather(season(365, { rainEvery: 6 }), { latDeg: 38, elevationM: 100 });
    const d = levelChangeDelta(field, 2, 4, w);
    expect(d.to.waterM3).toBe(0);
    expect(d.to.paintConcentrateL).toBe(0);
    expect(d.delta.cost.total).toBeLessThan(0);
    expect(d.delta.mowings).toBe(d.to.mowings - d.from.mowings);
    expect(d.delta.fields).toBe(0);
  });

  test('should aggregate to district and department', () => {
    const w = prepareWeather(season(120), { latDeg: 38, elevationM: 100 });
    const rs = [fieldOutlook(field, w), fieldOutlook({ ...field, id: 'f2' }, w), fieldOutlook({ ...field, id: 'f3', districtId: 'south' }, w)];
    const agg = aggregateOutlooks(rs);
    expect(agg.byDistrict.north?.fields).toBe(2);
    expect(agg.byDistrict.south?.fields).toBe(1);
    expect(agg.department.labourHours).toBeCloseTo(rs.reduce((s, r) => s + r.labourHours, 0), 9);
  });

  test('should reject gaps, empty series and bad weather', () => {
    const days = season(5);
    expect(() => prepareWeather([days[0]!, days[2]!], { latDeg: 38, elevationM: 0 })).toThrow(expect.objectContaining({ code: 'engine/weather_gap' }));
    expect(() => prepareWeather([], { latDeg: 38, elevationM: 0 })).toThrow(expect.objectContaining({ code: 'engine/empty_weather' }));
    expect(() => prepareWeather([{ ...days[0]!, tminC: 30, tmaxC: 20 }], { latDeg: 38, elevationM: 0 })).toThrow(expect.objectContaining({ code: 'engine/invalid_temperature' }));
    expect(() => prepareWeather([{ ...days[0]!, rainMm: -3 }], { latDeg: 38, elevationM: 0 })).toThrow(expect.objectContaining({ code: 'engine/invalid_rain' }));
    const w = prepareWeather(days, { latDeg: 38, elevationM: 0 });
    expect(() => fieldOutlook({ ...field, areaM2: -5 }, w)).toThrow(expect.objectContaining({ code: 'engine/invalid_area' }));
    expect(() => fieldOutlook({ ...field, maxGrowthMmPerDay: -1 }, w)).toThrow(expect.objectContaining({ code: 'engine/invalid_growth_rate' }));
    expect(() => fieldOutlook({ ...field, grass: 'moss' as never }, w)).toThrow(expect.objectContaining({ code: 'engine/unknown_grass' }));
  });
});
