import { describe, expect, test } from 'vitest';
import * as l from './lines.ts';

const SETTINGS: l.LineSettings = {
  firstCoat: { coverageM2PerMixedL: 1.6, dilutionWaterPerPaint: 1, passes: 2 },
  touchUp: { coverageM2PerMixedL: 3.2, dilutionWaterPerPaint: 3, passes: 1 },
  markerSpeedKmh: 3,
  setupMin: 20,
};

describe('lines', () => {
  test('should total 2L + 3W + 302.94 m for any legal soccer pitch', () => {
    for (const [L, W] of [[105, 68], [100, 64], [90, 45], [120, 90]] as const) {
      expect(l.totalLineLengthM(l.soccerTemplate(L, W))).toBeCloseTo(2 * L + 3 * W + 302.94, 1);
    }
  });

  test('should measure arcs as r × angle', () => {
    expect(l.segmentLengthM({ kind: 'arc', center: [0, 0], radiusM: 9.15, startRad: 0, endRad: 2 * Math.PI, label: 'c' })).toBeCloseTo(57.49, 2);
    expect(l.segmentLengthM({ kind: 'line', from: [0, 0], to: [3, 4], label: 'x' })).toBe(5);
  });

  test('should build every sport template with lines inside its frame', () => {
    const templates = [l.soccerTemplate(), l.smallSidedSoccerTemplate('7v7'), l.smallSidedSoccerTemplate('9v9'), l.footballTemplate(), l.lacrosseTemplate(), l.fieldHockeyTemplate()];
    for (const t of templates) {
      expect(l.totalLineLengthM(t)).toBeGreaterThan(2 * (t.lengthM + t.widthM));
      // Team areas and limit lines lie outside the field, within the template's margin.
      const m = t.marginM ?? 0;
      for (const s of t.segments) {
        if (s.kind !== 'line') continue;
        for (const [x, y] of [s.from, s.to]) {
          expect(x).toBeGreaterThanOrEqual(-m - 1e-9);
          expect(x).toBeLessThanOrEqual(t.lengthM + m + 1e-9);
          expect(y).toBeGreaterThanOrEqual(-m - 1e-9);
          expect(y).toBeLessThanOrEqual(t.widthM + m + 1e-9);
        }
      }
    }
    expect(l.totalLineLengthM(l.baseballTemplate(325))).toBeGreaterThan(2 * 325 * 0.3048);
    expect(l.defaultTemplateFor('lawn')).toBeNull();
    expect(l.defaultTemplateFor('softball')?.id).toBe('softball');
  });

  test('should build each layout from the one table, at its own size or at the size given', () => {
    expect(l.defaultTemplateFor('soccer')).toEqual(l.soccerTemplate());
    expect(l.defaultTemplateFor('football')).toEqual(l.footballTemplate());
    expect(l.LINE_LAYOUTS.soccer_full.template({ lengthM: 100, widthM: 64 })).toEqual(l.soccerTemplate(100, 64));
    expect(l.LINE_LAYOUTS.soccer_7v7.template({ lengthM: 60, widthM: 40 }).id).toBe('soccer_7v7_60x40');
    // A diamond's length is its foul line, given in metres and built in feet.
    expect(l.LINE_LAYOUTS.baseball.template({ lengthM: 100, widthM: 0 })).toEqual(l.baseballTemplate(100 / 0.3048));
    expect(l.LINE_LAYOUTS.softball.template().id).toBe('softball');
  });

  // The coverage is of finished line (every pass of the coat): mixed paint no longer doubles
  // with two passes (100 m² at 2 m²/L was 100 L for two passes; it is 50 L).
  test('should derive paint concentrate and water from coverage of finished line and dilution', () => {
    const p = l.paintNeed(1000, 0.1, { coverageM2PerMixedL: 2, dilutionWaterPerPaint: 3, passes: 2 });
    expect(p.paintedAreaM2).toBeCloseTo(100, 12);
    expect(p.mixedLitres).toBeCloseTo(50, 12);
    expect(p.concentrateLitres).toBeCloseTo(12.5, 12);
    expect(p.waterLitres).toBeCloseTo(37.5, 12);
    expect(l.paintNeed(1000, 0.1, { coverageM2PerMixedL: 2, dilutionWaterPerPaint: 3, passes: 1 }).mixedLitres).toBeCloseTo(50, 12);
  });

  test('should list what each total includes, element by element', () => {
    const t = l.footballTemplate();
    const els = l.lineElements(t);
    expect(els.reduce((s, e) => s + e.lengthM, 0)).toBeCloseTo(l.totalLineLengthM(t), 9);
    expect(els.reduce((s, e) => s + e.paintedAreaM2, 0)).toBeCloseTo(l.templatePaintedAreaM2(t), 9);
    const plan = l.linePlan(t, SETTINGS, { days: 28, repaintDays: 7 });
    expect(plan.elements.map((e) => e.label)).toEqual(els.map((e) => e.label));
    expect(plan.paintedAreaM2).toBeCloseTo(l.templatePaintedAreaM2(t), 9);
    expect(plan.lineLengthM).toBeCloseTo(l.totalLineLengthM(t), 9);
    // Numerals are 8 in strokes: twice the paint of a 4 in line of the same length.
    const numbers = els.find((e) => e.label === 'number')!;
    expect(numbers.equivalentLengthM).toBeCloseTo(2 * numbers.lengthM, 9);
  });

  test('should time marking and count repaints', () => {
    expect(l.markingHours(1500, 2, 3, 30)).toBeCloseTo(1.5, 12);
    expect(l.repaintsInSeason(70, 7)).toBe(10);
    expect(l.repaintsInSeason(70, 7, 2)).toBe(12);
    expect(l.repaintsInSeason(70, null, 1)).toBe(1);
    const plan = l.linePlan(l.soccerTemplate(), SETTINGS, { days: 28, repaintDays: 7 });
    expect(plan.repaints).toBe(4);
    // One first coat at the start of the season, then touch-ups.
    expect(plan.firstCoats).toBe(1);
    expect(plan.touchUps).toBe(3);
    expect(plan.seasonMixedLitres).toBeCloseTo(plan.firstCoat.mixedLitres + 3 * plan.touchUp.mixedLitres, 9);
    expect(plan.seasonConcentrateLitres).toBeCloseTo(plan.firstCoat.concentrateLitres + 3 * plan.touchUp.concentrateLitres, 9);
    expect(plan.seasonHours).toBeCloseTo(plan.firstCoat.hours + 3 * plan.touchUp.hours, 9);
    expect(plan.touchUp.mixedLitres).toBeCloseTo(plan.firstCoat.mixedLitres / 2, 9);
    expect(plan.touchUp.concentrateLitres).toBeCloseTo(plan.touchUp.mixedLitres / 4, 9);
    expect(l.linePlan(l.soccerTemplate(), SETTINGS, { days: 0, repaintDays: 7 }).firstCoats).toBe(0);
  });

  test('should reject dimensions outside IFAB Law 1 and bad paint settings', () => {
    expect(() => l.soccerTemplate(80, 50)).toThrow(expect.objectContaining({ code: 'engine/invalid_dimension' }));
    expect(() => l.soccerTemplate(100, 95)).toThrow(expect.objectContaining({ code: 'engine/invalid_dimension' }));
    expect(() => l.soccerTemplate(105, 68, 0.15)).toThrow(expect.objectContaining({ code: 'engine/invalid_line_width' }));
    expect(() => l.paintNeed(-1, 0.1, { coverageM2PerMixedL: 2, dilutionWaterPerPaint: 1, passes: 1 })).toThrow(expect.objectContaining({ code: 'engine/invalid_length' }));
    expect(() => l.paintNeed(10, 0.1, { coverageM2PerMixedL: 0, dilutionWaterPerPaint: 1, passes: 1 })).toThrow(expect.objectContaining({ code: 'engine/invalid_coverage' }));
  });
});
