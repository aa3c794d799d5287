/** Line plan reference checks: layout sizes inside the governing bodies' ranges, set-out sheets that close. */
import { describe, expect, test } from 'vitest';
import * as e from '@swardwise/domain/engine';
import { fieldFrame, fieldFrameToLngLat, setFieldLinePlanSchema, type Polygon } from '@swardwise/domain';

const field = { lengthM: 130, widthM: 90 };
const placed = (layout: e.LineLayout, dims: { lengthM?: number; widthM?: number } = {}, at: Partial<e.PlanLayout> = {}, shift?: e.SeasonShift) => {
  const t = e.layoutTemplate(layout, dims);
  const p = e.placement(t, { layout, alongM: 0, acrossM: 0, rotationDeg: 0, ...at }, field, shift);
  return { t, p, sheet: e.setOutSheet(t, { layout }, p) };
};
const pt = (sheet: e.SetOutSheet, name: string) => sheet.points.find((x) => x.name === name)!;
const dist = (a: e.SetOutPoint, b: e.SetOutPoint) => Math.hypot(a.fieldX - b.fieldX, a.fieldY - b.fieldY);

describe('layout dimensions', () => {
  test('should accept soccer 90–120 × 45–90 m and refuse outside with the range shown (IFAB Laws of the Game, Law 1)', () => {
    expect(e.dimensionProblem('soccer_full', 'lengthM', 90)).toBeNull();
    expect(e.dimensionProblem('soccer_full', 'lengthM', 120)).toBeNull();
    expect(e.dimensionProblem('soccer_full', 'widthM', 45)).toBeNull();
    expect(e.dimensionProblem('soccer_full', 'widthM', 90)).toBeNull();
    expect(e.dimensionProblem('soccer_full', 'lengthM', 125)).toMatch(/between 90 and 120 m \(IFAB Laws of the Game, Law 1\)/);
    expect(e.dimensionProblem('soccer_full', 'widthM', 44)).toMatch(/between 45 and 90 m/);
    expect(() => e.layoutTemplate('soccer_full', { lengthM: 130 })).toThrow(/between 90 and 120/);
  });

  test('should fix NFHS football at 360 × 160 ft (109.73 × 48.77 m; NFHS, secondary sources)', () => {
    expect(e.dimensionProblem('football', 'lengthM', 109.73)).toBeNull();
    expect(e.dimensionProblem('football', 'widthM', 48.77)).toBeNull();
    expect(e.dimensionProblem('football', 'lengthM', 100)).toMatch(/fixed at 109.73 m/);
  });

  test('should hold youth 9v9 to 70–80 × 45–55 yd and 7v7 to 55–65 × 35–45 yd (from memory; league rules govern)', () => {
    expect(e.dimensionProblem('soccer_9v9', 'lengthM', 64.01)).toBeNull();
    expect(e.dimensionProblem('soccer_9v9', 'lengthM', 90)).toMatch(/between 64.01 and 73.15 m/);
    expect(e.dimensionProblem('soccer_7v7', 'widthM', 30)).toMatch(/between 32 and 41.15 m/);
  });

  test('should refuse an out-of-range size in the saved plan with the allowed range on the field', () => {
    const r = setFieldLinePlanSchema.safeParse({
      layouts: [{ layout: 'soccer_full', lengthM: 130, widthM: 68, colour: '#ffffff' }],
      paint: { dilutionWaterPerPaint: 1, coats: 1, passes: 2 },
      seasonStart: '03-01',
      seasonEnd: '11-30',
      shifts: {},
      version: null,
    });
    expect(r.success).toBe(false);
    expect(r.error!.issues[0]!.path).toEqual(['layouts', 0, 'lengthM']);
    expect(r.error!.issues[0]!.message).toMatch(/between 90 and 120 m/);
  });
});

describe('line lengths and painted areas of chosen sizes', () => {
  test('should total 2L + 3W + 302.94 m for any Law 1 size (derived from IFAB Law 1 markings)', () => {
    for (const [L, W] of [
      [100, 64],
      [110, 75],
      [90, 45],
    ] as const) {
      const t = e.layoutTemplate('soccer_full', { lengthM: L, widthM: W });
      expect(e.totalLineLengthM(t)).toBeCloseTo(2 * L + 3 * W + 302.94, 1);
      // 12 cm lines (IFAB Law 1: not more than 12 cm).
      expect(e.templatePaintedAreaM2(t)).toBeCloseTo((2 * L + 3 * W + 302.94) * 0.12, 1);
    }
  });

  test('should keep a small-sided layout’s boxes when its size changes, so only the boundary and halfway line grow', () => {
    const a = e.layoutTemplate('soccer_9v9', { lengthM: 66, widthM: 42 });
    const b = e.layoutTemplate('soccer_9v9', { lengthM: 72, widthM: 48 });
    // 2 touchlines + 2 goal lines + halfway line: Δ = 2ΔL + 3ΔW.
    expect(e.totalLineLengthM(b) - e.totalLineLengthM(a)).toBeCloseTo(2 * 6 + 3 * 6, 9);
  });

  test('should put paint and water in the dilution chosen, coats and passes multiplying (two directions is common practice)', () => {
    const t = e.layoutTemplate('soccer_full');
    const s = e.DEFAULT_PARAMETERS.lines;
    const one = e.layoutTotals(t, s, { dilutionWaterPerPaint: 1, coats: 1, passes: 2 }, 3);
    const two = e.layoutTotals(t, s, { dilutionWaterPerPaint: 1, coats: 2, passes: 2 }, 3);
    expect(one.concentrateLitres).toBeCloseTo(one.waterLitres, 9); // 1:1
    expect(two.mixedLitres).toBeCloseTo(2 * one.mixedLitres, 9);
    // The department's first coat (two passes, about 200 ft of 4 in line per mixed gallon; trade press) at 1:1.
    expect(one.mixedLitres).toBeCloseTo(e.templatePaintedAreaM2(t) / s.firstCoat.coverageM2PerMixedL, 9);
    const three = e.layoutTotals(t, s, { dilutionWaterPerPaint: 3, coats: 1, passes: 2 }, 3);
    expect(three.waterLitres).toBeCloseTo(3 * three.concentrateLitres, 9);
    // Labour: length × passes ÷ speed + set-up.
    expect(one.hours).toBeCloseTo((e.totalLineLengthM(t) * 2) / 3000 + s.setupMin / 60, 9);
  });
});

describe('set-out sheet', () => {
  test('should close the rectangle: equal diagonals √(L² + W²) and a 9-12-15 triangle at the reference corner (Pythagoras)', () => {
    for (const rot of [0, 90, 33]) {
      const { sheet } = placed('soccer_full', { lengthM: 100, widthM: 64 }, { rotationDeg: rot, alongM: 3, acrossM: -2 });
      const [a, b, c, d] = ['Corner A (reference)', 'Corner B', 'Corner C', 'Corner D'].map((n) => pt(sheet, n));
      expect(dist(a!, c!)).toBeCloseTo(Math.hypot(100, 64), 9);
      expect(dist(b!, d!)).toBeCloseTo(dist(a!, c!), 9);
      expect(dist(a!, b!)).toBeCloseTo(100, 9);
      expect(dist(b!, c!)).toBeCloseTo(64, 9);
      expect(dist(pt(sheet, '3-4-5 mark along (9 m)'), pt(sheet, '3-4-5 mark across (12 m)'))).toBeCloseTo(15, 9);
      for (const check of sheet.checks) expect(dist(pt(sheet, check.between[0]), pt(sheet, check.between[1]))).toBeCloseTo(check.expectedM, 9);
    }
  });

  test('should give the penalty marks 11 m from the goal line and the centre spot at the middle (IFAB Law 1)', () => {
    const { sheet } = placed('soccer_full', { lengthM: 105, widthM: 68 });
    const marks = sheet.points.filter((p) => p.name.startsWith('Penalty mark'));
    expect(marks.map((m) => m.alongM).sort((x, y) => x - y)).toEqual([11, 94]);
    const spot = pt(sheet, 'Centre spot 1');
    expect([spot.alongM, spot.acrossM]).toEqual([52.5, 34]);
    // Centred on a 130 × 90 field.
    expect([spot.fieldX, spot.fieldY]).toEqual([65, 45]);
  });

  test('should move every point by the season’s shift', () => {
    const a = placed('soccer_full', {}, {}).sheet;
    const b = placed('soccer_full', {}, {}, { alongM: 3, acrossM: -1.5 }).sheet;
    a.points.forEach((p, i) => {
      expect(b.points[i]!.fieldX - p.fieldX).toBeCloseTo(3, 9);
      expect(b.points[i]!.fieldY - p.fieldY).toBeCloseTo(-1.5, 9);
      expect(b.points[i]!.alongM).toBe(p.alongM);
    });
  });

  test('should turn a youth layout across a full pitch (rotation 90°): its length runs across the field', () => {
    const { sheet } = placed('soccer_7v7', {}, { rotationDeg: 90, alongM: -26 });
    const a = pt(sheet, 'Corner A (reference)');
    const b = pt(sheet, 'Corner B');
    expect(b.fieldX - a.fieldX).toBeCloseTo(0, 9);
    expect(b.fieldY - a.fieldY).toBeCloseTo(55, 9);
  });

  test('should square a diamond: foul poles f√2 apart for a right angle at home plate (Official Baseball Rules 2.01)', () => {
    const f = e.ftToM(325);
    const { sheet } = placed('baseball', { lengthM: f });
    const check = sheet.checks[0]!;
    expect(check.expectedM).toBeCloseTo(f * Math.SQRT2, 9);
    expect(dist(pt(sheet, check.between[0]), pt(sheet, check.between[1]))).toBeCloseTo(f * Math.SQRT2, 9);
    expect(dist(pt(sheet, 'Home plate (reference)'), pt(sheet, 'First base foul pole'))).toBeCloseTo(f, 9);
  });
});

describe('field frame back to coordinates', () => {
  // A 120 × 80 m rectangle turned 30° from north, near latitude 45° (invented place).
  const lat0 = 45.01;
  const lng0 = -93.2;
  const mLat = 111_132.92 - 559.82 * Math.cos(2 * ((lat0 * Math.PI) / 180));
  const mLng = 111_412.84 * Math.cos((lat0 * Math.PI) / 180);
  const a = (30 * Math.PI) / 180;
  const corner = (x: number, y: number): [number, number] => {
    const ex = x * Math.sin(a) + y * Math.cos(a);
    const ny = x * Math.cos(a) - y * Math.sin(a);
    return [lng0 + ex / mLng, lat0 + ny / mLat];
  };
  const ring = [corner(0, 0), corner(120, 0), corner(120, 80), corner(0, 80)];
  const polygon: Polygon = { type: 'Polygon', coordinates: [[...ring, ring[0]!]] };

  test('should map the frame’s corners back onto the outline’s corners (within 5 cm)', () => {
    const frame = fieldFrame(polygon);
    const back = fieldFrameToLngLat(polygon);
    for (const [x, y] of frame.points) {
      const [lng, lat] = back(x, y);
      const nearest = Math.min(...ring.map(([cl, ca]) => Math.hypot((cl - lng) * mLng, (ca - lat) * mLat)));
      expect(nearest).toBeLessThan(0.05);
    }
  });
});

describe('repaint schedule', () => {
  test('should paint at the season start, every level interval, and before an event no level repaint covers (common practice)', () => {
    const r = e.repaintSchedule('2026-04-01', '2026-04-30', 10, [
      { date: '2026-04-12', title: 'Cup final' },
      { date: '2026-04-25', title: 'Youth day' },
    ]);
    expect(r.map((x) => `${x.date} ${x.reason}`)).toEqual(['2026-04-01 season start', '2026-04-11 level', '2026-04-21 level', '2026-04-24 event']);
  });
});
