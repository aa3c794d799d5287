import type { UserRow } from '@swardwise/domain';
import { flushPromises } from '@vue/test-utils';
import { describe, expect, test, vi } from 'vitest';
import { computed } from 'vue';
import type { ScopeOptions } from '../../composables/useScopeOptions.ts';
import { $, answering, cleanUpAfterEach, district, mountDialog, submitDialog, type } from '../../testing/dialogs.ts';
import InviteUserDialog from './InviteUserDialog.vue';

const OPTIONS: ScopeOptions = {
  districts: computed(() => [district(1, 'North')]),
  crews: computed(() => []),
  sites: computed(() => []),
  loading: computed(() => false),
  error: computed(() => null),
};
const INVITED: UserRow = {
  id: 12, email: 'w.reed@test.example', name: 'W. Reed', role: 'head', districtId: null, crewId: null, siteIds: [], units: 'metric', version: 1,
  active: true, lastSignInAt: null, createdAt: '2026-12-01T09:00:00Z', districtName: null, crewName: null, pendingInvite: true,
};

/** Opens the dialog with `fetch` for the page's and invites W. Reed as head. */
async function inviteReed(fetch: (...args: never[]) => unknown) {
  const w = await mountDialog(InviteUserDialog, { options: OPTIONS }, { fetch });
  w.findAllComponents({ name: 'SelectItem' })[0]!.vm.$emit('update:modelValue', 'head');
  await flushPromises();
  await type('[data-test="invite-name"]', 'W. Reed');
  await type('[data-test="invite-email"]', 'w.reed@test.example');
  await submitDialog('invite');
  return w;
}

cleanUpAfterEach();

describe('InviteUserDialog', () => {
  test('should invite once, then show the link in place of the form and close on Done', async () => {
    const fetch = answering(201, { user: INVITED, inviteUrl: 'http://portal.test/accept-invite/abc', emailed: true, mail: 'sent' });
    const w = await inviteReed(fetch);
    await vi.waitFor(() => expect(fetch).toHaveBeenCalledTimes(1));
    expect(JSON.parse(String(fetch.mock.calls[0]![1]!.body))).toEqual({ email: 'w.reed@test.example', name: 'W. Reed', role: 'head', districtId: null, crewId: null, siteIds: [] });
    expect(w.emitted('invited')).toEqual([[INVITED]]);
    expect(($('[data-test="invite-url"] input, input[data-test="invite-url"]') as HTMLInputElement).value).toBe('http://portal.test/accept-invite/abc');
    expect($('[data-test="invite-name"]')).toBeNull();
    // Enter in the link's field submits the form around it: that must not invite again.
    $('.form-dialog__form')!.dispatchEvent(new Event('submit'));
    await flushPromises();
    expect(fetch).toHaveBeenCalledTimes(1);
    ([...document.body.querySelectorAll('.el-dialog__footer button')].find((b) => b.textContent?.trim() === 'Done') as HTMLButtonElement).click();
    await flushPromises();
    expect(w.emitted('update:open')).toEqual([[false]]);
    w.unmount();
  });

  test('should say no e-mail went out when mail is off, and that the link must be passed on by hand', async () => {
    const w = await inviteReed(answering(201, { user: INVITED, inviteUrl: 'http://portal.test/accept-invite/xyz', emailed: false, mail: 'off' }));
    await vi.waitFor(() => expect($('[data-test="invite-url"]')).not.toBeNull());
    const said = $('[data-test="invite-mail"]')!.textContent!;
    expect(said).toMatch(/No e-mail was sent: e-mail is not set up/);
    expect(said).toMatch(/Pass this link on to w\.reed@test\.example yourself/);
    expect(said).not.toMatch(/on its way/);
    expect(($('[data-test="invite-url"] input, input[data-test="invite-url"]') as HTMLInputElement).value).toBe('http://portal.test/accept-invite/xyz');
    w.unmount();
  });
});
