/**
 * With the weather service down and the last weather on file weeks old, a foreman opening a
 * field sees, above what the field needs, that the figures rest on old weather and since when.
 */
import path from 'node:path';
import { describe, expect, test } from 'vitest';
import { shots, useBrowser, withPage } from './browser.ts';
import { useOwnServer } from './own-server.ts';

useBrowser();

// The test city's weather ends weeks ago, and its weather service address answers nobody.
const own = useOwnServer();

describe('weather gap', () => {
  test('should tell a foreman on a field’s needs that no weather has come since the last day on file', async () => {
    await withPage({}, async (page) => {
      await own.signIn(page, 'foreman');
      // The service is down: asking it for the missing days fails, and says so.
      const pull = await page.request.post(`${own.baseUrl}/api/weather/stations/${own.fixture.weather.stationId}/pull`, { data: { from: own.fixture.weather.end, to: own.fixture.weather.end } });
      expect(pull.status()).toBe(503);

      await page.goto(`${own.baseUrl}/fields/${own.fixture.fields.northSoccer}`);
      const gap = page.locator('[data-test="needs-weather-gap"]');
      await gap.waitFor();
      await gap.scrollIntoViewIfNeeded();
      expect(await gap.isVisible()).toBe(true);
      expect(await gap.getAttribute('role')).toBe('alert');
      const text = await gap.innerText();
      expect(text).toContain('No weather from Test Weather since');
      expect(text).toContain('the weather service may be down');
      expect(text).toContain('Figures rest on the last weather on file');
      // The needs still answer, on the last weather on file.
      expect(await page.locator('[data-test="needs-week"]').innerText()).not.toBe('');
      await page.screenshot({ path: path.join(shots, 'field-needs-weather-gap.png') });
    });
  });
});
