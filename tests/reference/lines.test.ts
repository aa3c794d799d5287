/** Field dimension reference checks; each value names its source or label. */
import { describe, expect, test } from 'vitest';
import * as e from '@swardwise/domain/engine';

const byLabel = (t: e.LineTemplate, label: string) => t.segments.filter((s) => s.label === label);

describe('association football (IFAB Laws of the Game, Law 1)', () => {
  const t = e.soccerTemplate(105, 68);

  test('should total 716.9 m for 105 × 68 (derived: 2L + 3W + 302.94 m)', () => {
    expect(e.totalLineLengthM(t)).toBeCloseTo(716.9, 1);
    expect(e.totalLineLengthM(t)).toBeCloseTo(2 * 105 + 3 * 68 + 302.94, 1);
  });

  test('should draw the centre circle, penalty arc and corner arcs with the Law 1 radii (9.15 m, 9.15 m, 1 m)', () => {
    const radii = (label: string) => byLabel(t, label).map((s) => (s.kind === 'arc' ? s.radiusM : Number.NaN));
    expect(radii('centre circle')).toEqual([9.15]);
    expect(radii('penalty arc')).toEqual([9.15, 9.15]);
    expect(radii('corner arc')).toEqual([1, 1, 1, 1]);
  });

  test('should size the goal area (5.5 m from each post, 5.5 m deep) and penalty area (16.5 m, 16.5 m) round a 7.32 m goal', () => {
    const front = (label: string) => byLabel(t, label).filter((s) => s.kind === 'line' && s.from[0] === s.to[0] && s.from[0] !== 0 && s.from[0] !== 105);
    const goalFront = front('goal area')[0]!;
    expect(goalFront.kind === 'line' && goalFront.from[0]).toBeCloseTo(5.5, 12);
    expect(e.segmentLengthM(goalFront)).toBeCloseTo(7.32 + 2 * 5.5, 12);
    const penFront = front('penalty area')[0]!;
    expect(penFront.kind === 'line' && penFront.from[0]).toBeCloseTo(16.5, 12);
    expect(e.segmentLengthM(penFront)).toBeCloseTo(7.32 + 2 * 16.5, 12);
    const arc = byLabel(t, 'penalty arc')[0]!;
    expect(arc.kind === 'arc' && arc.center[0]).toBe(11); // penalty mark 11 m
  });

  test('should accept touchlines 90–120 m and goal lines 45–90 m, lines ≤ 12 cm', () => {
    expect(() => e.soccerTemplate(90, 45)).not.toThrow();
    expect(() => e.soccerTemplate(120, 90 - 1)).not.toThrow();
    expect(() => e.soccerTemplate(89, 60)).toThrow();
    expect(() => e.soccerTemplate(121, 60)).toThrow();
    expect(() => e.soccerTemplate(100, 44)).toThrow();
    expect(() => e.soccerTemplate(105, 68, 0.13)).toThrow();
  });

  test('should hold international matches to 100–110 × 64–75 m', () => {
    expect(() => e.soccerTemplate(105, 68, 0.12, { international: true })).not.toThrow();
    expect(() => e.soccerTemplate(100, 64, 0.12, { international: true })).not.toThrow();
    expect(() => e.soccerTemplate(111, 70, 0.12, { international: true })).toThrow();
    expect(() => e.soccerTemplate(105, 63, 0.12, { international: true })).toThrow();
    expect(() => e.soccerTemplate(95, 60)).not.toThrow();
  });

  test('should label small-sided formats as common practice / from memory', () => {
    expect(e.smallSidedSoccerTemplate('7v7').source).toMatch(/common practice|from memory/);
    expect(e.smallSidedSoccerTemplate('9v9').lengthM).toBeGreaterThan(e.smallSidedSoccerTemplate('7v7').lengthM);
  });
});

describe('American football (NFHS, secondary sources)', () => {
  const t = e.footballTemplate();

  test('should be 360 × 160 ft with 4 in lines', () => {
    expect(e.mToFt(t.lengthM)).toBeCloseTo(360, 9);
    expect(e.mToFt(t.widthM)).toBeCloseTo(160, 9);
    expect(e.mToFt(t.lineWidthM) * 12).toBeCloseTo(4, 9);
  });

  test('should draw yard lines every 5 yd goal line to goal line and hash marks 53 ft 4 in from each sideline', () => {
    expect(byLabel(t, 'goal line')).toHaveLength(2);
    expect(byLabel(t, 'yard line')).toHaveLength(19);
    const hashes = byLabel(t, 'hash mark');
    expect(hashes).toHaveLength(160);
    const ys = new Set(hashes.map((s) => (s.kind === 'line' ? Math.round(e.mToFt(s.from[1]) * 1000) / 1000 : 0)));
    expect([...ys].sort((a, b) => a - b)).toEqual([53.333, 106.667]);
  });

  test('should add the marks the NFHS rule book asks for (from memory, labelled in the template source)', () => {
    expect(t.source).toMatch(/from memory/);
    // 24 in short marks 4 in inside each sideline at every yard line that is not a 5-yd line.
    const short = byLabel(t, 'sideline short mark');
    expect(short).toHaveLength(160);
    for (const s of short) expect(e.mToFt(e.segmentLengthM(s)) * 12).toBeCloseTo(24, 9);
    const ys = new Set(short.map((s) => (s.kind === 'line' ? Math.round(e.mToFt(Math.min(s.from[1], s.to[1])) * 12 * 1000) / 1000 : 0)));
    expect([...ys].sort((a, b) => a - b)).toEqual([4, 160 * 12 - 4 - 24]);
    // 12 in nine-yard marks at each 10-yd line, 9 yd from each sideline.
    const nine = byLabel(t, 'nine-yard mark');
    expect(nine).toHaveLength(18);
    for (const s of nine) expect(s.kind === 'line' && Math.min(e.mToFt(Math.abs(s.to[1] - 0)), e.mToFt(Math.abs(s.to[1] - t.widthM)))).toBeCloseTo(27, 9);
    // Numerals 10 … 50 … 10 on both sides: 36 digits, 6 ft high.
    const numbers = byLabel(t, 'number');
    const nearYs = numbers.flatMap((s) => (s.kind === 'line' ? [s.from[1], s.to[1]] : [])).filter((y) => y < t.widthM / 2);
    expect(e.mToFt(Math.min(...nearYs))).toBeCloseTo(21, 9); // 6 ft high, tops 9 yd (27 ft) from the sideline
    expect(e.mToFt(Math.max(...nearYs))).toBeCloseTo(27, 9);
    expect(numbers.length).toBe(2 * (8 + 11 + 11 + 10 + 11 + 10 + 11 + 11 + 8));
    // Team boxes between the 25-yd lines, coaching lines 6 ft out, limit lines outside.
    expect(byLabel(t, 'coaching line')).toHaveLength(2);
    for (const s of byLabel(t, 'coaching line')) expect(e.mToFt(e.segmentLengthM(s))).toBeCloseTo(150, 9);
    expect(byLabel(t, 'team box')).toHaveLength(6);
    expect(byLabel(t, 'limit line').length).toBeGreaterThan(0);
  });

  test('should leave numerals and team areas out on request and list every element in the line plan', () => {
    const bare = e.footballTemplate({ numbers: false, teamAreas: false });
    expect(byLabel(bare, 'number')).toHaveLength(0);
    expect(byLabel(bare, 'team box')).toHaveLength(0);
    const plan = e.linePlan(t, e.DEFAULT_PARAMETERS.lines, { days: 70, repaintDays: 7 });
    expect(plan.elements.map((x) => x.label)).toEqual(['sideline', 'end line', 'goal line', 'yard line', 'hash mark', 'sideline short mark', 'nine-yard mark', 'number', 'limit line', 'coaching line', 'team box']);
  });

  test('should move the hash marks to 60 ft for NCAA', () => {
    const ncaa = e.footballTemplate(60);
    const h = byLabel(ncaa, 'hash mark')[0]!;
    expect(h.kind === 'line' && e.mToFt(h.from[1])).toBeCloseTo(60, 9);
  });
});

describe('baseball (Official Baseball Rules 2.01) and softball (from memory)', () => {
  test('should have a 127 ft 3⅜ in diagonal on a 90 ft square', () => {
    // Geometry of the 90 ft square the foul lines are drawn along.
    expect(90 * Math.SQRT2).toBeCloseTo(127 + 3.375 / 12, 2);
  });

  test('should draw foul lines of at least 320 ft by default (320 ft or more preferred)', () => {
    const t = e.baseballTemplate();
    const foul = t.segments.filter((s) => s.label.includes('foul line'));
    expect(foul).toHaveLength(2);
    for (const s of foul) expect(e.mToFt(e.segmentLengthM(s))).toBeGreaterThanOrEqual(320);
  });

  // The lane was drawn 3 ft into fair territory (towards second base).
  test.each([
    ['baseball', e.baseballTemplate(), 90],
    ['softball', e.softballTemplate(), 60],
  ] as const)('should draw the %s running lane in foul territory beside the first-base line, last half of home to first, 3 ft wide (Official Baseball Rules 5.09(a)(11))', (_name, t, basesFt) => {
    // Home plate at the origin, first-base line along (1, −1)/√2; distance into foul territory
    // is measured away from second base: d = −(x + y)/√2.
    const foulSide = (x: number, y: number) => -(x + y) / Math.SQRT2;
    const along = (x: number, y: number) => (x - y) / Math.SQRT2;
    const lane = byLabel(t, 'running lane');
    expect(lane.length).toBeGreaterThan(0);
    for (const seg of lane) {
      if (seg.kind !== 'line') throw new Error('the running lane is straight lines');
      for (let k = 0; k <= 20; k++) {
        const x = seg.from[0] + ((seg.to[0] - seg.from[0]) * k) / 20;
        const y = seg.from[1] + ((seg.to[1] - seg.from[1]) * k) / 20;
        expect(foulSide(x, y)).toBeGreaterThanOrEqual(-1e-9);
        expect(e.mToFt(along(x, y))).toBeGreaterThanOrEqual(basesFt / 2 - 1e-9);
        expect(e.mToFt(along(x, y))).toBeLessThanOrEqual(basesFt + 1e-9);
      }
    }
    const outer = lane.find((s) => s.kind === 'line' && Math.abs(foulSide(s.from[0], s.from[1]) - foulSide(s.to[0], s.to[1])) < 1e-9)!;
    expect(outer.kind === 'line' && e.mToFt(foulSide(outer.from[0], outer.from[1]))).toBeCloseTo(3, 9);
    expect(e.mToFt(e.segmentLengthM(outer))).toBeCloseTo(basesFt / 2, 9);
  });

  test('should label softball as from memory', () => {
    expect(e.softballTemplate().source).toBe('from memory');
  });
});

describe('field hockey (FIH)', () => {
  const t = e.fieldHockeyTemplate();

  test('should be 91.40 × 55.00 m with 75 mm lines and 22.90 m lines', () => {
    expect(t.lengthM).toBe(91.4);
    expect(t.widthM).toBe(55);
    expect(t.lineWidthM).toBe(0.075);
    const xs = byLabel(t, '23 m line').map((s) => (s.kind === 'line' ? s.from[0] : 0));
    expect(xs[0]).toBeCloseTo(22.9, 12);
    expect(xs[1]).toBeCloseTo(91.4 - 22.9, 12);
  });

  test('should draw the shooting circle with r 14.63 m', () => {
    const arcs = byLabel(t, 'shooting circle').filter((s) => s.kind === 'arc');
    expect(arcs).toHaveLength(4);
    for (const a of arcs) expect(a.kind === 'arc' && a.radiusM).toBe(14.63);
  });
});

describe("men's lacrosse (from memory)", () => {
  test('should be 110 × 60 yd', () => {
    const t = e.lacrosseTemplate();
    expect(e.mToFt(t.lengthM) / 3).toBeCloseTo(110, 9);
    expect(e.mToFt(t.widthM) / 3).toBeCloseTo(60, 9);
    expect(t.source).toBe('from memory');
  });
});

describe('line paint (trade press, trade guidance, common practice)', () => {
  const lines = e.DEFAULT_PARAMETERS.lines;
  const gallons = (l: number) => e.litresToUsGallons(l);

  test('should give about 200 linear ft of 4 in finished line per mixed gallon in a first coat, both directions included (trade press; two directions common practice)', () => {
    const p = e.paintNeed(e.ftToM(200), e.ftToM(4 / 12), lines.firstCoat);
    expect(gallons(p.mixedLitres)).toBeCloseTo(1, 9);
    expect(lines.firstCoat.passes).toBe(2);
  });

  test('should touch up in one pass at the first coat\'s rate per pass, more dilute (trade guidance: 1:1 first application, 3:1 or 4:1 touch-ups)', () => {
    expect(lines.touchUp.passes).toBe(1);
    // Per pass, the same paint on the line: coverage × passes is the coat's coverage of one pass.
    expect(lines.touchUp.coverageM2PerMixedL / lines.touchUp.passes).toBeCloseTo(lines.firstCoat.coverageM2PerMixedL * lines.firstCoat.passes, 9);
    expect(lines.firstCoat.dilutionWaterPerPaint).toBe(1);
    expect(lines.touchUp.dilutionWaterPerPaint).toBeGreaterThanOrEqual(3);
    for (const coat of [lines.firstCoat, lines.touchUp]) {
      expect(coat.dilutionWaterPerPaint).toBeGreaterThanOrEqual(1);
      expect(coat.dilutionWaterPerPaint).toBeLessThanOrEqual(4); // 1:1 to 4:1 (common practice)
    }
  });

  // The engine used to put about 47 gal of mixed paint on every football repaint (coverage
  // applied per pass and doubled for two passes, without numerals); trade guidance is of the
  // order of 15 gal.
  test('should repaint a full football field, numerals and hash marks but not the border, with about 15 gal of mixed paint (trade guidance, secondary sources)', () => {
    const field = e.footballTemplate({ numbers: true, teamAreas: false });
    const plan = e.linePlan(field, lines, { days: 70, repaintDays: 7 });
    expect(gallons(plan.touchUp.mixedLitres)).toBeGreaterThan(12);
    expect(gallons(plan.touchUp.mixedLitres)).toBeLessThan(18);
    // A first coat of the same layout in both directions: twice the mixed paint, at 1:1.
    expect(gallons(plan.firstCoat.mixedLitres)).toBeCloseTo(2 * gallons(plan.touchUp.mixedLitres), 9);
    expect(gallons(plan.firstCoat.concentrateLitres)).toBeCloseTo(gallons(plan.firstCoat.mixedLitres) / 2, 9);
  });

  test('should repaint a 105 × 68 m soccer pitch (12 cm lines) at the 200 ft per mixed gallon rate of 4 in line (trade press)', () => {
    const pitch = e.soccerTemplate(105, 68, 0.12);
    const plan = e.linePlan(pitch, lines, { days: 70, repaintDays: 7 });
    // 716.9 m of 12 cm line is 2,778 ft of 4 in line: about 13.9 gal in a first coat, 6.9 in a touch-up.
    const ftOf4In = e.m2ToFt2(716.9 * 0.12) / (4 / 12);
    expect(gallons(plan.firstCoat.mixedLitres)).toBeCloseTo(ftOf4In / 200, 1);
    expect(gallons(plan.touchUp.mixedLitres)).toBeCloseTo(ftOf4In / 400, 1);
    expect(gallons(plan.firstCoat.mixedLitres)).toBeCloseTo(13.9, 1);
  });
});
