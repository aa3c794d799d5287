import { abilitiesPlugin } from '@casl/vue';
import { defineAbilityFor, type Actor, type DistrictRow, type Polygon, type SiteRow } from '@swardwise/domain';
import { flushPromises, mount } from '@vue/test-utils';
import ElementPlus from 'element-plus';
import { createPinia } from 'pinia';
import { afterEach, describe, expect, test, vi } from 'vitest';
import SiteFormDialog from './SiteFormDialog.vue';

const boundary: Polygon = { type: 'Polygon', coordinates: [[[0, 0], [1, 0], [1, 1], [0, 0]]] };
const district = (id: number, name: string): DistrictRow => ({ id, code: name.toLowerCase(), name, boundary, yard: { name: 'Yard', lat: 0, lng: 0 }, version: 1, siteCount: 0, fieldCount: 0, fieldAreaM2: 0 });
const DISTRICTS = [district(1, 'North'), district(2, 'South')];
const foreman: Actor = { id: 3, role: 'foreman', districtId: 1, crewId: null, siteIds: [] };
const head: Actor = { id: 2, role: 'head', districtId: null, crewId: null, siteIds: [] };
const SITE: SiteRow = { id: 9, districtId: 1, districtName: 'North', name: 'Alder Green', kind: 'park', owner: 'city', address: '', lat: 37.6, lng: -66.5, notes: '', fieldCount: 0, fieldAreaM2: 0, version: 4, updatedAt: '2026-11-30T10:00:00Z' };

function mountForm(actor: Actor, site: SiteRow | null = null) {
  return mount(SiteFormDialog, {
    props: { open: true, site, districts: DISTRICTS },
    global: { plugins: [ElementPlus, createPinia(), [abilitiesPlugin, defineAbilityFor(actor)]] },
    attachTo: document.body,
  });
}

const $ = (sel: string) => document.body.querySelector(sel);
const errorsShown = () => [...document.body.querySelectorAll('.el-form-item__error')].map((e) => e.textContent?.trim());
async function type(sel: string, value: string) {
  const input = $(`${sel} input, input${sel}`) as HTMLInputElement;
  input.value = value;
  input.dispatchEvent(new Event('input'));
  input.dispatchEvent(new Event('change'));
  await flushPromises();
}
const submit = async () => {
  ($('[data-test="site-submit"]') as HTMLButtonElement).click();
  await flushPromises();
  await new Promise((r) => setTimeout(r, 0));
  await flushPromises();
};

afterEach(() => {
  vi.unstubAllGlobals();
  document.body.innerHTML = '';
});

describe('SiteFormDialog', () => {
  test('should offer a foreman only his own district, chosen for him', async () => {
    const w = mountForm(foreman);
    await flushPromises();
    const select = w.findComponent({ name: 'ElSelect' });
    expect((select.props('modelValue') as number)).toBe(1);
    const options = (w.vm.$ as unknown as { setupState: { districtOptions: DistrictRow[] } }).setupState.districtOptions;
    expect(options.map((d) => d.name)).toEqual(['North']);
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
    vi.stubGlobal(
      'fetch',
      vi.fn(async () => new Response(JSON.stringify({ error: { code: 'request/invalid', message: 'No such district', details: { issues: [{ path: 'body.districtId', message: 'no such district' }] } } }), { status: 400 })),
    );
    const w = mountForm(foreman, SITE);
    await flushPromises();
    await submit();
    await vi.waitFor(() => expect(errorsShown()).toContain('no such district'));
    expect($('[data-test="site-form-error"]')?.textContent).toContain('No such district');
    w.unmount();
  });

  test('should say someone else changed the site on a 409 and offer a reload', async () => {
    vi.stubGlobal(
      'fetch',
      vi.fn(async () => new Response(JSON.stringify({ error: { code: 'site/version_conflict', message: 'conflict' } }), { status: 409 })),
    );
    const w = mountForm(foreman, SITE);
    await flushPromises();
    await submit();
    expect($('[data-test="site-form-error"]')?.textContent).toMatch(/Someone else changed this site .*reload/);
    ($('[data-test="site-form-reload"]') as HTMLButtonElement).click();
    expect(w.emitted('reload')).toHaveLength(1);
    w.unmount();
  });
});
