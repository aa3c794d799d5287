import { defineAbilityFor, type Role, type WeekBoard } from '@swardwise/domain';
import { VueQueryPlugin } from '@tanstack/vue-query';
import { flushPromises, mount } from '@vue/test-utils';
import ElementPlus from 'element-plus';
import { createPinia, setActivePinia } from 'pinia';
import { afterEach, describe, expect, test, vi } from 'vitest';
import { createMemoryHistory, createRouter } from 'vue-router';
import { ability } from '../ability.ts';
import { messageFor } from '../api/messages.ts';
import { createQueryClient } from '../api/queryClient.ts';
import { DRAG_TYPE } from '../components/week/board.ts';
import { board, DATES, diffItem, order, WEEK } from '../components/week/sample.ts';
import { useSessionStore } from '../stores/session.ts';
import WeekPlanView from './WeekPlanView.vue';

interface Call {
  method: string;
  url: string;
  body: unknown;
}

/** A fake API: answers from the handler, records every call. */
function fakeApi(handler: (call: Call) => { status?: number; body: unknown }) {
  const calls: Call[] = [];
  vi.stubGlobal(
    'fetch',
    vi.fn(async (url: string, init: RequestInit) => {
      const call = { method: init.method ?? 'GET', url, body: init.body ? JSON.parse(init.body as string) : undefined };
      calls.push(call);
      const { status = 200, body } = handler(call);
      return new Response(JSON.stringify(body), { status, headers: { 'Content-Type': 'application/json' } });
    }),
  );
  return calls;
}

async function mountView(role: Role) {
  const pinia = createPinia();
  setActivePinia(pinia);
  const session = useSessionStore();
  const districtId = role === 'foreman' ? 1 : null;
  session.user = { id: 3, email: 'x@swardwise.example', name: 'X', role, districtId, crewId: null, siteIds: [], units: 'metric', version: 1 };
  ability.update(defineAbilityFor({ id: 3, role, districtId, crewId: null, siteIds: [] }).rules);
  const router = createRouter({ history: createMemoryHistory(), routes: [{ path: '/:any(.*)*', component: { template: '<div />' } }] });
  await router.push(`/week?week=${WEEK}`);
  const w = mount(WeekPlanView, { global: { plugins: [pinia, router, ElementPlus, [VueQueryPlugin, { queryClient: createQueryClient() }]] }, attachTo: document.body });
  await flushPromises();
  return w;
}

function transfer(id: number) {
  const store: Record<string, string> = { [DRAG_TYPE]: String(id) };
  return { types: Object.keys(store), getData: (k: string) => store[k] ?? '', setData: () => undefined, dropEffect: 'none' };
}
const settle = async () => {
  for (let i = 0; i < 4; i++) {
    await flushPromises();
    await new Promise((r) => setTimeout(r, 0));
  }
};
const gets = (calls: Call[]) => calls.filter((c) => c.method === 'GET' && c.url.startsWith('/api/week-plans'));

afterEach(() => {
  vi.unstubAllGlobals();
  document.body.innerHTML = '';
});

describe('WeekPlanView', () => {
  test('should load the foreman’s own district and week, and move a dropped card with the version it was read at', async () => {
    let week: WeekBoard = board([order({ id: 77, version: 4 })]);
    const calls = fakeApi((c) => {
      if (c.method === 'PATCH') {
        week = board([order({ id: 77, version: 5, crewId: 11, crewName: 'North A', plannedDate: DATES[2]!, pinned: true })]);
        return { body: week.orders[0] };
      }
      return { body: week };
    });
    const w = await mountView('foreman');
    expect(gets(calls)[0]!.url).toBe(`/api/week-plans?districtId=1&weekStart=${WEEK}`);
    expect(w.find('[data-test="generate-week"]').exists()).toBe(true);

    await w.get(`[data-test="board-cell"][data-crew="11"][data-date="${DATES[2]}"]`).trigger('drop', { dataTransfer: transfer(77) });
    await settle();
    const patch = calls.find((c) => c.method === 'PATCH')!;
    expect(patch.url).toBe('/api/work-orders/77');
    expect(patch.body).toEqual({ version: 4, crewId: 11, plannedDate: DATES[2] });
    // The board reloads so the crew-days' hours and routes are the server's.
    expect(gets(calls)).toHaveLength(2);
    const moved = w.get(`[data-test="board-cell"][data-crew="11"][data-date="${DATES[2]}"]`);
    expect(moved.findAll('[data-test="order-card"]')).toHaveLength(1);
    expect(moved.find('[data-test="mark-pinned"]').exists()).toBe(true);
    w.unmount();
  });

  test('should say someone else changed the order and reload when the move answers 409', async () => {
    const server = board([order({ id: 77, version: 6, crewId: 12, crewName: 'North B', plannedDate: DATES[1]! })]);
    let first = true;
    const calls = fakeApi((c) => {
      if (c.method === 'PATCH') return { status: 409, body: { error: { code: 'work_order/version_conflict', message: 'stale' } } };
      if (first) {
        first = false;
        return { body: board([order({ id: 77, version: 5 })]) };
      }
      return { body: server };
    });
    const w = await mountView('foreman');
    await w.get(`[data-test="board-cell"][data-crew="11"][data-date="${DATES[3]}"]`).trigger('drop', { dataTransfer: transfer(77) });
    await settle();
    expect(calls.find((c) => c.method === 'PATCH')!.body).toMatchObject({ version: 5 });
    expect(document.body.textContent).toContain(messageFor('work_order/version_conflict'));
    expect(gets(calls)).toHaveLength(2);
    // The card shows where the other person put it, not where it was dropped.
    expect(w.find(`[data-test="board-cell"][data-crew="11"][data-date="${DATES[3]}"] [data-test="order-card"]`).exists()).toBe(false);
    expect(w.find(`[data-test="board-cell"][data-crew="12"][data-date="${DATES[1]}"] [data-test="order-card"]`).exists()).toBe(true);
    w.unmount();
  });

  test('should preview the generated week without writing, then apply it on confirm', async () => {
    const applied = board([order({ id: 90, crewId: 11, plannedDate: DATES[1]! })]);
    const diff = { added: [diffItem()], removed: [], changed: [], kept: [], summary: { added: 1, removed: 0, changed: 0, kept: 0 } };
    const calls = fakeApi((c) => {
      if (c.method === 'POST') return { body: { diff, board: (c.body as { dryRun: boolean }).dryRun ? board([]) : applied } };
      return { body: board([]) };
    });
    const w = await mountView('foreman');
    await w.get('[data-test="generate-week"]').trigger('click');
    await settle();
    const posts = () => calls.filter((c) => c.method === 'POST');
    expect(posts().map((c) => c.body)).toEqual([{ districtId: 1, weekStart: WEEK, dryRun: true }]);
    expect(document.body.querySelector('[data-test="diff-summary"]')!.textContent).toContain('1 added');
    expect(w.findAll('[data-test="order-card"]')).toHaveLength(0);

    (document.body.querySelector('[data-test="diff-apply"]') as HTMLButtonElement).click();
    await settle();
    expect(posts().map((c) => c.body)).toEqual([
      { districtId: 1, weekStart: WEEK, dryRun: true },
      { districtId: 1, weekStart: WEEK, dryRun: false },
    ]);
    expect(w.findAll('[data-test="order-card"]')).toHaveLength(1);
    w.unmount();
  });

  test('should show the head the board read-only, with a district picker and no generate button', async () => {
    const calls = fakeApi((c) => {
      if (c.url.startsWith('/api/districts')) return { body: { items: [{ id: 2, name: 'Central', code: 'central' }] } };
      return { body: { ...board([order({ crewId: null })]), districtId: 2, districtName: 'Central' } };
    });
    const w = await mountView('head');
    await settle();
    expect(gets(calls)[0]!.url).toBe(`/api/week-plans?districtId=2&weekStart=${WEEK}`);
    expect(w.find('[data-test="week-district"]').exists()).toBe(true);
    expect(w.find('[data-test="generate-week"]').exists()).toBe(false);
    expect(w.find('[data-test="week-readonly"]').exists()).toBe(true);
    expect(w.get('[data-test="order-card"]').attributes('draggable')).toBe('false');
    w.unmount();
  });
});
