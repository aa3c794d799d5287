import { describe, expect, test } from 'vitest';
import { fieldFrame } from '../geometry.ts';
import { rotatedRect } from '../testing/fixtures.ts';
import { DEFAULT_PARAMETERS } from './standards.ts';
import { stripePassPlan } from './labour.ts';
import { fieldStripePlan, stripeMowerOf, stripeOfficialsNote, stripePlan } from './stripes.ts';

const rect = (l: number, w: number): Array<[number, number]> => [[0, 0], [l, 0], [l, w], [0, w]];
const mower = { widthM: 2, overlapM: 0, speedKmh: 6, efficiency: 0.8, turnTimeS: 15 };

describe('stripePlan', () => {
  test('should run length-wise passes along the long axis: ⌈width ÷ effective width⌉ passes of the length', () => {
    const plan = stripePlan(rect(100, 60), 'lengthwise', mower);
    // ⌈60 ÷ 2⌉ = 30 passes of 100 m.
    expect(plan.passes).toBe(30);
    expect(plan.directions[0]!.passes.every((p) => Math.abs(p.lengthM - 100) < 1e-9)).toBe(true);
    expect(plan.distanceM).toBeCloseTo(3000, 9);
    expect(plan.turns).toBe(29);
    // Every centre line runs along x, a half width in from the side at the first pass.
    const first = plan.directions[0]!.passes[0]!.pieces[0]!;
    expect(first.from[1]).toBeCloseTo(1, 9);
    expect(first.to[1]).toBeCloseTo(1, 9);
  });

  test('should run side-to-side passes across it: ⌈length ÷ effective width⌉ passes of the width', () => {
    const plan = stripePlan(rect(100, 60), 'side_to_side', mower);
    expect(plan.passes).toBe(50);
    expect(plan.distanceM).toBeCloseTo(3000, 9);
    const p = plan.directions[0]!.passes[0]!.pieces[0]!;
    expect(p.from[0]).toBeCloseTo(p.to[0], 9);
  });

  test('should make a checkerboard the sum of both directions', () => {
    const len = stripePlan(rect(100, 60), 'lengthwise', mower);
    const side = stripePlan(rect(100, 60), 'side_to_side', mower);
    const board = stripePlan(rect(100, 60), 'checkerboard', mower);
    expect(board.passes).toBe(len.passes + side.passes);
    expect(board.distanceM).toBeCloseTo(len.distanceM + side.distanceM, 9);
    expect(board.hours).toBeCloseTo(len.hours + side.hours, 12);
  });

  test('should cover the diagonal extent at 45° with about the same distance', () => {
    const plan = stripePlan(rect(100, 60), 'diagonal', mower);
    // Across 45° passes the rectangle is (100 + 60) ÷ √2 = 113.14 m wide: ⌈56.57⌉ = 57 passes.
    expect(plan.passes).toBe(57);
    expect(plan.directions[0]!.angleDeg).toBe(45);
    // The passes sweep the 6000 m² at 2 m: about 3000 m, less at the clipped corners.
    expect(plan.distanceM).toBeGreaterThan(2900);
    expect(plan.distanceM).toBeLessThan(3050);
  });

  test('should count overlap as stripePassPlan does', () => {
    const o = { ...mower, overlapM: 0.1 };
    expect(stripePlan(rect(100, 60), 'lengthwise', o).passes).toBe(stripePassPlan(100, 60, o, 'lengthwise').passes[0]);
    // 5 passes of a 2.1 m mower overlapping 0.1 m cover 5 × 2.1 − 4 × 0.1 = 10.1 m.
    expect(stripePlan(rect(100, 10.1), 'lengthwise', { ...o, widthM: 2.1 }).passes).toBe(5);
    expect(stripePlan(rect(100, 10.2), 'lengthwise', { ...o, widthM: 2.1 }).passes).toBe(6);
  });

  test('should time a plan against a hand-worked example', () => {
    // 100 × 60 m length-wise, 2 m cut, no overlap, 6 km/h, efficiency 0.8, 15 s a turn:
    // 30 passes × 100 m = 3.0 km; 3.0 km ÷ (6 km/h × 0.8 = 4.8 km/h) = 0.625 h;
    // 29 turns × 15 s = 435 s = 0.12083 h; total 0.74583 h = 44.75 min (0:45).
    const plan = stripePlan(rect(100, 60), 'lengthwise', mower);
    expect(plan.driveHours).toBeCloseTo(0.625, 12);
    expect(plan.turnHours).toBeCloseTo(435 / 3600, 12);
    expect(plan.hours).toBeCloseTo(0.745833, 5);
  });

  test('should split a pass that crosses a notch into pieces', () => {
    // An L-shaped outline: 100 × 60 with a 40 × 30 notch out of one corner.
    const ell: Array<[number, number]> = [[0, 0], [100, 0], [100, 30], [60, 30], [60, 60], [0, 60]];
    const side = stripePlan(ell, 'side_to_side', mower);
    expect(side.distanceM).toBeCloseTo(30 * 60 + 20 * 30, 6);
    const len = stripePlan(ell, 'lengthwise', mower);
    expect(len.distanceM).toBeCloseTo(15 * 100 + 15 * 60, 6);
  });

  test('should refuse a bad pattern and a bad mower', () => {
    expect(() => stripePlan(rect(100, 60), 'spiral' as never, mower)).toThrow(expect.objectContaining({ code: 'engine/invalid_pattern' }));
    expect(() => stripePlan(rect(100, 60), 'lengthwise', { ...mower, overlapM: 2 })).toThrow(expect.objectContaining({ code: 'engine/invalid_overlap' }));
    expect(() => stripePlan(rect(100, 60), 'lengthwise', { ...mower, efficiency: 0 })).toThrow(expect.objectContaining({ code: 'engine/invalid_efficiency' }));
  });
});

describe('fieldStripePlan', () => {
  test.each([0, 30, 100])('should plan a 105 × 67 m pitch turned to %d° in its own frame', (bearing) => {
    const plan = fieldStripePlan(rotatedRect(37.55, -66.4, 105, 67, bearing), 'lengthwise', mower);
    expect(plan.lengthM).toBeCloseTo(105, 0);
    expect(plan.widthM).toBeCloseTo(67, 0);
    // ⌈67 ÷ 2⌉ = 34 passes of 105 m along the long axis.
    expect(plan.passes).toBe(34);
    expect(plan.distanceM).toBeCloseTo(34 * 105, -1);
  });

  test('should turn the outline so its long axis runs along x', () => {
    const frame = fieldFrame(rotatedRect(37.55, -66.4, 105, 68, 60));
    expect(frame.lengthM).toBeGreaterThan(frame.widthM);
    expect(Math.min(...frame.points.map((p) => p[0]))).toBeCloseTo(0, 9);
  });
});

describe('stripeMowerOf', () => {
  test('should take a unit’s width, speed and efficiency with the department’s overlap and turn time', () => {
    const m = stripeMowerOf({ kind: 'reel_mower', cuttingWidthM: 2.5, speedKmh: 7, fieldEfficiency: 0.85 }, DEFAULT_PARAMETERS);
    expect(m).toEqual({ widthM: 2.5, speedKmh: 7, efficiency: 0.85, overlapM: DEFAULT_PARAMETERS.mowers.reel.overlapM, turnTimeS: DEFAULT_PARAMETERS.mowers.reel.turnTimeS });
    expect(stripeMowerOf(null, DEFAULT_PARAMETERS).widthM).toBe(DEFAULT_PARAMETERS.mowers.rotary.widthM);
  });
});

describe('stripeOfficialsNote', () => {
  test('should note officials on soccer and football for a busy pattern only', () => {
    expect(stripeOfficialsNote('soccer', 'checkerboard')).toMatch(/offside/);
    expect(stripeOfficialsNote('football', 'diagonal')).toMatch(/yard/);
    expect(stripeOfficialsNote('soccer', 'side_to_side')).toBeNull();
    expect(stripeOfficialsNote('football', 'lengthwise')).toBeNull();
    expect(stripeOfficialsNote('baseball', 'checkerboard')).toBeNull();
  });
});
