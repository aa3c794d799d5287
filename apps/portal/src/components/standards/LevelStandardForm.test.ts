import { DEFAULT_STANDARDS, updateLevelStandardSchema, type StandardsRow } from '@swardwise/domain';
import { flushPromises, mount } from '@vue/test-utils';
import { describe, expect, test, vi } from 'vitest';
import LevelStandardForm from './LevelStandardForm.vue';
import { bodyFrom, formFrom } from './standardForm.ts';

const row: StandardsRow = { level: 2, data: structuredClone(DEFAULT_STANDARDS[2]), version: 3, updatedAt: '2026-11-01T00:00:00Z', updatedBy: null };

function mountForm() {
  return mount(LevelStandardForm, { props: { row, units: 'metric' }, attachTo: document.body });
}

async function setNumber(wrapper: ReturnType<typeof mountForm>, test: string, value: string) {
  const input = wrapper.find(`[data-test="${test}"] input`);
  await input.setValue(value);
  await input.trigger('change');
  await flushPromises();
}

describe('LevelStandardForm', () => {
  test('should send a body the API schema accepts, with null for a level without irrigation or lines', () => {
    const model = formFrom(DEFAULT_STANDARDS[4]);
    const body = bodyFrom(model, 7);
    expect(updateLevelStandardSchema.safeParse(body).success).toBe(true);
    expect(body).toMatchObject({ version: 7, irrigationShareOfEtc: null, lineRepaintDays: null });
    model.irrigated = true;
    model.irrigationShareOfEtc = 0.4;
    expect(bodyFrom(model, 7).irrigationShareOfEtc).toBe(0.4);
  });

  test('should refuse a HOC below 3 mm with the schema’s message and accept a sound one', async () => {
    const wrapper = mountForm();
    const form = wrapper.vm as unknown as { validate(): Promise<boolean>; invalid: Record<string, string> };
    expect(await form.validate()).toBe(true);
    await setNumber(wrapper, 'hoc-soccer-cool', '2');
    expect(await form.validate()).toBe(false);
    expect(form.invalid).toEqual({ 'hocMm.soccer.cool': 'a height of cut below 3 mm is not a turf height' });
    await setNumber(wrapper, 'hoc-soccer-cool', '40');
    expect(await form.validate()).toBe(true);
    wrapper.unmount();
  });

  test('should refuse a feed share above 1 and a target score above 100', async () => {
    const wrapper = mountForm();
    const form = wrapper.vm as unknown as { validate(): Promise<boolean>; invalid: Record<string, string> };
    await setNumber(wrapper, 'std-feed-share', '1.5');
    await setNumber(wrapper, 'std-target-score', '120');
    expect(await form.validate()).toBe(false);
    expect(form.invalid).toEqual({ annualNShare: 'the feed share cannot be above 1 (100 %)', targetScore: 'the target score is 0–100' });
    wrapper.unmount();
  });
});

describe('LevelStandardForm server errors', () => {
  test('should show an issue the API found under the field it names, even a nested one', async () => {
    vi.stubGlobal(
      'fetch',
      vi.fn(async () => new Response(JSON.stringify({ error: { code: 'request/invalid', message: 'Invalid body', details: { issues: [{ path: 'body.hocMm.soccer.cool', message: 'too low for this level' }] } } }), { status: 400 })),
    );
    const wrapper = mountForm();
    await wrapper.get('[data-test="standards-form-2"]').trigger('submit');
    await flushPromises();
    await vi.waitFor(() => expect(wrapper.text()).toContain('too low for this level'));
    expect(wrapper.get('[data-test="standards-form-error"]').text()).toContain('Invalid body');
    wrapper.unmount();
    vi.unstubAllGlobals();
  });
});
