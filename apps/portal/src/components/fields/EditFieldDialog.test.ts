import type { FieldRow } from '@swardwise/domain';
import { flushPromises } from '@vue/test-utils';
import { describe, expect, test, vi } from 'vitest';
import { answering, cleanUpAfterEach, mountDialog as mountDialogWith, submitDialog, type DialogWrapper } from '../../testing/dialogs.ts';
import EditFieldDialog from './EditFieldDialog.vue';

const FIELD: FieldRow = {
  id: 7,
  siteId: 2,
  siteName: 'Alder Green',
  districtId: 1,
  districtName: 'North',
  name: 'Pitch 1',
  sport: 'soccer',
  grass: 'tall_fescue',
  rootzone: 'native_soil',
  irrigation: 'automatic',
  maintenanceLevel: 2,
  hocOverrideMm: null,
  clippings: 'returned',
  status: 'open',
  statusNote: '',
  weeklyUseHours: 12,
  areaM2: 7140,
  longAxisDeg: 12,
  lastMowedOn: null,
  crewIds: [],
  version: 5,
  updatedAt: '2026-11-30T10:00:00Z',
};

const mountDialog = (fetch?: (...args: never[]) => unknown) => mountDialogWith(EditFieldDialog, { field: FIELD }, { fetch });
type Model = { name: string; hoc: number | null; status: string };
const modelOf = (w: DialogWrapper) => (w.vm.$ as unknown as { setupState: { model: Model } }).setupState.model;
const submit = () => submitDialog('field');
cleanUpAfterEach();

describe('EditFieldDialog', () => {
  test('should refuse an empty name and a height of cut below 3 mm without sending anything', async () => {
    const fetch = vi.fn();
    const w = await mountDialog(fetch);
    modelOf(w).name = '';
    modelOf(w).hoc = 0.05; // inches: 1.3 mm
    await submit();
    // The dialog's transition keeps the message elements from rendering here; read the items' state.
    const failed = w
      .findAllComponents({ name: 'ElFormItem' })
      .filter((item) => item.classes().includes('is-error'))
      .map((item) => (item.vm as unknown as { validateMessage: string }).validateMessage);
    expect(failed.sort()).toEqual(['a height of cut below 3 mm is not a turf height', 'enter a field name']);
    expect(fetch).not.toHaveBeenCalled();
    w.unmount();
  });

  test('should show the closure cautions when a field is closed or restricted', async () => {
    const w = await mountDialog();
    expect(document.body.querySelector('[data-test="closure-caution"]')).toBeNull();
    modelOf(w).status = 'closed';
    await flushPromises();
    expect(document.body.querySelector('[data-test="closure-caution"]')?.textContent).toMatch(/lightning|hard|wet/i);
    w.unmount();
  });

  test('should send the height of cut in millimetres with the version it was opened at', async () => {
    const fetch = answering(200, { field: { ...FIELD, hocOverrideMm: 38.1, version: 6 } });
    const w = await mountDialog(fetch);
    modelOf(w).hoc = 1.5; // inches
    await submit();
    expect(fetch).toHaveBeenCalledTimes(1);
    const [url, init] = fetch.mock.calls[0]!;
    expect(url).toContain('/api/fields/7');
    expect(init?.method).toBe('PATCH');
    const body = JSON.parse(String(init?.body));
    expect(body.version).toBe(5);
    expect(body.hocOverrideMm).toBeCloseTo(38.1, 1);
    expect(body.name).toBe('Pitch 1');
    await vi.waitFor(() => expect(document.body.querySelector('.el-message--success')?.textContent).toContain('Pitch 1 saved.'));
    w.unmount();
  });
});
