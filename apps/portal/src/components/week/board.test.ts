import { describe, expect, test } from 'vitest';
import { cautionsFor, cellKey, crewDayMap, filterOptions, groupCells, loadBar, weekLabel } from './board.ts';
import { bigBoard, board, crewDay, DATES, order } from './sample.ts';

const NO_FILTER = { siteIds: [], tasks: [] };

describe('groupCells', () => {
  test('should put each order in its crew-day cell and orders without a crew in the unassigned row', () => {
    const a = order({ crewId: 11, plannedDate: DATES[0] });
    const b = order({ crewId: 11, plannedDate: DATES[1] });
    const c = order({ crewId: null, plannedDate: DATES[1] });
    const d = order({ crewId: 12, plannedDate: DATES[1] });
    const cells = groupCells([a, b, c, d], new Map(), NO_FILTER);
    expect(cells.get(cellKey(11, DATES[0]!))).toEqual([a]);
    expect(cells.get(cellKey(11, DATES[1]!))).toEqual([b]);
    expect(cells.get(cellKey(null, DATES[1]!))).toEqual([c]);
    expect(cells.get(cellKey(12, DATES[1]!))).toEqual([d]);
    expect(cells.size).toBe(4);
  });

  test('should order a cell by the day’s route, then by site and field', () => {
    const x = order({ crewId: 11, siteName: 'Birch Park', fieldName: 'Lawn' });
    const y = order({ crewId: 11, siteName: 'Alder Green', fieldName: 'Pitch 2' });
    const z = order({ crewId: 11, siteName: 'Alder Green', fieldName: 'Pitch 1' });
    const unrouted = groupCells([x, y, z], new Map(), NO_FILTER).get(cellKey(11, DATES[0]!));
    expect(unrouted).toEqual([z, y, x]);
    const days = crewDayMap([crewDay({ crewId: 11, date: DATES[0]!, orderIds: [x.id, y.id, z.id] })]);
    expect(groupCells([x, y, z], days, NO_FILTER).get(cellKey(11, DATES[0]!))).toEqual([x, y, z]);
  });

  test('should keep only the orders of the chosen sites and tasks', () => {
    const mow1 = order({ siteId: 1, task: 'mow' });
    const paint1 = order({ siteId: 1, task: 'paint_lines' });
    const mow2 = order({ siteId: 2, task: 'mow' });
    const all = (f: { siteIds: number[]; tasks: ('mow' | 'paint_lines')[] }) => [...groupCells([mow1, paint1, mow2], new Map(), f).values()].flat();
    expect(all({ siteIds: [1], tasks: [] })).toEqual(expect.arrayContaining([mow1, paint1]));
    expect(all({ siteIds: [1], tasks: [] })).toHaveLength(2);
    expect(all({ siteIds: [], tasks: ['mow'] })).toHaveLength(2);
    expect(all({ siteIds: [2], tasks: ['paint_lines'] })).toEqual([]);
  });

  test('should keep the arrays of the cells a move did not touch, and give new ones to the two it did', () => {
    const week = bigBoard(500);
    const days = crewDayMap(week.crewDays);
    const first = groupCells(week.orders, days, NO_FILTER);
    const moved = week.orders.find((o) => o.crewId === 11 && o.plannedDate === DATES[0])!;
    const orders = week.orders.map((o) => (o.id === moved.id ? { ...o, crewId: 12, plannedDate: DATES[2]! } : o));
    const second = groupCells(orders, days, NO_FILTER, first);
    const from = cellKey(11, DATES[0]!);
    const to = cellKey(12, DATES[2]!);
    for (const [key, list] of second) {
      if (key === from || key === to) expect(list).not.toBe(first.get(key));
      else expect(list).toBe(first.get(key));
    }
    expect(second.get(from)!.length).toBe(first.get(from)!.length - 1);
    expect(second.get(to)!.map((o) => o.id)).toContain(moved.id);
    expect([...second.values()].reduce((s, l) => s + l.length, 0)).toBe(500);
  });
});

describe('loadBar', () => {
  test('should split the bar into work, drive and load/unload within the available hours', () => {
    const bar = loadBar({ workHours: 4, driveHours: 1, loadUnloadHours: 1, availableHours: 8 });
    expect(bar.work).toBeCloseTo(50);
    expect(bar.drive).toBeCloseTo(12.5);
    expect(bar.loadUnload).toBeCloseTo(12.5);
    expect(bar.availableAt).toBeCloseTo(100);
    expect(bar.totalHours).toBe(6);
    expect(bar.percent).toBe(75);
    expect(bar.overloaded).toBe(false);
  });

  test('should flag an overload and scale the bar to the total so the limit line shows where the day ends', () => {
    const bar = loadBar({ workHours: 8, driveHours: 1.5, loadUnloadHours: 0.5, availableHours: 8 });
    expect(bar.overloaded).toBe(true);
    expect(bar.work + bar.drive + bar.loadUnload).toBeCloseTo(100);
    expect(bar.availableAt).toBeCloseTo(80);
    expect(bar.percent).toBe(125);
  });

  test('should not call a day over its hours for a rounding difference', () => {
    expect(loadBar({ workHours: 7.999, driveHours: 0, loadUnloadHours: 0.005, availableHours: 8 }).overloaded).toBe(false);
  });
});

describe('week dates', () => {
  test('should name the week from Monday to Sunday', () => {
    expect(weekLabel('2026-11-30')).toBe('30 Nov – 6 Dec 2026');
  });
});

describe('filterOptions and cautionsFor', () => {
  test('should offer each site and task of the week once', () => {
    const opts = filterOptions(board([order({ siteId: 2, siteName: 'Birch Park' }), order({ siteId: 1, siteName: 'Alder Green', task: 'feed' }), order({ siteId: 2, siteName: 'Birch Park' })]));
    expect(opts.sites).toEqual([
      { id: 1, name: 'Alder Green' },
      { id: 2, name: 'Birch Park' },
    ]);
    expect(opts.tasks).toEqual(['feed', 'mow']);
  });

  test('should give each task its caution and every day the weather ones', () => {
    expect(cautionsFor(['mow', 'feed', 'mow']).map((c) => c.key)).toEqual(['mowing', 'feed', 'wetField', 'lightning']);
    expect(cautionsFor(['field_check']).map((c) => c.key)).toEqual(['wetField', 'lightning']);
    expect(cautionsFor(['weed_control'])[0]!.text).toMatch(/label/);
    expect(cautionsFor(['colourant']).map((c) => c.key)).toEqual(['colourant', 'wetField', 'lightning']);
    expect(cautionsFor(['colourant'])[0]!.text).toMatch(/changes colour, not turf health.*label/);
  });
});
