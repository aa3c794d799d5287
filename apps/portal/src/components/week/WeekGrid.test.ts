import type { WeekBoard } from '@swardwise/domain';
import { mount } from '@vue/test-utils';
import { createPinia } from 'pinia';
import { describe, expect, test } from 'vitest';
import { createMemoryHistory, createRouter } from 'vue-router';
import WeekGrid from './WeekGrid.vue';
import { crewDayMap, DRAG_TYPE, groupCells } from './board.ts';
import { board, crewDay, DATES, order } from './sample.ts';

function mountGrid(week: WeekBoard, canEdit = true) {
  const router = createRouter({ history: createMemoryHistory(), routes: [{ path: '/:any(.*)*', component: { template: '<div />' } }] });
  const days = crewDayMap(week.crewDays);
  return mount(WeekGrid, {
    props: { board: week, cells: groupCells(week.orders, days, { siteIds: [], tasks: [] }), crewDays: days, canEdit, saving: new Set<number>(), today: DATES[2]! },
    global: { plugins: [router, createPinia()] },
  });
}

const cell = (w: ReturnType<typeof mountGrid>, crew: number | 'none', date: string) => w.get(`[data-test="board-cell"][data-crew="${crew}"][data-date="${date}"]`);

/** A DataTransfer stand-in: happy-dom has none that carries data between events. */
function transfer(data: Record<string, string> = {}) {
  const store = { ...data };
  return {
    get types() {
      return Object.keys(store);
    },
    setData: (k: string, v: string) => (store[k] = v),
    getData: (k: string) => store[k] ?? '',
    dropEffect: 'none',
    effectAllowed: 'all',
  };
}

describe('WeekGrid', () => {
  test('should lay out an unassigned row and one row per crew, each with seven days', () => {
    const w = mountGrid(board([]));
    expect(w.findAll('[data-test="crew-row"]').map((r) => r.attributes('data-crew'))).toEqual(['none', '11', '12']);
    expect(w.findAll('[data-test="board-cell"]')).toHaveLength(21);
    expect(w.findAll('[data-test="day-header"]').map((h) => h.text())).toEqual(['Mon 30 Nov', 'Tue 1 Dec', 'Wed 2 Dec', 'Thu 3 Dec', 'Fri 4 Dec', 'Sat 5 Dec', 'Sun 6 Dec']);
  });

  test('should show each card with its task, field, site and hours, and one mark for what the card does not say already', () => {
    const a = order({ crewId: 11, plannedDate: DATES[1], task: 'paint_lines', fieldName: 'Diamond 2', siteName: 'Birch Park', plannedHours: 2.25, pinned: true, origin: 'manual', status: 'assigned' });
    const w = mountGrid(board([a, order({ crewId: null, plannedDate: DATES[1] })]));
    const card = cell(w, 11, DATES[1]!).get('[data-test="order-card"]');
    expect(card.text()).toContain('Paint lines');
    expect(card.text()).toContain('Diamond 2');
    expect(card.text()).toContain('Birch Park');
    expect(card.text()).toContain('2:15 h');
    // Assigned (it sits in a crew's row), pinned and added by hand all say one thing: one mark.
    expect(card.findAll('.card__mark').map((m) => m.text())).toEqual(['By hand']);
    // Its name is its visible text (WCAG 2.5.3, label in name): no aria-label that could drift from it.
    expect(card.attributes('aria-label')).toBeUndefined();
    expect(cell(w, 'none', DATES[1]!).findAll('[data-test="order-card"]')).toHaveLength(1);
    expect(cell(w, 12, DATES[1]!).findAll('[data-test="order-card"]')).toHaveLength(0);
  });

  test('should mark a pinned card once and a started or done one by its status', () => {
    const pinned = order({ crewId: 11, plannedDate: DATES[2], pinned: true, status: 'assigned' });
    const done = order({ crewId: 11, plannedDate: DATES[2], status: 'done' });
    const w = mountGrid(board([pinned, done]));
    const cards = cell(w, 11, DATES[2]!).findAll('[data-test="order-card"]');
    expect(cards.map((c) => c.findAll('.card__mark').map((m) => m.text()))).toEqual([['Pinned'], ['Done']]);
  });

  test('should show every card of a busy crew-day, and open a very busy one as counts with a way to every card', async () => {
    const busy = Array.from({ length: 12 }, (_, i) => order({ crewId: 11, plannedDate: DATES[3], siteName: `Long Named Memorial Recreation Ground ${i}` }));
    const w = mountGrid(board(busy));
    expect(cell(w, 11, DATES[3]!).findAll('[data-test="order-card"]')).toHaveLength(12);
    const tooMany = Array.from({ length: 30 }, (_, i) => order({ crewId: null, plannedDate: DATES[4], task: i % 3 ? 'mow' : 'field_check' }));
    const w2 = mountGrid(board(tooMany));
    const c = cell(w2, 'none', DATES[4]!);
    expect(c.findAll('[data-test="order-card"]')).toHaveLength(0);
    expect(c.get('[data-test="cell-counts"]').text()).toContain('20 × Mow');
    expect(c.get('[data-test="cell-counts"]').text()).toContain('10 × Field check');
    await c.get('[data-test="cell-expand"]').trigger('click');
    expect(cell(w2, 'none', DATES[4]!).findAll('[data-test="order-card"]')).toHaveLength(30);
  });

  test('should show the load bar of a crew-day and warn when it runs over the available hours', () => {
    const days = [
      crewDay({ crewId: 11, date: DATES[0]!, workHours: 5, driveHours: 1, loadUnloadHours: 0.5, availableHours: 8 }),
      crewDay({ crewId: 11, date: DATES[1]!, workHours: 7.5, driveHours: 1.2, loadUnloadHours: 0.5, availableHours: 8, driveKm: 31.4, route: [
        { siteId: 2, siteName: 'Birch Park', lat: 0, lng: 0 },
        { siteId: 1, siteName: 'Alder Green', lat: 0, lng: 0 },
      ] }),
    ];
    const w = mountGrid(board([order({ crewId: 11, plannedDate: DATES[0] }), order({ crewId: 11, plannedDate: DATES[1] })], days));
    const calm = cell(w, 11, DATES[0]!);
    expect(calm.get('[data-test="cell-load"]').attributes('data-overloaded')).toBe('false');
    expect(calm.text()).toContain('6:30 h / 8:00 h');
    expect(calm.find('[data-test="overload"]').exists()).toBe(false);
    const busy = cell(w, 11, DATES[1]!);
    expect(busy.get('[data-test="cell-load"]').attributes('data-overloaded')).toBe('true');
    expect(busy.get('[data-test="overload"]').text()).toBe('over by 1:12 h');
    expect(busy.findAll('[data-test="cell-route"] li').map((li) => li.text())).toEqual(['Birch Park', 'Alder Green']);
    expect(busy.get('[data-test="cell-route"]').text()).toContain('19.5 mi');
    expect(busy.get('[data-test="cell-route"]').attributes('title')).toBe('North yard → Birch Park → Alder Green → North yard');
    // The bar's segments follow the hours: 7.5 of 9.2 h is the work share.
    const work = busy.get('.cell__seg.is-work').attributes('style');
    expect(Number(/width: ([\d.]+)%/.exec(work!)![1])).toBeCloseTo((7.5 / 9.2) * 100, 1);
  });

  test('should mark a crew’s day off and link each crew-day with work to its printable sheet', () => {
    const w = mountGrid(board([order({ crewId: 12, plannedDate: DATES[0] })]));
    expect(cell(w, 12, DATES[4]!).classes()).toContain('is-off');
    expect(cell(w, 11, DATES[4]!).classes()).not.toContain('is-off');
    expect(cell(w, 12, DATES[0]!).get('[data-test="print-sheet"]').attributes('href')).toBe(`/week/sheet?crewId=12&date=${DATES[0]}&districtId=1`);
  });

  test('should emit the card and the target cell when a card is dropped on another crew-day', async () => {
    const a = order({ id: 77, crewId: null, plannedDate: DATES[0] });
    const w = mountGrid(board([a]));
    const dt = transfer();
    await cell(w, 'none', DATES[0]!).get('[data-test="order-card"]').trigger('dragstart', { dataTransfer: dt });
    expect(dt.getData(DRAG_TYPE)).toBe('77');
    const target = cell(w, 11, DATES[3]!);
    await target.trigger('dragover', { dataTransfer: dt });
    expect(target.classes()).toContain('is-over');
    await target.trigger('drop', { dataTransfer: dt });
    expect(w.emitted('drop')).toEqual([[77, 11, DATES[3]]]);
  });

  test('should neither drag nor accept drops when the role may not change the plan', async () => {
    const w = mountGrid(board([order({ crewId: null })]), false);
    expect(w.get('[data-test="order-card"]').attributes('draggable')).toBe('false');
    await cell(w, 11, DATES[3]!).trigger('drop', { dataTransfer: transfer({ [DRAG_TYPE]: '1' }) });
    expect(w.emitted('drop')).toBeUndefined();
  });

  test('should keep done work where it is', () => {
    const w = mountGrid(board([order({ crewId: 11, status: 'done', actualHours: 1.4 })]));
    expect(w.get('[data-test="order-card"]').attributes('draggable')).toBe('false');
  });
});
