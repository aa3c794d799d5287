import type { PartnerBookingItem, PartnerFieldAnswer, PartnerRequestItem } from '@swardwise/domain';
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

const request = (id: number, over: Partial<PartnerRequestItem>): PartnerRequestItem => ({
  type: 'request',
  id,
  kind: 'wet_area',
  startsOn: '2026-12-03',
  gameOn: null,
  startTime: null,
  layout: null,
  description: `Invented puddle ${id}`,
  state: 'requested',
  reason: '',
  mine: true,
  version: 1,
  ...over,
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

  test('should show requests beside bookings with their state and a decline’s reason, and offer a change only on the partner’s own still-requested ones', () => {
    const w = mountAgenda(
      answer([
        request(5, {}),
        request(6, { state: 'declined', reason: 'Drains are on the spring list' }),
        request(7, { mine: false, version: null, kind: 'safety' }),
        booking(2, true, '2026-12-09'),
        request(8, { kind: 'game_lines', startsOn: '2026-12-09', gameOn: '2026-12-09', startTime: '18:30', layout: 'football', description: 'Senior night', state: 'scheduled' }),
      ]),
    );
    const rows = w.findAll('[data-type="request"]');
    expect(rows).toHaveLength(4);
    expect(rows.map((r) => r.find('[data-test="request-state"]').text())).toEqual(['Requested', 'Declined', 'Requested', 'Scheduled']);
    expect(rows[0]!.text()).toContain('Today');
    expect(rows[0]!.text()).toContain('Request · Wet area');
    expect(rows[1]!.find('[data-test="request-reason"]').text()).toBe('Declined: Drains are on the spring list');
    expect(rows[2]!.text()).toContain('filed by a colleague');
    expect(rows[3]!.text()).toContain('American football (NFHS) lines');
    expect(rows[3]!.text()).toContain('Senior night');
    expect(rows[3]!.text()).toContain('18:30');
    // Only request 5 is the partner's own and still requested.
    expect(w.findAll('[data-test^="edit-request-"]').map((b) => b.attributes('data-test'))).toEqual(['edit-request-5']);
    expect(w.findAll('[data-type="booking"]')).toHaveLength(1);
  });
});
