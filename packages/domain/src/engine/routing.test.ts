import { describe, expect, test } from 'vitest';
import { planRoute, tourLengthKm } from './routing.ts';

const yard = { lat: 40, lng: -88 };

describe('routing', () => {
  test('should visit points on a line in order out and back', () => {
    const stops = [
      { id: 3, lat: 40, lng: -87.97 },
      { id: 1, lat: 40, lng: -87.99 },
      { id: 2, lat: 40, lng: -87.98 },
    ];
    const r = planRoute(yard, stops, { roadFactor: 1, speedKmh: 30 });
    expect(r.order).toEqual([1, 2, 3]);
    expect(r.legsKm).toHaveLength(4);
    expect(r.totalKm).toBeCloseTo(tourLengthKm(yard, [stops[1]!, stops[2]!, stops[0]!]), 9);
    expect(r.driveHours).toBeCloseTo(r.totalKm / 30, 12);
  });

  test('should untangle a crossing tour with 2-opt', () => {
    const square = [
      { id: 'a', lat: 40.01, lng: -88 },
      { id: 'b', lat: 40.01, lng: -87.99 },
      { id: 'c', lat: 40, lng: -87.99 },
    ];
    const r = planRoute(yard, [square[1]!, square[0]!, square[2]!], { roadFactor: 1 });
    const best = Math.min(tourLengthKm(yard, square), tourLengthKm(yard, [...square].reverse()));
    expect(r.totalKm).toBeCloseTo(best, 9);
  });

  test('should be deterministic and break ties by id', () => {
    const a = { id: 'b', lat: 40.01, lng: -88 };
    const b = { id: 'a', lat: 39.99, lng: -88 };
    expect(planRoute(yard, [a, b]).order[0]).toBe('a');
    expect(planRoute(yard, [b, a]).order[0]).toBe('a');
  });

  test('should handle an empty day and reject duplicates', () => {
    expect(planRoute(yard, [])).toEqual({ order: [], legsKm: [], totalKm: 0, driveHours: 0 });
    expect(() => planRoute(yard, [{ id: 1, lat: 40, lng: -88 }, { id: 1, lat: 40, lng: -88 }])).toThrow(expect.objectContaining({ code: 'engine/duplicate_stop' }));
    expect(() => planRoute(yard, [], { roadFactor: 0.5 })).toThrow(expect.objectContaining({ code: 'engine/invalid_road_factor' }));
  });
});
