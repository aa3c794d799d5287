import { describe, expect, test } from 'vitest';
import turfDistance from '@turf/distance';
import { crewWeekLoad, effectiveFieldCapacityAcPerH, effectiveFieldCapacityHaPerH, greatCircleKm, hoursPerMowing, hoursPerMowingPolygon, stripePassPlan, trailerTrip } from './labour.ts';
import type { Polygon } from '../schemas/common.ts';

const mower = { widthM: 2, overlapM: 0, speedKmh: 6, turnTimeS: 36, efficiency: 0.8 };

describe('labour', () => {
  test('should compute effective field capacity in both unit systems', () => {
    expect(effectiveFieldCapacityHaPerH(8, 2, 0.8)).toBeCloseTo(1.28, 12);
    expect(effectiveFieldCapacityAcPerH(5, 6, 0.8)).toBeCloseTo(2.909, 3);
  });

  test('should give hours per mowing from area', () => {
    // 1.28 ha/h → 1 ha in 0.78125 h.
    expect(hoursPerMowing(10_000, { speedKmh: 8, widthM: 2, efficiency: 0.8 })).toBeCloseTo(0.78125, 12);
    expect(hoursPerMowing(0, mower)).toBe(0);
  });

  test('should give hours per mowing for a polygon from its geodesic area', () => {
    const square: Polygon = { type: 'Polygon', coordinates: [[[0, 0], [0.001, 0], [0.001, 0.001], [0, 0.001], [0, 0]]] };
    const h = hoursPerMowingPolygon(square, mower);
    // ~111.3 m × 110.6 m ≈ 1.23 ha at 0.96 ha/h.
    expect(h).toBeGreaterThan(1.2);
    expect(h).toBeLessThan(1.35);
  });

  test('should plan passes lengthwise, side to side and criss-cross', () => {
    const len = stripePassPlan(100, 60, mower, 'lengthwise');
    expect(len.passes).toEqual([30]);
    expect(len.turns).toBe(29);
    expect(len.distanceM).toBe(3000);
    expect(len.hours).toBeCloseTo(3 / 6 + (29 * 36) / 3600, 12);
    const side = stripePassPlan(100, 60, mower, 'side_to_side');
    expect(side.passes).toEqual([50]);
    expect(side.distanceM).toBe(3000);
    expect(side.hours).toBeGreaterThan(len.hours);
    const criss = stripePassPlan(100, 60, mower, 'criss_cross');
    expect(criss.passes).toEqual([30, 50]);
    expect(criss.hours).toBeCloseTo(len.hours + side.hours, 12);
  });

  test('should count extra passes for overlap', () => {
    expect(stripePassPlan(100, 60, { ...mower, overlapM: 0.1 }, 'lengthwise').passes).toEqual([32]);
    // 5 passes of a 2.1 m mower with 0.1 m overlap cover 5 × 2.1 − 4 × 0.1 = 10.1 m exactly
    // (the count was ⌈10.1 ÷ 2.0⌉ = 6, one pass too many).
    expect(stripePassPlan(100, 10.1, { ...mower, widthM: 2.1, overlapM: 0.1 }, 'lengthwise').passes).toEqual([5]);
    expect(stripePassPlan(100, 10.2, { ...mower, widthM: 2.1, overlapM: 0.1 }, 'lengthwise').passes).toEqual([6]);
    expect(stripePassPlan(100, 1, { ...mower, widthM: 2.1, overlapM: 0.1 }, 'lengthwise').passes).toEqual([1]);
    expect(() => stripePassPlan(100, 60, { ...mower, overlapM: 2 }, 'lengthwise')).toThrow(expect.objectContaining({ code: 'engine/invalid_overlap' }));
  });

  test('should match @turf/distance for the great circle', () => {
    const a = { lat: 40.1, lng: -88.2 };
    const b = { lat: 40.25, lng: -88.05 };
    expect(greatCircleKm(a, b)).toBeCloseTo(turfDistance([a.lng, a.lat], [b.lng, b.lat], { units: 'kilometers' }), 9);
  });

  test('should time a trailer move with road factor and load/unload', () => {
    const a = { lat: 0, lng: 0 };
    const b = { lat: 0, lng: 0.1 };
    const t = trailerTrip(a, b, { roadFactor: 1.3, speedKmh: 40, loadUnloadMin: 15 });
    // 0.1° of longitude on the equator: 6371.0088 km × 0.1 × π/180.
    expect(t.greatCircleKm).toBeCloseTo(11.1195, 3);
    expect(t.roadKm).toBeCloseTo(t.greatCircleKm * 1.3, 12);
    expect(t.hours).toBeCloseTo(t.roadKm / 40 + 0.25, 12);
  });

  test('should report crew utilisation and overload', () => {
    expect(crewWeekLoad('c1', [10, 12, 8], 40)).toEqual({ crewId: 'c1', plannedHours: 30, availableHours: 40, utilisation: 0.75, overloaded: false, spareHours: 10 });
    expect(crewWeekLoad('c2', [25, 20], 40).overloaded).toBe(true);
  });

  test('should reject negative area, zero speed and bad efficiency', () => {
    expect(() => hoursPerMowing(-1, mower)).toThrow(expect.objectContaining({ code: 'engine/invalid_area' }));
    expect(() => effectiveFieldCapacityHaPerH(0, 2, 0.8)).toThrow(expect.objectContaining({ code: 'engine/invalid_speed' }));
    expect(() => effectiveFieldCapacityHaPerH(5, 2, 1.2)).toThrow(expect.objectContaining({ code: 'engine/invalid_efficiency' }));
    expect(() => greatCircleKm({ lat: 91, lng: 0 }, { lat: 0, lng: 0 })).toThrow(expect.objectContaining({ code: 'engine/invalid_latitude' }));
    expect(() => crewWeekLoad('c', [-1], 40)).toThrow(expect.objectContaining({ code: 'engine/invalid_hours' }));
  });
});
