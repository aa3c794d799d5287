/**
 * The field page shows what the field needs, worked out from the Standards; the head edits
 * a level's HOC on the Standards page and the field page follows.
 */
import path from 'node:path';
import { describe, expect, inject, test } from 'vitest';
import { formatHocText, type UnitSystem } from '@swardwise/domain';
import { shots, useBrowser, withPage } from './browser.ts';

const baseUrl = inject('baseUrl');

useBrowser();

interface FieldRow {
  id: number;
  sport: string;
  grass: string;
  maintenanceLevel: number;
  hocOverrideMm: number | null;
}

const COOL = ['kentucky_bluegrass', 'perennial_ryegrass', 'tall_fescue', 'fine_fescue'];
const text = (mm: number, units: UnitSystem) => formatHocText(mm, units);

describe('field page', () => {
  test('should show a foreman the HOC, mowings per week and the season chart of a field', async () => {
    await withPage({ role: 'foreman', device: { viewport: { width: 1400, height: 900 } } }, async (page) => {
      const fields = await page.evaluate(async () => (await (await fetch('/api/fields')).json()).items as { id: number }[]);
      expect(fields.length).toBeGreaterThan(0);
      await page.goto(`${baseUrl}/fields/${fields[0]!.id}`);
      await page.locator('[data-test="needs-hoc"]').waitFor();
      expect(await page.locator('[data-test="needs-hoc"]').innerText()).toMatch(/^(\d+|\d*[⅛¼⅜½⅝¾⅞]) (in|mm)$/);
      expect(await page.locator('[data-test="needs-mowings-per-week"]').innerText()).toMatch(/^\d+(\.\d)?$/);
      // The demo's weather reaches today (and a week past it): no note about a missing week.
      expect(await page.locator('[data-test="needs-weather-note"]').count()).toBe(0);
      await page.locator('[data-test="season-chart"] canvas').first().waitFor();
      await page.screenshot({ path: path.join(shots, 'field-page-foreman.png'), fullPage: true });
    });
  });

  test('should show the new HOC on the field page after the head edits the level on the Standards page', async () => {
    await withPage({ role: 'head', device: { viewport: { width: 1400, height: 900 } } }, async (page) => {
      const { fields, units } = await page.evaluate(async () => ({
        fields: (await (await fetch('/api/fields')).json()).items,
        units: (await (await fetch('/api/auth/me')).json()).user.units,
      }));
      const field = (fields as FieldRow[]).find((f) => f.sport === 'soccer' && f.hocOverrideMm === null && COOL.includes(f.grass));
      expect(field, 'a soccer field on cool-season grass without an override').toBeTruthy();
      const level = field!.maintenanceLevel;
      const before = await page.evaluate(async () => (await (await fetch('/api/standards')).json()).levels);
      const original = (before as { level: number; data: { hocMm: { soccer: { cool: number } } } }[]).find((l) => l.level === level)!.data.hocMm.soccer.cool;
      // The form takes the person's unit: inches (to an eighth here, so the check is exact) or millimetres.
      const typed = units === 'imperial' ? Math.round(((original + 7) / 25.4) * 8) / 8 : original + 7;
      const next = units === 'imperial' ? typed * 25.4 : typed;

      await page.goto(`${baseUrl}/standards`);
      await page.locator(`[data-test="standards-edit-${level}"]`).click();
      const input = page.locator(`[data-test="standards-form-${level}"] [data-test="hoc-soccer-cool"] input`);
      await input.fill(String(typed));
      await input.blur();
      await page.locator('[data-test="standards-save"]').click();
      // Saving shows the season's change first; confirm it.
      await page.locator('[data-test="standards-preview-confirm"]').click();
      await expect.poll(() => page.getByText(`Level ${level} saved`).count()).toBeGreaterThan(0);
      await page.screenshot({ path: path.join(shots, 'standards-head.png'), fullPage: true });

      await page.goto(`${baseUrl}/fields/${field!.id}`);
      await page.locator('[data-test="needs-hoc"]').waitFor();
      expect(await page.locator('[data-test="needs-hoc"]').innerText()).toBe(text(next, units));

      // Put the Standards back for the other browser tests.
      const status = await page.evaluate(
        async ({ level, original }) => {
          const rows = (await (await fetch('/api/standards')).json()).levels as { level: number; version: number }[];
          const version = rows.find((l) => l.level === level)!.version;
          const res = await fetch(`/api/standards/${level}`, { method: 'PATCH', headers: { 'Content-Type': 'application/json' }, body: JSON.stringify({ version, hocMm: { soccer: { cool: original } } }) });
          return res.status;
        },
        { level, original },
      );
      expect(status).toBe(200);
    });
  });
});
