import { type Actor, type SiteRow } from '@swardwise/domain';
import { describe, expect, test, vi } from 'vitest';
import { $, answering, cleanUpAfterEach, dialogWords, district, errorsShown, FOREMAN_NORTH, mountDialog, submitDialog, type, waitForErrors } from '../../testing/dialogs.ts';
import SiteFormDialog from './SiteFormDialog.vue';

const DISTRICTS = [district(1, 'North'), district(2, 'South')];
const head: Actor = { id: 2, role: 'head', districtId: null, crewId: null, siteIds: [] };
const SITE: SiteRow = { id: 9, districtId: 1, districtName: 'North', name: 'Alder Green', kind: 'park', owner: 'city', address: '', lat: 37.6, lng: -66.5, notes: '', fieldCount: 0, fieldAreaM2: 0, version: 4, updatedAt: '2026-11-30T10:00:00Z' };

const mountForm = (actor: Actor, site: SiteRow | null = null, fetch?: (...args: never[]) => unknown) => mountDialog(SiteFormDialog, { site, districts: DISTRICTS }, { actor, fetch });
const submit = () => submitDialog('site');
cleanUpAfterEach();

describe('SiteFormDialog', () => {
  test('should offer a foreman only his own district, chosen for him', async () => {
    const w = await mountForm(FOREMAN_NORTH);
    const select = w.findAllComponents({ name: 'SelectItem' }).find((item) => item.props('test') === 'site-district')!;
    expect(select.props('modelValue')).toBe(1);
    expect((select.props('options') as { label: string }[]).map((o) => o.label)).toEqual(['North']);
    w.unmount();
  });

  test('should name a new site by its kind and an edited one by its name', async () => {
    const created = await mountForm(FOREMAN_NORTH);
    expect(dialogWords('site')).toEqual({ title: 'New site', submitLabel: 'Add site' });
    created.unmount();
    const w = await mountForm(FOREMAN_NORTH, SITE);
    expect(dialogWords('site')).toEqual({ title: 'Edit Alder Green', submitLabel: 'Save' });
    w.unmount();
  });

  test('should show the schema’s messages and send nothing when the form is incomplete', async () => {
    const fetch = vi.fn();
    const w = await mountForm(head, null, fetch);
    await type('[data-test="site-name"]', 'A');
    await submit();
    // No district chosen yet: the id check of the schema speaks as the fourth.
    await waitForErrors(['enter a site name of at least 2 characters', 'latitude is required', 'longitude is required'], 4);
    expect(fetch).not.toHaveBeenCalled();
    w.unmount();
  });

  test('should show the server’s field issues from a 400 beside the field', async () => {
    const w = await mountForm(FOREMAN_NORTH, SITE, answering(400, { error: { code: 'request/invalid', message: 'No such district', details: { issues: [{ path: 'body.districtId', message: 'no such district' }] } } }));
    await submit();
    await vi.waitFor(() => expect(errorsShown()).toContain('no such district'));
    expect($('[data-test="site-form-error"]')?.textContent).toContain('No such district');
    w.unmount();
  });

  test('should say someone else changed the site on a 409 and offer a reload', async () => {
    const w = await mountForm(FOREMAN_NORTH, SITE, answering(409, { error: { code: 'site/version_conflict', message: 'conflict' } }));
    await submit();
    expect($('[data-test="site-form-error"]')?.textContent).toMatch(/Someone else changed this site .*reload/);
    ($('[data-test="site-form-reload"]') as HTMLButtonElement).click();
    expect(w.emitted('reload')).toHaveLength(1);
    w.unmount();
  });
});
