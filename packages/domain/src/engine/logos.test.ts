import { describe, expect, test } from 'vitest';
import { DEFAULT_PARAMETERS } from './standards.ts';
import { gridColumnName, gridToField, isDarkPigment, isWhitePaint, logoCorners, logoFractions, logoGrid, logoHeightM, logoInsideField, logoPaint, logoPalette, logoPoint } from './logos.ts';

const coat = DEFAULT_PARAMETERS.lines.firstCoat;

describe('logo placement', () => {
  test('should scale an unturned picture about its centre', () => {
    const p = { centerXM: 50, centerYM: 30, widthM: 10, heightM: 4, rotationDeg: 0 };
    const [tl, tr, br, bl] = logoCorners(p);
    expect(tl).toEqual([45, 32]);
    expect(tr).toEqual([55, 32]);
    expect(br).toEqual([55, 28]);
    expect(bl).toEqual([45, 28]);
  });

  test('should turn a quarter turn anticlockwise so the top faces the end line x = 0', () => {
    const p = { centerXM: 50, centerYM: 30, widthM: 10, heightM: 4, rotationDeg: 90 };
    const [tl, tr, br, bl] = logoCorners(p);
    // Top left (−5, +2) turned 90° anticlockwise is (−2, −5).
    expect(tl[0]).toBeCloseTo(48, 9);
    expect(tl[1]).toBeCloseTo(25, 9);
    expect(tr[0]).toBeCloseTo(48, 9);
    expect(tr[1]).toBeCloseTo(35, 9);
    expect(br[0]).toBeCloseTo(52, 9);
    expect(br[1]).toBeCloseTo(35, 9);
    expect(bl[0]).toBeCloseTo(52, 9);
    expect(bl[1]).toBeCloseTo(25, 9);
  });

  test('should invert a point back to its picture fractions', () => {
    const p = { centerXM: 40, centerYM: 20, widthM: 12, heightM: 7, rotationDeg: 33 };
    const pt = logoPoint(p, 0.2, 0.7);
    const f = logoFractions(p, pt);
    expect(f.u).toBeCloseTo(0.2, 9);
    expect(f.v).toBeCloseTo(0.7, 9);
  });

  test('should take the height from the picture aspect', () => {
    expect(logoHeightM(10, 400, 200)).toBe(5);
    expect(() => logoHeightM(0, 400, 200)).toThrow(/greater than zero/);
  });

  test('should tell whether the turned logo stays inside the field', () => {
    expect(logoInsideField({ centerXM: 50, centerYM: 30, widthM: 10, heightM: 4, rotationDeg: 0 }, 100, 60)).toBe(true);
    expect(logoInsideField({ centerXM: 3, centerYM: 30, widthM: 10, heightM: 4, rotationDeg: 0 }, 100, 60)).toBe(false);
  });
});

describe('logo grid', () => {
  test('should give grid coordinates that reproduce the corners after rotation and scale', () => {
    const p = { centerXM: 52.5, centerYM: 34, widthM: 9, heightM: 6, rotationDeg: 30 };
    const grid = logoGrid(p, 1);
    const corners = logoCorners(p);
    grid.corners.forEach((c, i) => {
      const back = gridToField(grid, c.alongM, c.acrossM);
      expect(back[0]).toBeCloseTo(corners[i]![0], 9);
      expect(back[1]).toBeCloseTo(corners[i]![1], 9);
      // And the grid point lands on the right corner of the picture.
      const f = logoFractions(p, back);
      expect(f.u).toBeCloseTo([0, 1, 1, 0][i]!, 9);
      expect(f.v).toBeCloseTo([0, 0, 1, 1][i]!, 9);
    });
    // Box of a 9 × 6 rectangle turned 30°: 9cos30 + 6sin30 = 10.794 by 9sin30 + 6cos30 = 9.696.
    expect(grid.reference[0]).toBeCloseTo(52.5 - 10.794228634 / 2, 6);
    expect(grid.reference[1]).toBeCloseTo(34 - 9.696152423 / 2, 6);
    expect(grid.columns).toBe(11);
    expect(grid.rows).toBe(10);
    // The corner on the box's low-x side (top left at 30°) sits at along 0.
    expect(Math.min(...grid.corners.map((c) => c.alongM))).toBeCloseTo(0, 9);
    expect(Math.min(...grid.corners.map((c) => c.acrossM))).toBeCloseTo(0, 9);
  });

  test('should fit an exact multiple without an extra square', () => {
    const grid = logoGrid({ centerXM: 10, centerYM: 10, widthM: 4, heightM: 2, rotationDeg: 0 }, 0.5);
    expect([grid.columns, grid.rows]).toEqual([8, 4]);
  });

  test('should refuse a grid too fine for the logo', () => {
    expect(() => logoGrid({ centerXM: 50, centerYM: 30, widthM: 40, heightM: 20, rotationDeg: 0 }, 0.1)).toThrow(/at most 80/);
  });

  test('should letter columns past Z', () => {
    expect([0, 25, 26, 27].map(gridColumnName)).toEqual(['A', 'Z', 'AA', 'AB']);
  });
});

/** A w × h picture from a function of (x, y) to [r, g, b, a]. */
function picture(w: number, h: number, at: (x: number, y: number) => [number, number, number, number]) {
  const px = new Uint8Array(w * h * 4);
  for (let y = 0; y < h; y++) for (let x = 0; x < w; x++) px.set(at(x, y), (y * w + x) * 4);
  return px;
}

describe('logo palette and paint', () => {
  test('should count colours and leave transparent pixels as turf', () => {
    // Left half red, right quarter blue, the rest transparent.
    const px = picture(40, 10, (x) => (x < 20 ? [200, 16, 16, 255] : x < 30 ? [16, 32, 200, 255] : [0, 0, 0, 0]));
    const p = logoPalette(px, 40, 10);
    expect(p.turfShare).toBeCloseTo(0.25, 9);
    expect(p.backgroundHex).toBeNull();
    expect(p.colours).toEqual([
      { hex: '#c81010', share: 0.5 },
      { hex: '#1020c8', share: 0.25 },
    ]);
  });

  test('should take an opaque background in all four corners as turf', () => {
    const px = picture(10, 10, (x, y) => (x >= 3 && x < 7 && y >= 3 && y < 7 ? [255, 255, 255, 255] : [0, 128, 0, 255]));
    const p = logoPalette(px, 10, 10);
    expect(p.backgroundHex).toBe('#008000');
    expect(p.colours).toEqual([{ hex: '#ffffff', share: 0.16 }]);
  });

  test('should join anti-aliased edge pixels to the nearest colour and keep at most six', () => {
    const px = picture(100, 1, (x) => (x < 49 ? [250, 250, 250, 255] : x === 49 ? [240, 120, 120, 255] : [230, 20, 20, 255]));
    const p = logoPalette(px, 100, 1);
    expect(p.colours.length).toBe(2);
    expect(p.colours.reduce((s, c) => s + c.share, 0)).toBeCloseTo(1, 9);
    const many = picture(70, 1, (x) => [Math.floor(x / 10) * 36, 0, 0, 255]);
    expect(logoPalette(many, 70, 1).colours.length).toBe(6);
  });

  test('should sum paint per colour to the total, with a white base under colours', () => {
    const paint = logoPaint(10, 5, [
      { hex: '#ffffff', share: 0.3 },
      { hex: '#c81010', share: 0.2 },
      { hex: '#1020c8', share: 0.1 },
    ], coat);
    expect(paint.logoAreaM2).toBe(50);
    expect(paint.paintedAreaM2).toBeCloseTo(30, 9);
    const base = paint.rows.find((r) => r.kind === 'base')!;
    expect(base.areaM2).toBeCloseTo(15, 9);
    const sum = (k: 'areaM2' | 'mixedLitres' | 'concentrateLitres' | 'waterLitres') => paint.rows.reduce((s, r) => s + r[k], 0);
    for (const k of ['areaM2', 'mixedLitres', 'concentrateLitres', 'waterLitres'] as const) expect(sum(k)).toBeCloseTo(paint.total[k], 9);
    // 45 m² at the first coat's coverage (200 ft of 4 in line per mixed US gal, trade press; ≈ 1.636 m²/L).
    expect(paint.total.mixedLitres).toBeCloseTo(45 / coat.coverageM2PerMixedL, 9);
    expect(paint.total.concentrateLitres).toBeCloseTo(paint.total.mixedLitres / 2, 9);
    expect(paint.rows.filter((r) => r.dark).map((r) => r.hex)).toEqual(['#c81010', '#1020c8']);
  });

  test('should tell white and dark pigments', () => {
    expect(isWhitePaint('#f5f5f5')).toBe(true);
    expect(isWhitePaint('#ffd700')).toBe(false);
    expect(isDarkPigment('#c81010')).toBe(true);
    expect(isDarkPigment('#1020c8')).toBe(true);
    expect(isDarkPigment('#ffd700')).toBe(false);
    expect(isDarkPigment('#ffffff')).toBe(false);
  });
});
