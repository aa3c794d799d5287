import { abilitiesPlugin } from '@casl/vue';
import { defineAbilityFor, type Actor, type FieldEventRow } from '@swardwise/domain';
import { VueQueryPlugin } from '@tanstack/vue-query';
import { flushPromises, mount } from '@vue/test-utils';
import ElementPlus from 'element-plus';
import { createPinia } from 'pinia';
import { afterEach, describe, expect, test, vi } from 'vitest';
import { createQueryClient } from '../../api/queryClient.ts';
import FieldBookingsCard from './FieldBookingsCard.vue';

const field = { id: 40, name: 'Stadium', siteId: 8, districtId: 1, status: 'open' as const, statusNote: '' };
const booking = (id: number, createdBy: number | null): FieldEventRow => ({
  id,
  fieldId: 40,
  fieldName: 'Stadium',
  siteId: 8,
  siteName: 'Invented High School',
  districtId: 1,
  kind: 'game',
  title: `Invented game ${id}`,
  startsOn: '2026-06-02',
  startTime: null,
  notes: '',
  createdBy,
  version: 1,
  updatedAt: '2026-05-01T00:00:00Z',
});
const BOOKINGS = [booking(1, 5), booking(2, 6), booking(3, 3)];

async function mountCard(actor: Actor) {
  vi.stubGlobal(
    'fetch',
    vi.fn(async () => new Response(JSON.stringify({ items: BOOKINGS }), { status: 200, headers: { 'Content-Type': 'application/json' } })),
  );
  const w = mount(FieldBookingsCard, { props: { field }, global: { plugins: [createPinia(), ElementPlus, [abilitiesPlugin, defineAbilityFor(actor)], [VueQueryPlugin, { queryClient: createQueryClient() }]] } });
  await flushPromises();
  return w;
}

const actions = (w: Awaited<ReturnType<typeof mountCard>>) => w.findAll('[data-test^="edit-booking-"], [data-test^="delete-booking-"]').map((b) => b.attributes('data-test'));

afterEach(() => vi.unstubAllGlobals());

describe('FieldBookingsCard', () => {
  test('should offer a partner edit and delete only on the bookings he made', async () => {
    const w = await mountCard({ id: 5, role: 'partner', districtId: null, crewId: null, siteIds: [8] });
    expect(w.findAll('[data-test="booking"]')).toHaveLength(3);
    expect(actions(w)).toEqual(['edit-booking-1', 'delete-booking-1']);
    expect(w.find('[data-test="new-booking"]').exists()).toBe(true);
  });

  test('should offer the district foreman every booking', async () => {
    const w = await mountCard({ id: 3, role: 'foreman', districtId: 1, crewId: null, siteIds: [] });
    expect(actions(w)).toEqual(['edit-booking-1', 'delete-booking-1', 'edit-booking-2', 'delete-booking-2', 'edit-booking-3', 'delete-booking-3']);
  });
});
