import { DEFAULT_COSTS, DEFAULT_PARAMETERS, DEFAULT_STANDARDS, updateLevelStandardSchema, whatIf, type StandardsRow, type WhatIfAnswer } from '@swardwise/domain';
import { flushPromises, mount } from '@vue/test-utils';
import { describe, expect, test, vi } from 'vitest';
import LevelStandardForm from './LevelStandardForm.vue';
import { bodyFrom, formFrom } from './standardForm.ts';

const row: StandardsRow = { level: 2, data: structuredClone(DEFAULT_STANDARDS[2]), version: 3, updatedAt: '2026-11-01T00:00:00Z', updatedBy: null };

/**
 * The month and method pickers are stubbed: happy-dom lays out each Element select's popper on
 * every validation, which took over a minute for the program's seventeen selects; no test here
 * works a picker (the browser test of cultural work does).
 */
function mountForm(units: 'metric' | 'imperial' = 'metric') {
  const wrapper = mount(LevelStandardForm, { props: { row, units, outlookSeason: 2026 }, attachTo: document.body, global: { stubs: { ElSelect: true, ElOption: true, WhatIfChart: true } } });
  return { wrapper, form: wrapper.vm as unknown as { validate(): Promise<boolean>; invalid: Record<string, string> } };
}
type Mounted = ReturnType<typeof mountForm>;

/** The save preview's answer: a season without fields (the preview's figures are the what-if tests' business). */
const previewAnswer: WhatIfAnswer = { season: 2026, districtId: null, scopeName: 'Department', currency: 'USD', result: whatIf([], DEFAULT_STANDARDS, DEFAULT_PARAMETERS, DEFAULT_COSTS, { moves: [] }) };
const isPreview = (url: string) => String(url).includes('/what-if');
type Confirmable = { confirm(): Promise<boolean> };

async function setNumber(wrapper: Mounted['wrapper'], test: string, value: string) {
  const input = wrapper.find(`[data-test="${test}"] input`);
  await input.setValue(value);
  await input.trigger('change');
  await flushPromises();
}

/** Types `bad` into the number input `test` (the form refuses it with `invalid`), then `good` (it accepts that). */
async function refusesThenAccepts({ wrapper, form }: Mounted, test: string, bad: string, invalid: Record<string, string>, good: string) {
  await setNumber(wrapper, test, bad);
  expect(await form.validate()).toBe(false);
  expect(form.invalid).toEqual(invalid);
  await setNumber(wrapper, test, good);
  expect(await form.validate()).toBe(true);
}

describe('LevelStandardForm', { timeout: 30_000 }, () => {
  test('should send a body the API schema accepts, with null for a level without irrigation or lines', () => {
    const model = formFrom(DEFAULT_STANDARDS[4], 'metric');
    const body = bodyFrom(model, 7, 'metric');
    expect(updateLevelStandardSchema.safeParse(body).success).toBe(true);
    expect(body).toMatchObject({ version: 7, irrigationShareOfEtc: null, lineRepaintDays: null });
    model.irrigated = true;
    model.irrigationShareOfEtc = 0.4;
    expect(bodyFrom(model, 7, 'metric').irrigationShareOfEtc).toBe(0.4);
  });

  test('should refuse a HOC below 3 mm with the schema’s message and accept a sound one', async () => {
    const mounted = mountForm();
    expect(await mounted.form.validate()).toBe(true);
    await refusesThenAccepts(mounted, 'hoc-soccer-cool', '2', { 'hoc.soccer.cool': 'a height of cut below 3 mm is not a turf height' }, '40');
    mounted.wrapper.unmount();
  });

  test('should refuse a feed share above 1 and a target score above 100', async () => {
    const { wrapper, form } = mountForm();
    await setNumber(wrapper, 'std-feed-share', '1.5');
    await setNumber(wrapper, 'std-target-score', '120');
    expect(await form.validate()).toBe(false);
    expect(form.invalid).toEqual({ annualNShare: 'the feed share cannot be above 1 (100 %)', targetScore: 'the target score is 0–100' });
    wrapper.unmount();
  });
});

describe('LevelStandardForm: cultural program', { timeout: 30_000 }, () => {
  test('should send the program the API schema accepts and refuse a window that ends before it begins', async () => {
    const model = formFrom(DEFAULT_STANDARDS[2], 'metric');
    model.cultural.aerate.timesPerSeason = 4;
    const body = bodyFrom(model, 3, 'metric');
    expect(updateLevelStandardSchema.safeParse(body).success).toBe(true);
    expect(body.cultural?.aerate).toMatchObject({ timesPerSeason: 4, cool: { fromMonth: 4, toMonth: 10 }, method: 'core' });

    const mounted = mountForm();
    expect(mounted.wrapper.find('[data-test="std-cultural"]').text()).toContain('the product label is the law');
    await refusesThenAccepts(mounted, 'cultural-topdress-times', '13', { 'cultural.topdress.timesPerSeason': 'more than 12 times a season is not a program' }, '2');
    mounted.wrapper.unmount();
  });
});

describe('LevelStandardForm in imperial units', { timeout: 30_000 }, () => {
  test('should take heights of cut in inches and send millimetres', async () => {
    const fetch = vi.fn(async (url: string, init: RequestInit) => new Response(JSON.stringify(isPreview(url) ? previewAnswer : { ...row, data: { ...row.data, ...JSON.parse(String(init.body)) } }), { status: 200 }));
    vi.stubGlobal('fetch', fetch);
    const { wrapper } = mountForm('imperial');
    expect(wrapper.text()).toContain('Height of cut, inches');
    const shown = Number((wrapper.find('[data-test="hoc-soccer-cool"] input').element as HTMLInputElement).value);
    expect(shown).toBeCloseTo(row.data.hocMm.soccer.cool / 25.4, 2);
    await setNumber(wrapper, 'hoc-soccer-cool', '1.375');
    expect(wrapper.get('[data-test="hoc-soccer-text"]').text()).toMatch(/^1⅜ in \//);
    await wrapper.get('[data-test="standards-form-2"]').trigger('submit');
    // Saving first asks for the season's change, and writes only when confirmed.
    await vi.waitFor(() => expect(fetch).toHaveBeenCalledTimes(1));
    expect(isPreview(fetch.mock.calls[0]![0])).toBe(true);
    await (wrapper.vm as unknown as Confirmable).confirm();
    await vi.waitFor(() => expect(fetch).toHaveBeenCalledTimes(2));
    const body = JSON.parse(String(fetch.mock.calls[1]![1].body));
    expect(body.hocMm.soccer.cool).toBe(34.925);
    // Untouched heights go back exactly as they were stored.
    expect(body.hocMm.soccer.warm).toBe(row.data.hocMm.soccer.warm);
    wrapper.unmount();
    vi.unstubAllGlobals();
  });

  test('should judge an entry in inches by the millimetre rule and say so', async () => {
    const { wrapper, form } = mountForm('imperial');
    await setNumber(wrapper, 'hoc-soccer-cool', '0.1');
    expect(await form.validate()).toBe(false);
    expect(form.invalid['hoc.soccer.cool']).toBe('a height of cut below 3 mm is not a turf height (checked after converting to millimetres)');
    wrapper.unmount();
  });
});

describe('LevelStandardForm server errors', { timeout: 30_000 }, () => {
  test('should show an issue the API found under the field it names, even a nested one', async () => {
    vi.stubGlobal(
      'fetch',
      vi.fn(async (url: string) =>
        isPreview(url)
          ? new Response(JSON.stringify(previewAnswer), { status: 200 })
          : new Response(JSON.stringify({ error: { code: 'request/invalid', message: 'Invalid body', details: { issues: [{ path: 'body.hocMm.soccer.cool', message: 'too low for this level' }] } } }), { status: 400 }),
      ),
    );
    const { wrapper } = mountForm();
    await wrapper.get('[data-test="standards-form-2"]').trigger('submit');
    await flushPromises();
    await (wrapper.vm as unknown as Confirmable).confirm();
    await flushPromises();
    await vi.waitFor(() => expect(wrapper.text()).toContain('too low for this level'));
    expect(wrapper.get('[data-test="standards-form-error"]').text()).toContain('Invalid body');
    wrapper.unmount();
    vi.unstubAllGlobals();
  });

  test('should say when the season’s change cannot be worked out, and save nothing', async () => {
    const fetch = vi.fn(async () => new Response(JSON.stringify({ error: { code: 'request/invalid', message: 'No such season' } }), { status: 400 }));
    vi.stubGlobal('fetch', fetch);
    const { wrapper } = mountForm();
    await wrapper.get('[data-test="standards-form-2"]').trigger('submit');
    await vi.waitFor(() => expect(wrapper.text()).toContain("The season's change could not be worked out: No such season"));
    expect(fetch).toHaveBeenCalledTimes(1);
    expect(isPreview(String((fetch.mock.calls[0] as unknown[])[0]))).toBe(true);
    wrapper.unmount();
    vi.unstubAllGlobals();
  });
});
