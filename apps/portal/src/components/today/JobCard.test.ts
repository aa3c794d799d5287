import type { WorkOrderRow } from '@swardwise/domain';
import { mount, RouterLinkStub } from '@vue/test-utils';
import ElementPlus from 'element-plus';
import { createPinia, setActivePinia } from 'pinia';
import { beforeEach, describe, expect, test } from 'vitest';
import { useSessionStore } from '../../stores/session.ts';
import type { QueuedReport } from '../../utils/reportQueue.ts';
import { order as sampleOrder } from '../week/sample.ts';
import JobCard from './JobCard.vue';

const order = (patch: Partial<WorkOrderRow> = {}): WorkOrderRow =>
  sampleOrder({
    id: 12,
    fieldId: 3,
    fieldName: 'Soccer 1',
    siteId: 2,
    siteName: 'Alder Run Park',
    plannedDate: '2026-06-01',
    crewId: 1,
    crewName: 'Crew A',
    plannedHours: 0.94,
    status: 'assigned',
    reason: '',
    details: { hocMm: 50.8, mowerKind: 'reel' },
    ...patch,
  });

function mountCard(props: { order: WorkOrderRow; queued?: QueuedReport; stop?: number }, units: 'imperial' | 'metric' = 'imperial') {
  const pinia = createPinia();
  setActivePinia(pinia);
  useSessionStore().user = { id: 1, email: 'c@test.example', name: 'C', role: 'crew', districtId: 1, crewId: 1, siteIds: [], units, version: 1 };
  return mount(JobCard, { props, global: { plugins: [ElementPlus, pinia], stubs: { RouterLink: RouterLinkStub } } });
}

beforeEach(() => setActivePinia(createPinia()));

describe('JobCard', () => {
  test('should show the task, field, site, HOC in the user’s units, the mower kind and the planned hours', () => {
    const card = mountCard({ order: order(), stop: 2 });
    expect(card.text()).toContain('Mow');
    expect(card.text()).toContain('Soccer 1');
    expect(card.text()).toContain('Alder Run Park');
    // Heights show to the eighth of an inch crews set mowers in (was "2.00 in").
    expect(card.text()).toMatch(/HOC\s*2 in/);
    expect(card.text()).toMatch(/Mower\s*Reel mower/);
    expect(card.text()).toMatch(/Planned\s*0:56 h/);
    expect(card.get('[aria-label="Stop 2"]').text()).toBe('2');
    expect(card.get('[data-test="job-status"]').text()).toBe('Assigned');
    expect(card.findAll('.job__actions button').map((b) => b.text())).toEqual(['Start', 'Done', 'Skip']);
    expect(mountCard({ order: order() }, 'metric').text()).toMatch(/HOC\s*51 mm/);
  });

  test('should show a colourant job’s product, rate, area and amount in the user’s units, with its caution', () => {
    const colourant = { product: 'Meadow Deep pigment', rateMlPerM2: 3, areaM2: 7140 };
    const card = mountCard({ order: order({ task: 'colourant', details: { colourant } }) });
    expect(card.text()).toMatch(/Product\s*Meadow Deep pigment/);
    // 3 mL/m² = 9.4 fl oz per 1,000 ft²; 7,140 m² = 76,854 ft²; 21.42 L = 5.7 US gal.
    expect(card.text()).toMatch(/Rate\s*9\.4 fl oz per 1,000 ft²/);
    expect(card.text()).toMatch(/Area\s*76,854 ft²/);
    expect(card.text()).toMatch(/Amount\s*5\.7 gal/);
    expect(card.get('[data-test="job-colourant-caution"]').text()).toMatch(/changes colour, not turf health/);
    expect(mountCard({ order: order({ task: 'colourant', details: { colourant } }) }, 'metric').text()).toMatch(/Rate\s*3\.0 mL\/m²/);
    expect(mountCard({ order: order() }).find('[data-test="job-colourant-caution"]').exists()).toBe(false);
  });

  test('should show a queued report’s status before the server has it, and no buttons once done', () => {
    const queued = { body: { status: 'done', actualHours: 1.25, note: '', clientRef: 'abcdefgh', reportedAt: '' }, state: 'waiting' } as unknown as QueuedReport;
    const card = mountCard({ order: order(), queued });
    expect(card.get('[data-test="job-status"]').text()).toMatch(/^Done\s*waiting to send$/);
    expect(card.text()).toMatch(/Took\s*1:15 h/);
    expect(card.find('.job__actions').exists()).toBe(false);
    const started = mountCard({ order: order({ status: 'started' }) });
    expect(started.findAll('.job__actions button').map((b) => b.text())).toEqual(['Done', 'Skip']);
  });

  test('should pass on which button was pressed', async () => {
    const card = mountCard({ order: order() });
    await card.get('[data-test="job-start"]').trigger('click');
    await card.get('[data-test="job-done"]').trigger('click');
    await card.get('[data-test="job-skip"]').trigger('click');
    expect(Object.keys(card.emitted())).toEqual(expect.arrayContaining(['start', 'done', 'skip']));
  });

  test('should show a job a rain-out cancelled as cancelled, with who cancelled it and why, and no buttons', () => {
    const card = mountCard({ order: order({ status: 'skipped', details: { cancelled: { reason: 'Thunderstorms, fields waterlogged', by: 'Dana Foreman', on: '2026-06-01' } } }) });
    expect(card.get('[data-test="job-status"]').text()).toBe('Cancelled');
    expect(card.get('[data-test="job-cancelled"]').text()).toBe('Cancelled by Dana Foreman: Thunderstorms, fields waterlogged');
    expect(card.findAll('.job__actions button')).toHaveLength(0);
  });

  test('should stop a job on a closed field with the reason and offer only Skip', () => {
    const card = mountCard({ order: order({ fieldStatus: 'closed', fieldStatusNote: 'Standing water' }) });
    expect(card.get('[data-test="job-field-status"]').text()).toMatch(/Field closed: Standing water\. This job cannot be done while the field is closed/);
    expect(card.findAll('.job__actions button').map((b) => b.text())).toEqual(['Skip']);
    const restricted = mountCard({ order: order({ fieldStatus: 'restricted', fieldStatusNote: 'Goalmouths resting' }) });
    expect(restricted.get('[data-test="job-field-status"]').text()).toBe('Field restricted: Goalmouths resting');
    expect(restricted.findAll('.job__actions button').map((b) => b.text())).toEqual(['Start', 'Done', 'Skip']);
    expect(mountCard({ order: order() }).find('[data-test="job-field-status"]').exists()).toBe(false);
  });

  test('should link to the field’s centre with a geo: URI and show the pattern only when the order asks one', () => {
    const card = mountCard({ order: order({ fieldLat: 41.512345678, fieldLng: -66.4 }) });
    expect(card.get('[data-test="job-directions"]').attributes('href')).toBe('geo:41.512346,-66.400000?q=41.512346,-66.400000(Soccer%201)');
    expect(card.text()).not.toMatch(/Pattern/);
    expect(mountCard({ order: order({ details: { hocMm: 50.8, pattern: 'Stripes along the long axis' } }) }).text()).toMatch(/Pattern\s*Stripes along the long axis/);
    // A pattern the week plan set reads as its label.
    expect(mountCard({ order: order({ details: { hocMm: 50.8, pattern: 'checkerboard' } }) }).text()).toMatch(/Pattern\s*Checkerboard \(criss-cross\)/);
  });

  test('should offer Log check on a check job, and a same-day reopen on a done job', async () => {
    const check = mountCard({ order: order({ task: 'field_check' }) });
    expect(check.findAll('.job__actions button').map((b) => b.text())).toEqual(['Log check', 'Skip']);
    await check.get('[data-test="job-check"]').trigger('click');
    expect(check.emitted('check')).toHaveLength(1);
    const done = mountCard({ order: order({ status: 'done', doneAt: new Date().toISOString() }) });
    await done.get('[data-test="job-reopen"]').trigger('click');
    expect(done.emitted('reopen')).toHaveLength(1);
    expect(mountCard({ order: order({ status: 'done', doneAt: '2020-01-01T15:00:00Z' }) }).find('[data-test="job-reopen"]').exists()).toBe(false);
  });
});
