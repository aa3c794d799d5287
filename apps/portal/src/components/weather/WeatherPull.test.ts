import type { WeatherStationRow } from '@swardwise/domain';
import { flushPromises } from '@vue/test-utils';
import { describe, expect, test, vi } from 'vitest';
import { $, answering, cleanUpAfterEach, mountDialog } from '../../testing/dialogs.ts';
import WeatherPull from './WeatherPull.vue';

const STATION = { id: 4, name: 'North yard' } as WeatherStationRow;
const REJECTED = {
  error: {
    code: 'weather/bad_answer',
    message: 'The weather service sent days that cannot be used; nothing was saved.',
    details: { issues: [], rejected: [{ date: '2026-11-30', message: 'rain is negative' }, { date: null, message: 'no date' }] },
  },
};

async function pull() {
  ($('[data-test="weather-pull-run"]') as HTMLButtonElement).click();
  await flushPromises();
}

cleanUpAfterEach();

describe('WeatherPull', () => {
  test('should show the days saved and tell the page', async () => {
    const w = await mountDialog(WeatherPull, { station: STATION, service: true }, { fetch: answering(200, { saved: 14, missing: [] }) });
    await pull();
    await vi.waitFor(() => expect($('[data-test="weather-pull-result"]')?.textContent).toContain('14 day(s) saved.'));
    expect(w.emitted('saved')).toHaveLength(1);
    expect($('[data-test="weather-pull-error"]')).toBeNull();
    w.unmount();
  });

  test('should list the rejected days under the failure, and drop both the failure and the last result on the next pull', async () => {
    const fetch = vi.fn(async (_url: string, _init?: RequestInit) => new Response(JSON.stringify({ saved: 2, missing: [] }), { status: 200, headers: { 'content-type': 'application/json' } }));
    const w = await mountDialog(WeatherPull, { station: STATION, service: true }, { fetch });
    await pull();
    await vi.waitFor(() => expect($('[data-test="weather-pull-result"]')).not.toBeNull());
    fetch.mockResolvedValueOnce(new Response(JSON.stringify(REJECTED), { status: 400, headers: { 'content-type': 'application/json' } }));
    await pull();
    await vi.waitFor(() => expect($('[data-test="weather-pull-error"]')).not.toBeNull());
    expect($('[data-test="weather-pull-result"]')).toBeNull();
    const shown = $('[data-test="weather-pull-error"]')!.textContent!;
    expect(shown).toContain('The weather service sent days that cannot be used; nothing was saved.');
    expect([...document.body.querySelectorAll('.pull__rejected li')].map((li) => li.textContent)).toEqual(['2026-11-30: rain is negative', 'a day without a date: no date']);
    await pull();
    await vi.waitFor(() => expect($('[data-test="weather-pull-result"]')?.textContent).toContain('2 day(s) saved.'));
    expect($('[data-test="weather-pull-error"]')).toBeNull();
    expect(w.emitted('saved')).toHaveLength(2);
    w.unmount();
  });
});
