import { type Actor } from '@swardwise/domain';
import { VueQueryPlugin } from '@tanstack/vue-query';
import { flushPromises } from '@vue/test-utils';
import { describe, expect, test, vi } from 'vitest';
import { createQueryClient } from '../../api/queryClient.ts';
import { $, cleanUpAfterEach, dialogWords, errorsShown, mountDialog, submitDialog, type } from '../../testing/dialogs.ts';
import RequestFormDialog from './RequestFormDialog.vue';

const PARTNER: Actor = { id: 5, role: 'partner', districtId: null, crewId: null, siteIds: [8] };
const FIELD = { id: 40, name: 'Stadium', siteId: 8, siteName: 'Invented High School', districtId: 1, sport: 'football', status: 'open', statusNote: '' };
const json = (status: number, body: unknown) => new Response(JSON.stringify(body), { status, headers: { 'Content-Type': 'application/json' } });

/** The API as the dialog meets it: the partner's fields, and `answer` for the request sent. */
function api(answer: (init: RequestInit) => Response) {
  const fetch = vi.fn(async (url: string, init?: RequestInit) => (String(url).startsWith('/api/fields') ? json(200, { items: [FIELD] }) : answer(init!)));
  vi.stubGlobal('fetch', fetch);
  return fetch;
}
const sent = (fetch: ReturnType<typeof api>) => fetch.mock.calls.filter(([url]) => String(url).startsWith('/api/requests'));

const mountForm = (props: Record<string, unknown> = { fieldId: 40 }) => mountDialog(RequestFormDialog, props, { actor: PARTNER, plugins: [[VueQueryPlugin, { queryClient: createQueryClient() }]] });
cleanUpAfterEach();

describe('RequestFormDialog', () => {
  test('should ask for the game’s day and a description before sending anything, with the layout of a football field chosen', async () => {
    const fetch = api(() => json(201, {}));
    const w = await mountForm();
    expect(dialogWords('request')).toEqual({ title: 'New request', submitLabel: 'Send request' });
    expect($('[data-test="request-layout"]')?.closest('.el-form-item')?.textContent).toContain('American football');
    await submitDialog('request');
    await vi.waitFor(() => {
      const shown = errorsShown();
      expect(shown).toContain('give the date of the game');
      expect(shown).toContain('say what you need (at least a few words)');
    });
    expect(sent(fetch)).toEqual([]);
    w.unmount();
  }, 30_000);

  test('should show the server’s refusal of the day beside the day and keep the dialog open', async () => {
    const fetch = api(() => json(400, { error: { code: 'field_request/past_game', message: 'The game’s day has passed; give a day from today on', details: { issues: [{ path: 'body.gameOn', message: 'must be 2026-12-03 or later' }] } } }));
    const w = await mountForm();
    await type('[data-test="request-date"]', '2030-06-01');
    const area = $('textarea[data-test="request-description"], [data-test="request-description"] textarea') as HTMLTextAreaElement;
    area.value = 'League final, home v away';
    area.dispatchEvent(new Event('input'));
    await flushPromises();
    await submitDialog('request');
    await vi.waitFor(() => expect(sent(fetch)).toHaveLength(1));
    expect(JSON.parse(String(sent(fetch)[0]![1]!.body))).toMatchObject({ fieldId: 40, kind: 'game_lines', layout: 'football', description: 'League final, home v away' });
    await vi.waitFor(() => expect(errorsShown()).toContain('must be 2026-12-03 or later'));
    expect($('[data-test="request-dialog"]')).not.toBeNull();
    expect(w.emitted('saved')).toBeUndefined();
    w.unmount();
  }, 30_000);

  test('should change a filed request: its day, time, layout and words go as a PATCH with the version, field and kind stay fixed, no photos', async () => {
    const row = { id: 71, fieldId: 40, kind: 'game_lines', gameOn: '2030-06-01', startTime: '18:00', layout: 'football', description: 'League final', version: 3 };
    const fetch = api(() => json(200, { request: { ...row, description: 'League final, home side', version: 4 } }));
    const w = await mountForm({ request: row });
    expect(dialogWords('request')).toEqual({ title: 'Change request', submitLabel: 'Save changes' });
    expect(($('[data-test="request-field"] input, input[data-test="request-field"]') as HTMLInputElement | null)?.disabled ?? $('[data-test="request-field"]')?.className.includes('is-disabled')).toBeTruthy();
    expect($('[data-test="request-photos"]')).toBeNull();
    const area = $('textarea[data-test="request-description"], [data-test="request-description"] textarea') as HTMLTextAreaElement;
    expect(area.value).toBe('League final');
    area.value = 'League final, home side';
    area.dispatchEvent(new Event('input'));
    await flushPromises();
    await submitDialog('request');
    await vi.waitFor(() => expect(sent(fetch)).toHaveLength(1));
    const [url, init] = sent(fetch)[0]!;
    expect(String(url)).toContain('/api/requests/71');
    expect(init!.method).toBe('PATCH');
    expect(JSON.parse(String(init!.body))).toEqual({ version: 3, gameOn: '2030-06-01', startTime: '18:00', layout: 'football', description: 'League final, home side' });
    await vi.waitFor(() => expect(w.emitted('saved')).toHaveLength(1));
    w.unmount();
  }, 30_000);

  test('should show the server’s refusal of a change once the request is decided, and keep the dialog open', async () => {
    const row = { id: 72, fieldId: 40, kind: 'wet_area', gameOn: null, startTime: null, layout: null, description: 'Puddle by the gate', version: 1 };
    const fetch = api(() => json(409, { error: { code: 'field_request/not_open', message: 'Request #72 is scheduled: it cannot be changed once the foreman has decided it' } }));
    const w = await mountForm({ request: row });
    await submitDialog('request');
    await vi.waitFor(() => expect(sent(fetch)).toHaveLength(1));
    expect(JSON.parse(String(sent(fetch)[0]![1]!.body))).toEqual({ version: 1, description: 'Puddle by the gate' });
    await vi.waitFor(() => expect(document.body.textContent).toContain('cannot be changed once the foreman has decided it'));
    expect($('[data-test="request-dialog"]')).not.toBeNull();
    expect(w.emitted('saved')).toBeUndefined();
    w.unmount();
  }, 30_000);
});
