import type { CrewRow } from '@swardwise/domain';
import { flushPromises } from '@vue/test-utils';
import { describe, expect, test, vi } from 'vitest';
import { $, answering, cleanUpAfterEach, dialogWords, district, errorsShown, FOREMAN_NORTH, mountDialog, submitDialog, type, waitForErrors } from '../../testing/dialogs.ts';
import CrewFormDialog from './CrewFormDialog.vue';
import { workDaysText } from './crewForm.ts';

const DISTRICTS = [district(1, 'North'), district(2, 'South')];
const CREW: CrewRow = { id: 5, districtId: 1, districtName: 'North', name: 'North Crew A', hoursPerDay: 8, members: ['R. Alder'], workDays: ['mon', 'tue', 'wed', 'thu', 'fri'], leadUserId: null, leadName: null, version: 3 };

const mountForm = (fetch: (...args: never[]) => unknown, crew: CrewRow | null = null) => mountDialog(CrewFormDialog, { crew, districts: DISTRICTS }, { actor: FOREMAN_NORTH, fetch });
async function toggleDay(day: string) {
  ($(`[data-test="crew-day-${day}"] input`) as HTMLInputElement).click();
  await flushPromises();
}
const submit = () => submitDialog('crew');
const okResponse = (crew: object) => new Response(JSON.stringify({ crew }), { status: 201, headers: { 'Content-Type': 'application/json' } });
cleanUpAfterEach();

describe('CrewFormDialog', () => {
  test('should show the schema’s messages for a short name, no hours and no working day, and send nothing', async () => {
    const fetch = vi.fn();
    const w = await mountForm(fetch);
    await type('[data-test="crew-name"]', 'A');
    await type('[data-test="crew-hours"]', '');
    for (const d of ['mon', 'tue', 'wed', 'thu', 'fri']) await toggleDay(d);
    await submit();
    await waitForErrors(['enter a crew name', 'hours per day is required', 'a crew works at least one day a week']);
    expect(fetch).not.toHaveBeenCalled();
    w.unmount();
  });

  test('should refuse a shift longer than 16 hours', async () => {
    const w = await mountForm(vi.fn());
    await type('[data-test="crew-name"]', 'North Crew C');
    await type('[data-test="crew-hours"]', '18');
    await submit();
    await vi.waitFor(() => expect(errorsShown()).toEqual(['more than 16 hours a day is not a shift']));
    w.unmount();
  });

  test('should send a foreman’s new crew in his district with its days and members', async () => {
    const fetch = vi.fn(async (_url: string, init: RequestInit) => okResponse({ ...CREW, ...JSON.parse(String(init.body)), id: 9 }));
    const w = await mountForm(fetch);
    await type('[data-test="crew-name"]', 'North Crew C');
    await type('[data-test="crew-hours"]', '9.5');
    await toggleDay('fri');
    await toggleDay('sat');
    const tagInput = $('[data-test="crew-members"] input, input[data-test="crew-members"]') as HTMLInputElement;
    for (const name of ['P. Sedge', 'Q. Rush']) {
      tagInput.value = name;
      tagInput.dispatchEvent(new Event('input'));
      tagInput.dispatchEvent(new KeyboardEvent('keydown', { key: 'Enter', code: 'Enter' }));
      await flushPromises();
    }
    await submit();
    await vi.waitFor(() => expect(fetch).toHaveBeenCalledTimes(1));
    const [url, init] = fetch.mock.calls[0]!;
    expect(url).toBe('/api/crews');
    expect(JSON.parse(String(init.body))).toEqual({ districtId: 1, name: 'North Crew C', hoursPerDay: 9.5, workDays: ['mon', 'tue', 'wed', 'thu', 'sat'], members: ['P. Sedge', 'Q. Rush'] });
    expect(w.emitted('saved')).toHaveLength(1);
    await vi.waitFor(() => expect(document.body.querySelector('.el-message--success')?.textContent).toContain('Crew North Crew C added.'));
    w.unmount();
  });

  test('should name a new crew by its kind and an edited one by its name, and say the edit was saved', async () => {
    const created = await mountForm(vi.fn());
    expect(dialogWords('crew')).toEqual({ title: 'New crew', submitLabel: 'Add crew' });
    created.unmount();
    const w = await mountForm(vi.fn(async () => okResponse({ ...CREW, version: 4 })), CREW);
    expect(dialogWords('crew')).toEqual({ title: 'Edit North Crew A', submitLabel: 'Save' });
    await submit();
    await vi.waitFor(() => expect(document.body.querySelector('.el-message--success')?.textContent).toContain('North Crew A saved.'));
    w.unmount();
  });

  test('should send the version it read and say so on a 409', async () => {
    const fetch = answering(409, { error: { code: 'crew/version_conflict', message: 'conflict' } });
    const w = await mountForm(fetch, CREW);
    await submit();
    const init = fetch.mock.calls[0]![1]!;
    expect(JSON.parse(String(init.body))).toMatchObject({ version: 3, name: 'North Crew A' });
    expect($('[data-test="crew-form-error"]')?.textContent).toMatch(/Someone else changed this crew/);
    w.unmount();
  });
});

describe('workDaysText', () => {
  test('should fold runs of three or more days and keep the week Monday first', () => {
    expect(workDaysText(['mon', 'tue', 'wed', 'thu', 'fri'])).toBe('Mon–Fri');
    expect(workDaysText(['sun', 'sat', 'tue', 'wed'])).toBe('Tue, Wed, Sat, Sun');
    expect(workDaysText(['tue', 'wed', 'thu', 'sat'])).toBe('Tue–Thu, Sat');
    expect(workDaysText([])).toBe('—');
  });
});
