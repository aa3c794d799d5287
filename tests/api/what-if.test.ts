/**
 * What-if previews: the change equals the difference of two outlooks of the engine (here, the
 * budget's outlook before and after the move is really saved); scope is the foreman's district.
 * Saved scenarios keep the change, are worked out again when compared, and a foreman never
 * sees or touches another district's.
 */
import { eq } from 'drizzle-orm';
import { describe, expect, test, vi } from 'vitest';
import type { BudgetAnswer, WhatIfAnswer, WhatIfCompareAnswer, WhatIfScenarioList, WhatIfScenarioRow } from '@swardwise/domain';
import { auditLog, fields } from '../../apps/api/src/db/schema/index.ts';
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

describe('saved what-if scenarios', () => {
  const save = async (who: Awaited<ReturnType<typeof api.signIn>>, name: string, change: object) => {
    const res = await who.post('/api/what-if/scenarios').send({ name, change });
    expect(res.status, JSON.stringify(res.body)).toBe(201);
    return (res.body as { scenario: WhatIfScenarioRow }).scenario;
  };

  test('should save, list, compare against today’s outlook and delete the head’s own scenarios, audited', async () => {
    const head = await api.signIn('head');
    const north = api.fixture.districts.north;
    const lawnUp = { season: SEASON, districtId: north, moves: [{ fieldId: api.fixture.fields.northLawn, level: 2 }] };
    const lessFeed = { season: SEASON, standards: Object.fromEntries(['1', '2', '3', '4'].map((l) => [l, { annualNShare: 0.05 }])) };
    const a = await save(head, 'North lawn to level 2', lawnUp);
    const b = await save(head, 'Every level fed a twentieth', lessFeed);
    expect(a).toMatchObject({ name: 'North lawn to level 2', season: SEASON, districtId: north, scopeName: 'Test North', mine: true, change: lawnUp });
    expect(b).toMatchObject({ districtId: null, scopeName: 'Department' });

    const list = (await head.get(`/api/what-if/scenarios?season=${SEASON}`).expect(200)).body as WhatIfScenarioList;
    expect(list.items.map((s) => s.id).slice(0, 2)).toEqual([b.id, a.id]);

    // Each recomputed: the same as a preview of its change today.
    const compared = (await head.get(`/api/what-if/scenarios/compare?ids=${a.id},${b.id}`).expect(200)).body as WhatIfCompareAnswer;
    expect(compared.items.map((i) => i.scenario.id)).toEqual([a.id, b.id]);
    for (const [i, change] of [lawnUp, lessFeed].entries()) {
      const preview = (await head.post('/api/what-if').send(change).expect(200)).body as WhatIfAnswer;
      expect(compared.items[i]!.answer).toEqual(preview);
    }
    expect(compared.items[0]!.answer.result.delta.totals.mowings).toBeGreaterThan(0);
    expect(compared.items[1]!.answer.result.delta.totals.nKg).toBeLessThan(0);

    // Only the one who saved it removes it: the administrator's is refused to the head.
    const admin = await api.signIn('admin');
    const theirs = await save(admin, 'Administrator’s', lessFeed);
    expect((await head.delete(`/api/what-if/scenarios/${theirs.id}`)).status).toBe(403);
    await head.delete(`/api/what-if/scenarios/${a.id}`).expect(204);
    expect((await head.delete(`/api/what-if/scenarios/${a.id}`)).status).toBe(404);
    expect(((await head.get('/api/what-if/scenarios').expect(200)).body as WhatIfScenarioList).items.map((s) => s.id)).not.toContain(a.id);

    const audit = await api.database.db.select().from(auditLog).where(eq(auditLog.entity, 'what_if_scenario')).orderBy(auditLog.id);
    expect(audit.filter((e) => e.entityId === a.id).map((e) => e.action)).toEqual(['create', 'delete']);
    expect(audit.find((e) => e.entityId === a.id && e.action === 'create')!.districtId).toBe(north);
  });

  test('should keep a foreman to his district’s scenarios: never seen, compared or removed elsewhere', async () => {
    const head = await api.signIn('head');
    const foreman = await api.signIn('foreman');
    const south = api.fixture.districts.south;
    const southOne = await save(head, 'South baseball to level 1', { season: SEASON, districtId: south, moves: [{ fieldId: api.fixture.fields.southBaseball, level: 1 }] });
    const department = await save(head, 'Department, level 3 fed less', { season: SEASON, standards: { '3': { annualNShare: 0.5 } } });
    // No district named: his own.
    const own = await save(foreman, 'Soccer field to level 3', { season: SEASON, moves: [{ fieldId: api.fixture.fields.northSoccer, level: 3 }] });
    const own2 = await save(foreman, 'Lawn to level 3', { season: SEASON, moves: [{ fieldId: api.fixture.fields.northLawn, level: 3 }] });
    expect(own.districtId).toBe(api.fixture.districts.north);

    const seen = ((await foreman.get('/api/what-if/scenarios').expect(200)).body as WhatIfScenarioList).items;
    expect(seen.length).toBeGreaterThan(0);
    expect(seen.every((s) => s.districtId === api.fixture.districts.north)).toBe(true);
    expect(seen.map((s) => s.id)).not.toContain(southOne.id);
    expect(seen.map((s) => s.id)).not.toContain(department.id);

    await foreman.get(`/api/what-if/scenarios/compare?ids=${own.id},${own2.id}`).expect(200);
    for (const other of [southOne, department]) {
      expect((await foreman.get(`/api/what-if/scenarios/compare?ids=${own.id},${other.id}`)).status).toBe(404);
      expect((await foreman.delete(`/api/what-if/scenarios/${other.id}`)).status).toBe(404);
    }
    // Saving in another district, or the department, or moving another district's field.
    expect((await foreman.post('/api/what-if/scenarios').send({ name: 'x', change: { season: SEASON, districtId: south, moves: [] } })).status).toBe(403);
    expect((await foreman.post('/api/what-if/scenarios').send({ name: 'x', change: { season: SEASON, moves: [{ fieldId: api.fixture.fields.southBaseball, level: 1 }] } })).status).toBe(403);
    // The other district's foreman cannot remove this one's either.
    const foremanSouth = await api.signIn('foremanSouth');
    expect((await foremanSouth.delete(`/api/what-if/scenarios/${own.id}`)).status).toBe(404);
    for (const who of ['crew', 'partner'] as const) {
      const agent = await api.signIn(who);
      expect((await agent.get('/api/what-if/scenarios')).status).toBe(403);
      expect((await agent.post('/api/what-if/scenarios').send({ name: 'x', change: { season: SEASON, moves: [] } })).status).toBe(403);
    }
    await foreman.delete(`/api/what-if/scenarios/${own.id}`).expect(204);
  });

  test('should refuse bad scenarios and comparisons with a 400', async () => {
    const head = await api.signIn('head');
    const ok = { season: SEASON, moves: [] };
    const bad = [
      { name: '', change: ok },
      { name: 'x'.repeat(121), change: ok },
      { name: 'No change given' },
      { name: 'Bad level', change: { season: SEASON, moves: [{ fieldId: api.fixture.fields.northLawn, level: 0 }] } },
      { name: 'Unknown field', change: { season: SEASON, moves: [{ fieldId: 987654, level: 2 }] } },
      { name: 'Unknown Standard', change: { season: SEASON, standards: { '2': { colour: 'green' } } } },
      { name: 'Extra', change: ok, result: {} },
    ];
    for (const body of bad) expect((await head.post('/api/what-if/scenarios').send(body)).status, JSON.stringify(body)).toBe(400);
    for (const q of ['ids=1', 'ids=1,2,3,4,5', 'ids=a,b', 'ids=2,2', '', 'ids=1,2&x=1']) expect((await head.get(`/api/what-if/scenarios/compare?${q}`)).status, q).toBe(400);
    expect((await head.get('/api/what-if/scenarios/compare?ids=987654,987655')).status).toBe(404);
    expect((await head.delete('/api/what-if/scenarios/abc')).status).toBe(400);
  });
});

describe('what-if season basis', () => {
  test('should work out the scope’s season once for many previews, and again after a field it reads is written', async () => {
    const head = await api.signIn('head');
    const d = api.fixture.districts.north;
    const lawn = api.fixture.fields.northLawn;
    const { db } = api.database;
    const selects = vi.spyOn(db, 'select');
    const preview = async (level: number) => {
      selects.mockClear();
      const res = await head.post('/api/what-if').send({ season: SEASON, districtId: d, moves: [{ fieldId: lawn, level }] });
      expect(res.status).toBe(200);
      return { reads: selects.mock.calls.length, result: (res.body as WhatIfAnswer).result };
    };
    try {
      // A write first, so nothing an earlier test worked out is left.
      const [row] = await db.select().from(fields).where(eq(fields.id, lawn));
      await head.patch(`/api/fields/${lawn}`).send({ version: row!.version, name: 'Great Lawn' }).expect(200);
      const first = await preview(3);
      const second = await preview(2);
      // The fields, Standards, stations and weather are not read again for the second preview.
      expect(second.reads).toBeLessThan(first.reads);
      expect(second.result.before).toEqual(first.result.before);
      expect(second.result.fieldsTouched).toBe(1);

      // The lawn really moved to level 2: the next preview starts from there.
      const [now] = await db.select().from(fields).where(eq(fields.id, lawn));
      await head.patch(`/api/fields/${lawn}`).send({ version: now!.version, maintenanceLevel: 2 }).expect(200);
      const third = await preview(2);
      expect(third.reads).toBeGreaterThan(second.reads);
      expect(third.result.fieldsTouched).toBe(0);
      expect(third.result.before).toEqual(second.result.after);
    } finally {
      selects.mockRestore();
    }
  });
});
