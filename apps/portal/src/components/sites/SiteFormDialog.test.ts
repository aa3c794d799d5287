import { type Actor, type SiteRow } from '@swardwise/domain';
import { flushPromises } from '@vue/test-utils';
import { describe, expect, test, vi } from 'vitest';
import { $, answering, cleanUpAfterEach, district, errorsShown, FOREMAN_NORTH, mountDialog, submitDialog, type } from '../../testing/dialogs.ts';
import SiteFormDialog from './SiteFormDialog.vue';

const DISTRICTS = [district(1, 'North'), district(2, 'South')];
const head: Actor = { id: 2, role: 'head', districtId: null, crewId: null, siteIds: [] };
const SITE: SiteRow = { id: 9, districtId: 1, districtName: 'North', name: 'Alder Green', kind: 'park', owner: 'city', address: '', lat: 37.6, lng: -66.5, notes: '', fieldCount: 0, fieldAreaM2: 0, version: 4, updatedAt: '2026-11-30T10:00:00Z' };

const mountForm = (actor: Actor, site: SiteRow | null = null) => mountDialog(SiteFormDialog, { site, districts: DISTRICTS }, { actor });
const submit = () => submitDialog('site');
cleanUpAfterEach();

describe('SiteFormDialog', () => {
  test('should offer a foreman only his own district, chosen for him', async () => {
    const w = mountForm(FOREMAN_NORTH);
    await flushPromises();
    const select = w.findAllComponents({ name: 'SelectItem' }).find((item) => item.props('test') === 'site-district')!;
    expect(select.props('modelValue')).toBe(1);
    expect((select.props('options') as { label: string }[]).map((o) => o.label)).toEqual(['North']);
    w.unmount();
  });

  test('should show the schema’s messages and send nothing when the form is incomplete', async () => {
    const fetch = vi.fn();
    vi.stubGlobal('fetch', fetch);
    const w = mountForm(head);
    await flushPromises();
    await type('[data-test="site-name"]', 'A');
    await submit();
    await vi.waitFor(() => {
      const shown = errorsShown();
      expect(shown).toContain('enter a site name of at least 2 characters');
      expect(shown).toContain('latitude is required');
      expect(shown).toContain('longitude is required');
      // No district chosen yet: the id check of the schema speaks.
      expect(shown).toHaveLength(4);
    });
    expect(fetch).not.toHaveBeenCalled();
    w.unmount();
  });

  test('should show the server’s field issues from a 400 beside the field', async () => {
    vi.stubGlobal('fetch', answering(400, { error: { code: 'request/invalid', message: 'No such district', details: { issues: [{ path: 'body.districtId', message: 'no such district' }] } } }));
    const w = mountForm(FOREMAN_NORTH, SITE);
    await flushPromises();
    await submit();
    await vi.waitFor(() => expect(errorsShown()).toContain('no such district'));
    expect($('[data-test="site-form-error"]')?.textContent).toContain('No such district');
    w.unmount();
  });

  test('should say someone else changed the site on a 409 and offer a reload', async () => {
    vi.stubGlobal('fetch', answering(409, { error: { code: 'site/version_conflict', message: 'conflict' } }));
    const w = mountForm(FOREMAN_NORTH, SITE);
    await flushPromises();
    await submit();
    expect($('[data-test="site-form-error"]')?.textContent).toMatch(/Someone else changed this site .*reload/);
    ($('[data-test="site-form-reload"]') as HTMLButtonElement).click();
    expect(w.emitted('reload')).toHaveLength(1);
    w.unmount();
  });
});
