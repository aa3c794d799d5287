import { defineAbilityFor, type WeekBoard } from '@swardwise/domain';
import { VueQueryPlugin } from '@tanstack/vue-query';
import { flushPromises, mount } from '@vue/test-utils';
import { createPinia, setActivePinia } from 'pinia';
import { afterEach, describe, expect, test, vi } from 'vitest';
import { defineComponent, reactive } from 'vue';
import { ability } from '../ability.ts';
import { createQueryClient } from '../api/queryClient.ts';
import { cellKey } from '../components/week/board.ts';
import { board, crewDay, DATES, order, WEEK } from '../components/week/sample.ts';
import { useWeekBoard, type WeekKey } from './useWeekBoard.ts';

/** Answers the board GETs from `boards` in turn (the last one again after that) and PATCHes with the moved order. */
function fakeApi(boards: WeekBoard[]) {
  const gets: string[] = [];
  vi.stubGlobal(
    'fetch',
    vi.fn(async (url: string, init: RequestInit) => {
      if (init.method === 'PATCH') {
        const moved = boards.at(-1)!.orders.find((o) => url.endsWith(`/${o.id}`));
        return new Response(JSON.stringify({ ...moved, emailed: 0 }), { status: 200 });
      }
      gets.push(url);
      return new Response(JSON.stringify(boards[Math.min(gets.length - 1, boards.length - 1)]), { status: 200 });
    }),
  );
  return gets;
}

function mountBoard(key: WeekKey) {
  const pinia = createPinia();
  setActivePinia(pinia);
  ability.update(defineAbilityFor({ id: 3, role: 'foreman', districtId: 1, crewId: null, siteIds: [] }).rules);
  const Host = defineComponent({ setup: () => ({ board: useWeekBoard(key) }), template: '<div />' });
  const w = mount(Host, { global: { plugins: [pinia, [VueQueryPlugin, { queryClient: createQueryClient() }]] } });
  return (w.vm as unknown as { board: ReturnType<typeof useWeekBoard> }).board;
}

afterEach(() => vi.unstubAllGlobals());

describe('useWeekBoard', () => {
  test('should keep the objects of the orders, crew-days and cells a move did not touch when the board comes again', async () => {
    const a = order({ id: 1, crewId: 11, plannedDate: DATES[0]! });
    const b = order({ id: 2, crewId: 11, plannedDate: DATES[1]! });
    const before = board([a, b], [crewDay({ crewId: 11, date: DATES[0]!, workHours: 1.5 }), crewDay({ crewId: 11, date: DATES[1]!, workHours: 1.5 })]);
    // After the move the server has order 2 on another crew and day, with the crew-days' hours redone.
    const after = board(
      [a, { ...b, crewId: 12, crewName: 'North B', plannedDate: DATES[2]!, pinned: true, version: 2 }],
      [crewDay({ crewId: 11, date: DATES[0]!, workHours: 1.5 }), crewDay({ crewId: 11, date: DATES[1]!, workHours: 0 }), crewDay({ crewId: 12, date: DATES[2]!, workHours: 1.5 })],
    );
    const gets = fakeApi([before, after]);
    const week = mountBoard({ districtId: 1, weekStart: WEEK });
    await flushPromises();
    const first = week.data.value!;
    const untouchedCell = week.cells.value.get(cellKey(11, DATES[0]!));
    expect(untouchedCell).toEqual([first.orders[0]]);

    expect(await week.move(2, 12, DATES[2]!)).toBe(true);
    await flushPromises();
    expect(gets).toHaveLength(2);
    const next = week.data.value!;
    expect(next).not.toBe(first);
    expect(next.orders[0]).toBe(first.orders[0]);
    expect(next.orders[1]).not.toBe(first.orders[1]);
    expect(next.orders[1]!.crewId).toBe(12);
    expect(next.crewDays[0]).toBe(first.crewDays[0]);
    expect(next.crewDays[1]).not.toBe(first.crewDays[1]);
    expect(week.cells.value.get(cellKey(11, DATES[0]!))).toBe(untouchedCell);
    expect(week.cells.value.get(cellKey(12, DATES[2]!))).toEqual([next.orders[1]]);
  });

  test('should load another week as a board of its own, and show none without a district', async () => {
    const gets = fakeApi([board([order({ id: 1 })])]);
    const key = reactive<WeekKey>({ districtId: 1, weekStart: WEEK });
    const week = mountBoard(key);
    await flushPromises();
    const first = week.data.value!;
    key.weekStart = '2026-12-07';
    await flushPromises();
    expect(gets.at(-1)).toBe('/api/week-plans?districtId=1&weekStart=2026-12-07');
    expect(week.data.value!.orders[0]).toEqual(first.orders[0]);
    expect(week.data.value!.orders[0]).not.toBe(first.orders[0]);
    key.districtId = null;
    await flushPromises();
    expect(week.data.value).toBeNull();
    expect(gets).toHaveLength(2);
  });
});
