import { describe, expect, test } from 'vitest';
import { formatBearing, formatOutlineArea, latLngsOf, outlineFacts, polygonFromLatLngs } from './outline.ts';

// About 100 m × 60 m at 37.55° N: 1° of latitude ≈ 110,996 m, 1° of longitude ≈ 88,300 m.
const nsCorners = [
  { lat: 37.55, lng: -66.4 },
  { lat: 37.55, lng: -66.4 + 60 / 88_300 },
  { lat: 37.55 + 100 / 110_996, lng: -66.4 + 60 / 88_300 },
  { lat: 37.55 + 100 / 110_996, lng: -66.4 },
];

describe('outline', () => {
  test('should close the ring in [lng, lat] order and need three corners', () => {
    const polygon = polygonFromLatLngs(nsCorners)!;
    expect(polygon.coordinates[0]).toHaveLength(5);
    expect(polygon.coordinates[0]![0]).toEqual([-66.4, 37.55]);
    expect(polygon.coordinates[0]![4]).toEqual(polygon.coordinates[0]![0]);
    expect(polygonFromLatLngs(nsCorners.slice(0, 2))).toBeNull();
    expect(latLngsOf(polygon)).toEqual(nsCorners);
  });

  test('should measure a 100 m × 60 m outline and find its north–south long axis', () => {
    const facts = outlineFacts(polygonFromLatLngs(nsCorners)!);
    expect(facts.areaM2).toBeGreaterThan(5900);
    expect(facts.areaM2).toBeLessThan(6100);
    expect(facts.eastWest).toBe(false);
    expect(Math.min(facts.bearingDeg!, 180 - facts.bearingDeg!)).toBeLessThan(1);
  });

  test('should flag an outline whose long axis runs east–west', () => {
    const ew = nsCorners.map((c) => ({ lat: 37.55 + (c.lng + 66.4) * (88_300 / 110_996), lng: -66.4 + (c.lat - 37.55) * (110_996 / 88_300) }));
    const facts = outlineFacts(polygonFromLatLngs(ew)!);
    expect(facts.eastWest).toBe(true);
    expect(facts.bearingDeg!).toBeCloseTo(90, 0);
  });

  test('should show acres with square feet or hectares with square metres', () => {
    expect(formatOutlineArea(4046.8564224, 'imperial')).toBe('1.00 ac · 43,560 ft²');
    expect(formatOutlineArea(6000, 'metric')).toBe('0.60 ha · 6,000 m²');
    expect(formatBearing(92)).toBe('92° (E–W)');
    expect(formatBearing(0)).toBe('0° (N–S)');
  });
});
