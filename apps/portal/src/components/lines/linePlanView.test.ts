import { describe, expect, test } from 'vitest';
import { rangeText, newLayout, segmentPath, segmentPoints } from './linePlanView.ts';

describe('linePlanView', () => {
  test('should flip y so the plan is not a mirror image of the map', () => {
    expect(segmentPath({ kind: 'line', from: [0, 0], to: [10, 5], label: 'x' }, 20)).toBe('M0.00 20.00L10.00 15.00');
  });

  test('should draw a full circle as two half arcs and a quarter arc with the small-arc flag', () => {
    expect(segmentPath({ kind: 'arc', center: [10, 10], radiusM: 2, startRad: 0, endRad: 2 * Math.PI, label: 'c' }, 20)).toBe('M12.00 10.00A2.00 2.00 0 0 0 8.00 10.00A2.00 2.00 0 0 0 12.00 10.00');
    expect(segmentPath({ kind: 'arc', center: [0, 0], radiusM: 1, startRad: 0, endRad: Math.PI / 2, label: 'c' }, 10)).toBe('M1.00 10.00A1.00 1.00 0 0 0 0.00 9.00');
  });

  test('should follow an arc in steps for the map', () => {
    const pts = segmentPoints({ kind: 'arc', center: [0, 0], radiusM: 9.15, startRad: 0, endRad: Math.PI, label: 'c' });
    expect(pts.length).toBeGreaterThan(30);
    for (const [x, y] of pts) expect(Math.hypot(x, y)).toBeCloseTo(9.15, 9);
  });

  test('should show the range and source of a dimension', () => {
    expect(rangeText('soccer_full', 'lengthM')).toBe('90–120 m (IFAB Laws of the Game, Law 1)');
    expect(rangeText('football', 'widthM')).toMatch(/^fixed at 48.77 m/);
    expect(rangeText('baseball', 'widthM')).toBeNull();
    expect(newLayout('soccer_7v7', '#1f6fd1')).toMatchObject({ lengthM: 55, widthM: 36, rotationDeg: 0 });
  });
});
