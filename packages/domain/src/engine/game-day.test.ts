import { describe, expect, it } from 'vitest';
import { colourantFacts, colourantHours, colourantLitres, placeGameDaySteps, type GameDayCrew } from './game-day.ts';

const WEEKDAYS5 = ['mon', 'tue', 'wed', 'thu', 'fri'] as const;
const crew = (id: number, hoursPerDay = 8, workDays: GameDayCrew['workDays'] = WEEKDAYS5): GameDayCrew => ({ id, hoursPerDay, workDays });
const steps = [
  { step: 'mow' as const, hours: 1.5 },
  { step: 'colourant' as const, hours: 1.2 },
  { step: 'paint_lines' as const, hours: 2.5 },
  { step: 'field_check' as const, hours: 0.25 },
];

describe('placeGameDaySteps', () => {
  it('puts every step on the day before the event when the site crew has room', () => {
    // 2026-12-12 is a Saturday: the day before is Friday 2026-12-11.
    const placed = placeGameDaySteps({ eventOn: '2026-12-12', notBefore: '2026-12-03', steps, crews: [crew(1), crew(2)], load: new Map(), siteCrewId: 2 });
    expect(placed.map((p) => [p.step, p.date, p.crewId])).toEqual([
      ['mow', '2026-12-11', 2],
      ['colourant', '2026-12-11', 2],
      ['paint_lines', '2026-12-11', 2],
      ['field_check', '2026-12-11', 2],
    ]);
    expect(placed.every((p) => !p.overHours && !p.onEventDay)).toBe(true);
  });

  it('skips days no crew works: a Monday event is prepared on the Friday before', () => {
    const placed = placeGameDaySteps({ eventOn: '2026-12-14', notBefore: '2026-12-03', steps, crews: [crew(1)], load: new Map(), siteCrewId: null });
    expect(new Set(placed.map((p) => p.date))).toEqual(new Set(['2026-12-11']));
  });

  it('respects crew hours: a full Friday moves the earlier steps back, keeping the working order', () => {
    // Friday has 3 h left: the check (0.25) and the lines (2.5) fit, colourant (1.2) and mowing go to Thursday.
    const placed = placeGameDaySteps({ eventOn: '2026-12-12', notBefore: '2026-12-03', steps, crews: [crew(1)], load: new Map([['1|2026-12-11', 5]]), siteCrewId: 1 });
    expect(placed.map((p) => [p.step, p.date])).toEqual([
      ['mow', '2026-12-10'],
      ['colourant', '2026-12-10'],
      ['paint_lines', '2026-12-11'],
      ['field_check', '2026-12-11'],
    ]);
    const dates = placed.map((p) => p.date);
    expect([...dates].sort()).toEqual(dates);
  });

  it('prefers another crew with room on the day before to moving a day earlier', () => {
    const placed = placeGameDaySteps({ eventOn: '2026-12-12', notBefore: '2026-12-03', steps, crews: [crew(1), crew(2)], load: new Map([['1|2026-12-11', 8]]), siteCrewId: 1 });
    expect(placed.every((p) => p.date === '2026-12-11' && p.crewId === 2)).toBe(true);
  });

  it('flags work over the crew hours when no day before has room', () => {
    const load = new Map(['2026-12-03', '2026-12-04'].map((d) => [`1|${d}`, 8] as const));
    const placed = placeGameDaySteps({ eventOn: '2026-12-05', notBefore: '2026-12-03', steps: [{ step: 'mow', hours: 2 }], crews: [crew(1)], load, siteCrewId: 1 });
    expect(placed[0]).toMatchObject({ date: '2026-12-04', crewId: 1, overHours: true });
  });

  it('falls on the event day, flagged, when no working day is left before it', () => {
    const placed = placeGameDaySteps({ eventOn: '2026-12-03', notBefore: '2026-12-03', steps: [{ step: 'field_check', hours: 0.25 }], crews: [crew(1)], load: new Map(), siteCrewId: 1 });
    expect(placed[0]).toMatchObject({ date: '2026-12-03', onEventDay: true });
  });

  it('refuses an event already past', () => {
    expect(() => placeGameDaySteps({ eventOn: '2026-12-01', notBefore: '2026-12-03', steps, crews: [crew(1)], load: new Map(), siteCrewId: 1 })).toThrow(/before/);
  });
});

describe('colourant arithmetic', () => {
  it('takes rate × area ÷ 1000 litres (label rate 3 mL/m² over a 7,140 m² pitch: 21.42 L)', () => {
    expect(colourantLitres(3, 7140)).toBeCloseTo(21.42, 6);
  });
  it('times a 7,140 m² pitch at 10,500 m²/h plus 0.5 h mixing (common practice): 1.18 h', () => {
    expect(colourantHours(7140)).toBe(1.18);
  });
  it('refuses a zero rate or area', () => {
    expect(() => colourantLitres(0, 100)).toThrow();
    expect(() => colourantHours(-1)).toThrow();
  });
  it('says a rate in the reader\'s units: 3 mL/m² is 9.4 fl oz per 1,000 ft² (1 fl oz = 29.5735 mL, 1,000 ft² = 92.903 m²)', () => {
    expect(colourantFacts({ rateMlPerM2: 3, areaM2: 7140 }, 'imperial')).toEqual({ rate: '9.4 fl oz per 1,000 ft²', area: '76,854 ft²', amount: '5.7 gal' });
    expect(colourantFacts({ rateMlPerM2: 3, areaM2: 7140 }, 'metric')).toEqual({ rate: '3.0 mL/m²', area: '7,140 m²', amount: '21.4 L' });
  });
});
