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
});
