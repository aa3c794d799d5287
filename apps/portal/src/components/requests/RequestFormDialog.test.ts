import { abilitiesPlugin } from '@casl/vue';
import { defineAbilityFor, type Actor } from '@swardwise/domain';
import { VueQueryPlugin } from '@tanstack/vue-query';
import { flushPromises, mount } from '@vue/test-utils';
import ElementPlus from 'element-plus';
import { createPinia } from 'pinia';
import { describe, expect, test, vi } from 'vitest';
import { createQueryClient } from '../../api/queryClient.ts';
import { $, cleanUpAfterEach, errorsShown, submitDialog, type } from '../../testing/dialogs.ts';
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

async function mountForm() {
  const w = mount(RequestFormDialog, {
    props: { open: true, fieldId: 40 },
    global: { plugins: [createPinia(), ElementPlus, [abilitiesPlugin, defineAbilityFor(PARTNER)], [VueQueryPlugin, { queryClient: createQueryClient() }]] },
    attachTo: document.body,
  });
  await flushPromises();
  return w;
}
cleanUpAfterEach();

describe('RequestFormDialog', () => {
  test('should ask for the game’s day and a description before sending anything, with the layout of a football field chosen', async () => {
    const fetch = api(() => json(201, {}));
    const w = await mountForm();
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
});
