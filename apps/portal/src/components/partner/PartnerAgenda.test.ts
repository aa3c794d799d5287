import type { PartnerBookingItem, PartnerFieldAnswer } from '@swardwise/domain';
import { VueQueryPlugin } from '@tanstack/vue-query';
import { mount } from '@vue/test-utils';
import ElementPlus from 'element-plus';
import { createPinia } from 'pinia';
import { describe, expect, test } from 'vitest';
import { createQueryClient } from '../../api/queryClient.ts';
import PartnerAgenda from './PartnerAgenda.vue';

const booking = (id: number, mine: boolean, startsOn: string): PartnerBookingItem => ({
  type: 'booking',
  id,
  kind: 'game',
  title: `Invented game ${id}`,
  startsOn,
  startTime: mine ? '18:00' : null,
  notes: mine ? 'Home bench' : '',
  mine,
  version: mine ? 2 : null,
});

const answer = (agenda: PartnerFieldAnswer['agenda'], canBook = true): PartnerFieldAnswer => ({
  today: '2026-12-03',
  field: { id: 40, name: 'Stadium', sport: 'football', siteName: 'Invented High School', siteAddress: '' },
  status: { status: 'open', headline: 'Open for play', reason: null, since: null, expectedReopenOn: null },
  check: null,
  nextMowing: { on: null, basis: null },
  nextLines: { on: null, basis: null },
  agenda,
  canBook,
  cautions: [],
});

const mountAgenda = (a: PartnerFieldAnswer) => mount(PartnerAgenda, { props: { answer: a }, global: { plugins: [createPinia(), ElementPlus, [VueQueryPlugin, { queryClient: createQueryClient() }]] } });

describe('PartnerAgenda', () => {
  test('should list the rows by kind with day words, and offer changes only on the partner’s own bookings', () => {
    const w = mountAgenda(answer([booking(1, false, '2026-12-04'), booking(2, true, '2026-12-09')]));
    const rows = w.findAll('[data-type="booking"]');
    expect(rows).toHaveLength(2);
    expect(rows[0]!.text()).toContain('Tomorrow');
    expect(rows[0]!.text()).toContain('by the parks department or another group');
    expect(rows[1]!.text()).toContain('Wed, Dec 9');
    expect(rows[1]!.text()).toContain('Home bench');
    expect(w.findAll('[data-test^="edit-booking-"], [data-test^="delete-booking-"]').map((b) => b.attributes('data-test'))).toEqual(['edit-booking-2', 'delete-booking-2']);
    expect(w.find('[data-test="new-booking"]').exists()).toBe(true);
  });

  test('should say when nothing is coming, and offer no booking where the partner may not book', () => {
    const w = mountAgenda(answer([], false));
    expect(w.find('[data-test="bookings-empty"]').text()).toBe('Nothing booked from today on.');
    expect(w.find('[data-test="new-booking"]').exists()).toBe(false);
  });
});
