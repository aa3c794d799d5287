import { VueQueryPlugin } from '@tanstack/vue-query';
import { flushPromises, mount } from '@vue/test-utils';
import ElementPlus from 'element-plus';
import { createPinia, setActivePinia } from 'pinia';
import { afterEach, describe, expect, test, vi } from 'vitest';
import { createMemoryHistory, createRouter } from 'vue-router';
import { createQueryClient } from '../api/queryClient.ts';
import { board, crewDay, DATES, order } from '../components/week/sample.ts';
import CrewSheetView from './CrewSheetView.vue';

afterEach(() => vi.unstubAllGlobals());

async function mountSheet() {
  const day = DATES[0]!;
  const orders = [
    order({ id: 1, crewId: 11, plannedDate: day, siteId: 1, siteName: 'Alder Green', siteAddress: '14 Larch Row', details: { hocMm: 38, mower: 'rotary', pattern: 'side_to_side' } }),
    order({ id: 2, crewId: 11, plannedDate: day, siteId: 2, siteName: 'Fen Park', siteAddress: '2 Reed Lane', fieldName: 'Fen 1', fieldStatus: 'closed', fieldStatusNote: 'Waterlogged goalmouths', details: { hocMm: 25, mowerKind: 'reel' } }),
    order({ id: 3, crewId: 11, plannedDate: day, siteId: 2, siteName: 'Fen Park', siteAddress: '2 Reed Lane', task: 'paint_lines', equipmentName: 'N-P1 line painter', details: {} }),
  ];
  const answer = board(orders, [crewDay({ crewId: 11, date: day, route: [{ siteId: 1, siteName: 'Alder Green' }, { siteId: 2, siteName: 'Fen Park' }] as never, orderIds: [1, 2, 3] })]);
  vi.stubGlobal('fetch', vi.fn(async () => new Response(JSON.stringify(answer), { status: 200, headers: { 'Content-Type': 'application/json' } })));
  const pinia = createPinia();
  setActivePinia(pinia);
  const router = createRouter({ history: createMemoryHistory(), routes: [{ path: '/:any(.*)*', component: { template: '<div />' } }] });
  await router.push(`/week/sheet?crewId=11&date=${day}&districtId=1`);
  const w = mount(CrewSheetView, { global: { plugins: [pinia, router, ElementPlus, [VueQueryPlugin, { queryClient: createQueryClient() }]] } });
  for (let i = 0; i < 4; i++) {
    await flushPromises();
    await new Promise((r) => setTimeout(r, 0));
  }
  return w;
}

describe('CrewSheetView', () => {
  test('should name the mower of every mowing and the unit of other jobs, with each site\u2019s address', async () => {
    const w = await mountSheet();
    expect(w.findAll('[data-test="sheet-equipment"]').map((c) => c.text())).toEqual(['Rotary mower', 'Reel mower', 'N-P1 line painter']);
    expect(w.findAll('[data-test="sheet-address"]').map((c) => c.text())).toEqual(['14 Larch Row', '2 Reed Lane', '2 Reed Lane']);
    expect(w.get('[data-test="sheet-route"]').text()).toContain('2 Reed Lane');
  });

  test('should mark a closed field on its row and above the jobs', async () => {
    const w = await mountSheet();
    const rows = w.findAll('[data-test="sheet-job"]');
    expect(rows[1]!.classes()).toContain('is-not-open');
    expect(rows[1]!.get('[data-test="sheet-field-status"]').text()).toBe('Closed');
    expect(rows[0]!.find('[data-test="sheet-field-status"]').exists()).toBe(false);
    expect(w.get('[data-test="sheet-closures"]').text()).toContain('Fen 1 at Fen Park is closed: Waterlogged goalmouths.');
  });

  test('should show the stripe pattern a mowing asks for, and none where it asks none', async () => {
    const w = await mountSheet();
    const rows = w.findAll('[data-test="sheet-job"]');
    expect(rows[0]!.get('[data-test="sheet-pattern"]').text()).toBe('Pattern: Side-to-side stripes');
    expect(rows[1]!.find('[data-test="sheet-pattern"]').exists()).toBe(false);
  });
});
