/**
 * What-if previews: the change equals the difference of two outlooks of the engine (here, the
 * budget's outlook before and after the move is really saved); scope is the foreman's district.
 */
import { eq } from 'drizzle-orm';
import { describe, expect, test } from 'vitest';
import type { BudgetAnswer, WhatIfAnswer } from '@swardwise/domain';
import { fields } from '../../apps/api/src/db/schema/index.ts';
import { useTestApi } from '../support/app.ts';

const api = useTestApi();
const SEASON = 2026;
const line = (b: BudgetAnswer, key: string) => b.lines.find((l) => l.line === key)!;

describe('what-if', () => {
  test('should preview a move as the difference of the outlooks before and after it is saved, saving nothing', async () => {
    const head = await api.signIn('head');
    const d = api.fixture.districts.north;
    const field = api.fixture.fields.northSoccer;
    const before = (await head.get(`/api/budget?season=${SEASON}&districtId=${d}`)).body as BudgetAnswer;
    const res = await head.post('/api/what-if').send({ season: SEASON, districtId: d, moves: [{ fieldId: field, level: 4 }] });
    expect(res.status).toBe(200);
    const w = res.body as WhatIfAnswer;
    expect(w).toMatchObject({ season: SEASON, districtId: d, scopeName: 'Test North', currency: 'USD' });
    expect(w.result.fieldsTouched).toBe(1);
    expect(w.result.delta.totals.mowings).toBeLessThan(0);
    // Nothing saved by the preview.
    const [row] = await api.database.db.select().from(fields).where(eq(fields.id, field));
    expect(row!.maintenanceLevel).toBe(2);

    // Now really move it: the budget's outlook changes by what the preview said.
    await head.patch(`/api/fields/${field}`).send({ version: row!.version, maintenanceLevel: 4 }).expect(200);
    const after = (await head.get(`/api/budget?season=${SEASON}&districtId=${d}`)).body as BudgetAnswer;
    for (const key of ['labour', 'fuel', 'fertiliser', 'water', 'paint', 'equipment'] as const) {
      const delta = w.result.delta.lines[key];
      expect(delta.quantity, key).toBeCloseTo(line(after, key).outlook.quantity - line(before, key).outlook.quantity, 1);
      if (delta.cost !== null) expect(delta.cost, key).toBeCloseTo(line(after, key).outlook.cost! - line(before, key).outlook.cost!, 1);
    }
    expect(w.result.before.lines.labour.cost).toBeCloseTo(line(before, 'labour').outlook.cost!, 1);
  });

  test('should preview a change of a level’s Standards on the fields at that level', async () => {
    const head = await api.signIn('head');
    const res = await head.post('/api/what-if').send({ season: SEASON, standards: { '1': { minMowingsPerWeek: 6, lineRepaintDays: 3 } } });
    expect(res.status).toBe(200);
    const w = res.body as WhatIfAnswer;
    expect(w.districtId).toBeNull();
    expect(w.result.fieldsTouched).toBe(1);
    expect(w.result.delta.totals.lineHours).toBeGreaterThan(0);
  });

  test('should keep a foreman to his district and refuse crews and partners', async () => {
    const foreman = await api.signIn('foreman');
    const own = await foreman.post('/api/what-if').send({ season: SEASON, moves: [{ fieldId: api.fixture.fields.northLawn, level: 3 }] });
    expect(own.status).toBe(200);
    expect(own.body.districtId).toBe(api.fixture.districts.north);
    expect((await foreman.post('/api/what-if').send({ season: SEASON, districtId: api.fixture.districts.south, moves: [] })).status).toBe(403);
    // Another district's field in his own district's scenario.
    expect((await foreman.post('/api/what-if').send({ season: SEASON, moves: [{ fieldId: api.fixture.fields.southBaseball, level: 1 }] })).status).toBe(403);
    for (const who of ['crew', 'partner'] as const) {
      const agent = await api.signIn(who);
      expect((await agent.post('/api/what-if').send({ season: SEASON, moves: [] })).status).toBe(403);
    }
  });

  test('should refuse a bad level, an unknown field and an unknown Standard with a 400', async () => {
    const head = await api.signIn('head');
    const bad = [
      { season: SEASON, moves: [{ fieldId: api.fixture.fields.northLawn, level: 5 }] },
      { season: SEASON, moves: [{ fieldId: 987654, level: 2 }] },
      { season: SEASON, standards: { '2': { colour: 'green' } } },
      { season: SEASON, standards: { '9': { minMowingsPerWeek: 2 } } },
    ];
    for (const body of bad) expect((await head.post('/api/what-if').send(body)).status, JSON.stringify(body)).toBe(400);
  });
});
