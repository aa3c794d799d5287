import type { CrewRow, EquipmentRow, SessionUser } from '@swardwise/domain';
import { flushPromises } from '@vue/test-utils';
import { createPinia, setActivePinia } from 'pinia';
import { describe, expect, test, vi } from 'vitest';
import { useSessionStore } from '../../stores/session.ts';
import { $, cleanUpAfterEach, dialogWords, district, errorsShown, FOREMAN_NORTH, labelsShown as labels, mountDialog, submitDialog, type, type DialogWrapper } from '../../testing/dialogs.ts';
import EquipmentFormDialog from './EquipmentFormDialog.vue';

const DISTRICTS = [district(1, 'North')];
const CREWS: CrewRow[] = [{ id: 4, districtId: 1, districtName: 'North', name: 'North Crew A', hoursPerDay: 8, members: [], workDays: ['mon'], leadUserId: null, leadName: null, version: 1 }];
const MOWER: EquipmentRow = {
  id: 7, districtId: 1, districtName: 'North', crewId: 4, crewName: 'North Crew A', kind: 'reel_mower', name: 'Reel 5-gang', cuttingWidthM: 3.4, speedKmh: 8,
  fieldEfficiency: 0.8, hocMinMm: 12, hocMaxMm: 38, hourMeterH: 120, sharpenIntervalH: 50, lastSharpenedAtH: 100, hoursSinceSharpening: 20, sharpeningDue: false, bladeState: 'ok', weekMowingH: 0,
  notes: '', active: true, version: 2, updatedAt: '2026-06-01T00:00:00Z',
};

function mountForm(fetch: (...args: never[]) => unknown, units: 'imperial' | 'metric', equipment: EquipmentRow | null = null) {
  const pinia = createPinia();
  setActivePinia(pinia);
  useSessionStore().user = { id: 3, email: 'f@test.example', name: 'F', role: 'foreman', districtId: 1, crewId: null, siteIds: [], units, version: 1 } satisfies SessionUser;
  return mountDialog(EquipmentFormDialog, { equipment, districts: DISTRICTS, crews: CREWS }, { actor: FOREMAN_NORTH, pinia, fetch });
}

async function chooseKind(w: DialogWrapper, kind: string) {
  w.findAllComponents({ name: 'ElSelect' })[0]!.vm.$emit('update:modelValue', kind);
  await flushPromises();
}
const submit = () => submitDialog('equipment');
const created = () => vi.fn(async (_url: string, init: RequestInit) => new Response(JSON.stringify({ equipment: { ...MOWER, ...JSON.parse(String(init.body)) } }), { status: 201 }));
cleanUpAfterEach();

describe('EquipmentFormDialog', () => {
  test('should ask a mower for its cutting figures and send nothing without them', async () => {
    const fetch = vi.fn();
    const w = await mountForm(fetch, 'metric');
    expect($('[data-test="mower-fields"]')).not.toBeNull();
    await type('[data-test="equipment-name"]', 'Rotary 72');
    await submit();
    await vi.waitFor(() => expect(errorsShown().filter((m) => m === 'a mower needs this to plan its hours and heights of cut')).toHaveLength(4));
    expect(fetch).not.toHaveBeenCalled();
    w.unmount();
  });

  test('should hide the mower fields for a line marker and send them empty even if typed before', async () => {
    const fetch = created();
    const w = await mountForm(fetch, 'metric');
    await type('[data-test="equipment-width"]', '1.8');
    await chooseKind(w, 'line_marker');
    expect($('[data-test="mower-fields"]')).toBeNull();
    expect($('[data-test="equipment-width"]')).toBeNull();
    expect(labels()).not.toContain('Sharpen every (h)');
    await type('[data-test="equipment-name"]', 'Marker 2');
    await submit();
    await vi.waitFor(() => expect(fetch).toHaveBeenCalledTimes(1));
    expect(JSON.parse(String(fetch.mock.calls[0]![1].body))).toMatchObject({
      kind: 'line_marker',
      name: 'Marker 2',
      districtId: 1,
      cuttingWidthM: null,
      speedKmh: null,
      fieldEfficiency: null,
      hocMinMm: null,
      hocMaxMm: null,
      sharpenIntervalH: null,
    });
    // Back to a mower: the fields come back.
    await chooseKind(w, 'flail_mower');
    expect($('[data-test="mower-fields"]')).not.toBeNull();
    w.unmount();
  });

  test('should take a mower’s figures in inches and mph and send them in metres, km/h and millimetres', async () => {
    const fetch = created();
    const w = await mountForm(fetch, 'imperial');
    expect(labels()).toEqual(expect.arrayContaining(['Cutting width (in)', 'Working speed (mph)', 'Lowest HOC (in)', 'Highest HOC (in)']));
    await type('[data-test="equipment-name"]', 'Rotary 72');
    await type('[data-test="equipment-width"]', '72');
    await type('[data-test="equipment-speed"]', '5');
    await type('[data-test="equipment-hoc-min"]', '1');
    await type('[data-test="equipment-hoc-max"]', '4.5');
    await submit();
    await vi.waitFor(() => expect(fetch).toHaveBeenCalledTimes(1));
    const body = JSON.parse(String(fetch.mock.calls[0]![1].body));
    expect(body.cuttingWidthM).toBeCloseTo(1.8288, 4);
    expect(body.speedKmh).toBeCloseTo(8.047, 3);
    expect(body).toMatchObject({ kind: 'rotary_mower', fieldEfficiency: 0.8, hocMinMm: 25.4, hocMaxMm: 114.3 });
    w.unmount();
  });

  test('should name new equipment by its kind and an edited machine by its name', async () => {
    const created = await mountForm(vi.fn(), 'metric');
    expect(dialogWords('equipment')).toEqual({ title: 'New equipment', submitLabel: 'Add equipment' });
    created.unmount();
    const w = await mountForm(vi.fn(), 'metric', MOWER);
    expect(dialogWords('equipment')).toEqual({ title: 'Edit Reel 5-gang', submitLabel: 'Save' });
    w.unmount();
  });

  test('should show an edited mower in the person’s units and put the HOC range check on the highest HOC', async () => {
    const w = await mountForm(vi.fn(), 'metric', MOWER);
    expect(($('[data-test="equipment-width"] input') as HTMLInputElement).value).toBe('3.4');
    expect(($('[data-test="equipment-efficiency"] input') as HTMLInputElement).value).toBe('80');
    await type('[data-test="equipment-hoc-max"]', '10');
    await submit();
    await vi.waitFor(() => expect(errorsShown()).toContain('the highest HOC is below the lowest'));
    w.unmount();
  });
});
