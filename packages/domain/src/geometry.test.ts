import { describe, expect, test } from 'vitest';
import { DomainError } from './errors.ts';
import { longAxis, polygonAreaM2 } from './geometry.ts';
import type { Polygon } from './schemas/common.ts';
import { rotatedRect } from './testing/fixtures.ts';

describe('longAxis', () => {
  test.each([0, 10, 30, 44, 60, 90, 120, 170])('should find the bearing of a 105 × 68 m pitch turned to %d°', (bearing) => {
    const axis = longAxis(rotatedRect(37.55, -66.4, 105, 68, bearing));
    const diff = Math.abs(((axis.bearingDeg - bearing + 90) % 180) - 90);
    expect(diff).toBeLessThan(0.5);
    expect(axis.lengthM).toBeGreaterThan(104);
    expect(axis.lengthM).toBeLessThan(106);
    expect(axis.widthM).toBeGreaterThan(67);
    expect(axis.widthM).toBeLessThan(69);
  });

  test('should flag a field whose long axis runs east–west (common practice prefers north–south)', () => {
    expect(longAxis(rotatedRect(37.55, -66.4, 105, 68, 80)).eastWest).toBe(true);
    expect(longAxis(rotatedRect(37.55, -66.4, 105, 68, 100)).eastWest).toBe(true);
    expect(longAxis(rotatedRect(37.55, -66.4, 105, 68, 15)).eastWest).toBe(false);
    expect(longAxis(rotatedRect(37.55, -66.4, 105, 68, 165)).eastWest).toBe(false);
  });

  test('should refuse a degenerate outline', () => {
    const line: Polygon = { type: 'Polygon', coordinates: [[[0, 0], [0, 0.001], [0, 0.002], [0, 0]]] };
    expect(() => longAxis(line)).toThrow(DomainError);
  });
});

describe('polygonAreaM2', () => {
  test('should give a 105 × 68 m pitch about 7,140 m²', () => {
    const area = polygonAreaM2(rotatedRect(37.55, -66.4, 105, 68, 20));
    expect(Math.abs(area - 7140) / 7140).toBeLessThan(0.01);
  });
});
