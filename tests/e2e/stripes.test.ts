/**
 * A foreman picks a stripe pattern on a field's page, sees the pass plan and saves it; the week
 * plan puts it on the field's mowing, and the crew lead reads it on Today on a phone.
 */
import path from 'node:path';
import { describe, expect, inject, test } from 'vitest';
import { DEFAULT_TIME_ZONE, localToday, mondayOf } from '@swardwise/domain';
import { browser, PHONE, shots, signIn, useBrowser, withPage } from './browser.ts';

const baseUrl = inject('baseUrl');

useBrowser();

interface Order {
  id: number;
  fieldId: number;
  task: string;
  status: string;
  plannedDate: string;
  version: number;
  crewId: number | null;
  details: Record<string, unknown>;
}
interface Board {
  crews: { id: number; name: string }[];
  orders: Order[];
}

describe('stripe patterns', () => {
  test('should let a foreman choose a pattern on the field page and carry it to the crew lead’s Today', async () => {
    const today = localToday(process.env.DEPARTMENT_TIME_ZONE || DEFAULT_TIME_ZONE);
    const monday = mondayOf(today);
    const foreman = await browser.newPage({ viewport: { width: 1400, height: 900 } });
    let orderId = 0;
    try {
      await signIn(foreman, 'foreman');
      const generate = () =>
        foreman.evaluate(async (weekStart) => {
          const me = await (await fetch('/api/auth/me')).json();
          const res = await fetch('/api/week-plans/generate', { method: 'POST', headers: { 'content-type': 'application/json' }, body: JSON.stringify({ districtId: me.user.districtId, weekStart }) });
          return (await res.json()).board as Board;
        }, monday);
      // A field with a mowing still open this week, a soccer or football field first (it shows the officials note).
      const first = await generate();
      const fields = await foreman.evaluate(async () => (await (await fetch('/api/fields')).json()).items as { id: number; sport: string; name: string }[]);
      const sportOf = new Map(fields.map((f) => [f.id, f.sport]));
      const open = first.orders.filter((o) => o.task === 'mow' && o.status === 'planned' && o.plannedDate >= today);
      expect(open.length, 'a planned mowing this week').toBeGreaterThan(0);
      const pick = open.find((o) => sportOf.get(o.fieldId) === 'soccer' || sportOf.get(o.fieldId) === 'football') ?? open[0]!;
      const fieldId = pick.fieldId;
      const sport = sportOf.get(fieldId);

      await foreman.goto(`${baseUrl}/fields/${fieldId}`);
      const card = foreman.locator('[data-test="field-stripes"]');
      await card.locator('[data-test="stripes-pattern"]').waitFor();
      await card.locator('[data-test="stripes-pattern"]').click();
      await foreman.getByRole('option', { name: 'Checkerboard (criss-cross)' }).click();
      await card.locator('[data-test="stripes-plan"]').waitFor();
      expect(await card.locator('[data-test="stripes-passes"]').innerText()).toMatch(/^\d+ \(\d+ length-wise \+ \d+ side-to-side\)$/);
      expect(await card.locator('[data-test="stripes-time"]').innerText()).toMatch(/^\d+:\d\d h$/);
      expect(await card.locator('[data-test="stripes-slope"]').innerText()).toMatch(/slope/);
      if (sport === 'soccer' || sport === 'football') expect(await card.locator('[data-test="stripes-officials"]').innerText()).toMatch(/officials/i);
      // The plan view has a name and a description.
      expect(await card.locator('[data-test="stripes-plan"] title').textContent()).toMatch(/Checkerboard/);
      expect(await card.locator('[data-test="stripes-plan"] desc').textContent()).toMatch(/drawn to scale/);
      const saved = foreman.waitForResponse((r) => r.url().endsWith(`/api/fields/${fieldId}/stripes`) && r.request().method() === 'PATCH');
      await card.locator('[data-test="stripes-save"]').click();
      expect((await saved).status()).toBe(200);
      await expect.poll(() => card.locator('[data-test="stripes-saved"]').innerText()).toMatch(/Mowing orders ask for checkerboard/i);
      await card.scrollIntoViewIfNeeded();
      await card.screenshot({ path: path.join(shots, 'stripes-card-desktop.png') });

      // Re-generating puts the pattern on the field's open mowings; one goes to crew A today.
      const second = await generate();
      const mowing = second.orders.find((o) => o.fieldId === fieldId && o.task === 'mow' && o.status === 'planned' && o.plannedDate >= today);
      expect(mowing?.details.pattern).toBe('checkerboard');
      const crewA = second.crews.find((c) => c.name === 'North Ridge Crew A')!;
      const moved = await foreman.evaluate(
        async ({ id, version, crewId, plannedDate }) => (await fetch(`/api/work-orders/${id}`, { method: 'PATCH', headers: { 'content-type': 'application/json' }, body: JSON.stringify({ version, crewId, plannedDate }) })).status,
        { id: mowing!.id, version: mowing!.version, crewId: crewA.id, plannedDate: today },
      );
      expect(moved).toBe(200);
      orderId = mowing!.id;
    } finally {
      await foreman.close();
    }

    await withPage({ role: 'crew', landing: '/today', device: PHONE }, async (phone) => {
      await phone.waitForURL((url) => url.pathname === '/today');
      const job = phone.locator(`[data-test="job-card"][data-order-id="${orderId}"]`);
      await job.waitFor();
      expect(await job.innerText()).toMatch(/Pattern\s*Checkerboard \(criss-cross\)/);
      await job.scrollIntoViewIfNeeded();
      await phone.screenshot({ path: path.join(shots, 'stripes-today-phone.png') });
      // The crew lead sees the field's plan too, read-only.
      await phone.goto(`${baseUrl}/fields/${(await phone.evaluate(async (id) => (await (await fetch(`/api/work-orders/${id}`)).json()).order.fieldId as number, orderId))}`);
      const card = phone.locator('[data-test="field-stripes"]');
      await card.locator('[data-test="stripes-plan"]').waitFor();
      expect(await card.locator('[data-test="stripes-save"]').count()).toBe(0);
      await card.scrollIntoViewIfNeeded();
      await phone.screenshot({ path: path.join(shots, 'stripes-card-phone.png') });
    });
  });
});
