import { and, eq } from 'drizzle-orm';
import { describe, expect, test } from 'vitest';
import { addDaysIso, DEFAULT_TIME_ZONE, localToday, mondayOf } from '@swardwise/domain';
import { auditLog, fieldChecks, fieldClosures, fields, workOrders } from '../../apps/api/src/db/schema/index.ts';
import { giveWork } from '../support/fixture.ts';
import { useTestApi } from '../support/app.ts';

const api = useTestApi();
const today = () => localToday(DEFAULT_TIME_ZONE);

async function fieldVersion(id: number) {
  const [row] = await api.database.db.select({ version: fields.version, status: fields.status }).from(fields).where(eq(fields.id, id));
  return row!;
}

const close = (over: Record<string, unknown> = {}) => ({ status: 'closed', reason: 'wet', note: 'Standing water on the east goal', expectedReopenOn: addDaysIso(today(), 3), ...over });

describe('closures', () => {
  test('should let a foreman close a field of his district and reopen it, keeping the history, fields.status in step, audited', async () => {
    const foreman = await api.signIn('foreman');
    const id = api.fixture.fields.northLawn;
    const { version } = await fieldVersion(id);
    const closed = await foreman.post(`/api/fields/${id}/closures`).send(close({ version }));
    expect(closed.status).toBe(201);
    expect(closed.body.closure).toMatchObject({ fieldId: id, status: 'closed', reason: 'wet', toAt: null, decidedBy: api.fixture.users.foreman.id, decidedByName: 'Test foreman' });
    expect(await fieldVersion(id)).toEqual({ version: version + 1, status: 'closed' });
    // A stale version changes nothing.
    expect((await foreman.post(`/api/fields/${id}/reopen`).send({ version })).status).toBe(409);
    const reopened = await foreman.post(`/api/fields/${id}/reopen`).send({ version: closed.body.fieldVersion });
    expect(reopened.status).toBe(201);
    expect((await fieldVersion(id)).status).toBe('open');
    // Reopening an open field is a conflict, not a new row.
    expect((await foreman.post(`/api/fields/${id}/reopen`).send({ version: reopened.body.fieldVersion })).body.error.code).toBe('field/not_closed');

    const read = await foreman.get(`/api/fields/${id}/closures`);
    expect(read.status).toBe(200);
    const { history, current } = read.body.closures;
    expect(history.map((h: { status: string }) => h.status)).toEqual(['open', 'closed']);
    expect(history[1].toAt).toBe(history[0].fromAt);
    expect(current.status).toBe('open');
    const audit = await api.database.db.select().from(auditLog).where(eq(auditLog.entity, 'field_closure')).orderBy(auditLog.id);
    expect(audit.map((a) => a.entityId).sort()).toEqual(history.map((h: { id: number }) => h.id).sort());
  });

  test('should refuse closing to crews, partners and a foreman of another district, and let the head and the administrator close', async () => {
    const id = api.fixture.fields.northSchoolFootball;
    const { version } = await fieldVersion(id);
    for (const who of ['crew', 'partner', 'foremanSouth'] as const) {
      const agent = await api.signIn(who);
      const res = await agent.post(`/api/fields/${id}/closures`).send(close({ version }));
      expect(res.status, who).toBe(403);
      expect((await agent.post(`/api/fields/${id}/reopen`).send({ version })).status, who).toBe(403);
    }
    expect(await fieldVersion(id)).toEqual({ version, status: 'open' });
    expect(await api.database.db.select().from(fieldClosures).where(eq(fieldClosures.fieldId, id))).toEqual([]);
    // The partner of the school reads why its field is closed; the south foreman does not.
    const head = await api.signIn('head');
    const byHead = await head.post(`/api/fields/${id}/closures`).send(close({ version, status: 'restricted', reason: 'event' }));
    expect(byHead.status).toBe(201);
    const partner = await api.signIn('partner');
    const seen = await partner.get(`/api/fields/${id}/closures`);
    expect(seen.status).toBe(200);
    expect(seen.body.closures.current).toMatchObject({ status: 'restricted', reason: 'event' });
    expect(seen.body.closures.plannedWork).toEqual([]);
    expect((await (await api.signIn('foremanSouth')).get(`/api/fields/${id}/closures`)).status).toBe(403);
    const admin = await api.signIn('admin');
    expect((await admin.post(`/api/fields/${id}/reopen`).send({ version: byHead.body.fieldVersion })).status).toBe(201);
  });

  test('should show a crew lead the closure history of a field of his crew’s work, and not of another field', async () => {
    const crew = await api.signIn('crew');
    const { fields: f, crews } = api.fixture;
    await giveWork(api.database.db, f.northLawn, crews.north, 1);
    const own = await crew.get(`/api/fields/${f.northLawn}/closures`);
    expect(own.status).toBe(200);
    expect(own.body.closures.fieldId).toBe(f.northLawn);
    expect((await crew.get(`/api/fields/${f.southBaseball}/closures`)).status).toBe(403);
  });

  test('should answer 400 for a bad body and write nothing', async () => {
    const foreman = await api.signIn('foreman');
    const id = api.fixture.fields.northSoccer;
    const { version } = await fieldVersion(id);
    for (const body of [close({ version, reason: 'rain dance' }), close({ version, status: 'retired' }), close({ version, expectedReopenOn: '2001-02-30' }), close({ version, fromAt: '2099-01-01T00:00:00Z' }), { status: 'closed' }]) {
      const res = await foreman.post(`/api/fields/${id}/closures`).send(body);
      expect(res.status, JSON.stringify(body)).toBe(400);
    }
    expect(await fieldVersion(id)).toEqual({ version, status: 'open' });
  });

  describe('with planned work', () => {
    /** Soccer 1 with a mowing of the north crew `daysFromToday` ahead, the foreman signed in, and the field's version. */
    async function fieldWithWork(daysFromToday: number) {
      const { db } = api.database;
      const id = api.fixture.fields.northSoccer;
      const order = await giveWork(db, id, api.fixture.crews.north, daysFromToday);
      const foreman = await api.signIn('foreman');
      const { version } = await fieldVersion(id);
      return { db, id, order, foreman, version };
    }

    test('should ask what to do with the work, then keep it', async () => {
      const { db, id, order, foreman, version } = await fieldWithWork(1);
      const asked = await foreman.post(`/api/fields/${id}/closures`).send(close({ version }));
      expect(asked.status).toBe(400);
      expect(asked.body.error.details.issues[0].path).toBe('body.work');
      expect((await fieldVersion(id)).status).toBe('open');
      // The field page lists it before closing.
      expect((await foreman.get(`/api/fields/${id}/closures`)).body.closures.plannedWork.map((w: { id: number }) => w.id)).toContain(order);
      const kept = await foreman.post(`/api/fields/${id}/closures`).send(close({ version, work: 'keep' }));
      expect(kept.status).toBe(201);
      expect(kept.body.work.kept).toEqual([order]);
      expect(kept.body.closure).toMatchObject({ workChoice: 'keep', workCount: 1 });
      const [row] = await db.select().from(workOrders).where(eq(workOrders.id, order));
      expect(row).toMatchObject({ status: 'assigned', plannedDate: addDaysIso(today(), 1) });
      await foreman.post(`/api/fields/${id}/reopen`).send({ version: kept.body.fieldVersion });
      await db.delete(workOrders).where(eq(workOrders.id, order));
    });

    test('should move the work to the crew’s first working day from the expected reopening, audited, and tell the crew lead', async () => {
      const { db, id, order, foreman, version } = await fieldWithWork(0);
      // Work after the expected reopening is not the closure's business.
      const later = await giveWork(db, id, api.fixture.crews.north, 9);
      // Moving needs the day to move to.
      expect((await foreman.post(`/api/fields/${id}/closures`).send(close({ version, work: 'move', expectedReopenOn: null }))).status).toBe(400);
      const reopen = addDaysIso(today(), 4);
      const res = await foreman.post(`/api/fields/${id}/closures`).send(close({ version, work: 'move', expectedReopenOn: reopen }));
      expect(res.status).toBe(201);
      expect(res.body.work.moved).toHaveLength(1);
      const to = res.body.work.moved[0].to as string;
      expect(to >= reopen).toBe(true);
      expect(['sat', 'sun']).not.toContain(new Date(`${to}T12:00:00Z`).toLocaleDateString('en-US', { weekday: 'short', timeZone: 'UTC' }).toLowerCase().slice(0, 3));
      const [moved] = await db.select().from(workOrders).where(eq(workOrders.id, order));
      expect(moved).toMatchObject({ plannedDate: to, weekStart: mondayOf(to), pinned: true, status: 'assigned' });
      const [untouched] = await db.select().from(workOrders).where(eq(workOrders.id, later));
      expect(untouched!.plannedDate).toBe(addDaysIso(today(), 9));
      const audit = await db.select().from(auditLog).where(and(eq(auditLog.entity, 'work_order'), eq(auditLog.entityId, order))).orderBy(auditLog.id);
      expect(audit.at(-1)!.after).toMatchObject({ plannedDate: to });
      await api.background.idle();
      const told = await api.mail.waitFor((m) => m.to.includes(api.fixture.users.crew.email) && /Work moved/.test(m.subject));
      expect(told.text).toMatch(/Soccer 1/);
      await foreman.post(`/api/fields/${id}/reopen`).send({ version: res.body.fieldVersion });
      await db.delete(workOrders).where(eq(workOrders.fieldId, id));
    });

    test('should cancel the work with the closure’s reason in the same transaction', async () => {
      const { db, id, order, foreman, version } = await fieldWithWork(2);
      const res = await foreman.post(`/api/fields/${id}/closures`).send(close({ version, reason: 'lightning', work: 'cancel' }));
      expect(res.status).toBe(201);
      expect(res.body.work.cancelled).toEqual([order]);
      const [row] = await db.select().from(workOrders).where(eq(workOrders.id, order));
      expect(row!.status).toBe('skipped');
      expect(row!.notes).toMatch(/field closed \(lightning\)/);
      // A stale close rolls everything back: the order stays as it was.
      const again = await giveWork(db, id, api.fixture.crews.north, 1);
      expect((await foreman.post(`/api/fields/${id}/closures`).send(close({ version, work: 'cancel' }))).status).toBe(409);
      const [still] = await db.select().from(workOrders).where(eq(workOrders.id, again));
      expect(still!.status).toBe('assigned');
      await foreman.post(`/api/fields/${id}/reopen`).send({ version: res.body.fieldVersion });
      await db.delete(workOrders).where(eq(workOrders.fieldId, id));
    });
  });

  test('should e-mail the site’s partners when a field closes and when it reopens, without the internal note', async () => {
    const id = api.fixture.fields.northSchoolFootball;
    const foreman = await api.signIn('foreman');
    // Mail of the tests before (a crew lead told of moved work) is sent in the background: let it go first.
    await api.background.idle();
    api.mail.clear();
    const { version } = await fieldVersion(id);
    const res = await foreman.post(`/api/fields/${id}/closures`).send(close({ version, reason: 'lightning', note: 'Internal: radio the yard' }));
    expect(res.status).toBe(201);
    await api.background.idle();
    const closedMail = await api.mail.waitFor((m) => m.to.includes(api.fixture.users.partner.email) && /Closed: Stadium/.test(m.subject));
    expect(closedMail.text).toMatch(/30 minutes after the last thunder/);
    expect(closedMail.text).not.toMatch(/radio the yard/);
    await foreman.post(`/api/fields/${id}/reopen`).send({ version: res.body.fieldVersion });
    await api.background.idle();
    const openMail = await api.mail.waitFor((m) => m.to.includes(api.fixture.users.partner.email) && /Reopened: Stadium/.test(m.subject));
    expect(openMail.text).toMatch(/open for play again/);
    // Nobody else's partner hears of it: the fixture's partner is the only one linked to the school.
    expect(api.mail.messages().every((m) => m.to.every((t) => t === api.fixture.users.partner.email))).toBe(true);
  });

  test('should suggest closing a field whose latest check reads above the tester’s limit', async () => {
    const { db } = api.database;
    const id = api.fixture.fields.northLawn;
    await db.insert(fieldChecks).values({ fieldId: id, checkedOn: today(), turfCoverPct: 90, weedsPct: 5, barePct: 5, gmax: 215, gmaxDevice: 'f355_missile_a', evenness: 4, score: 80 });
    const foreman = await api.signIn('foreman');
    const res = await foreman.get(`/api/fields/${id}/closures`);
    expect(res.body.closures.suggestion).toMatchObject({ status: 'closed', reason: 'hardness' });
    expect(res.body.closures.suggestion.why).toMatch(/215 Gmax/);
    await db.delete(fieldChecks).where(eq(fieldChecks.fieldId, id));
    expect((await foreman.get(`/api/fields/${id}/closures`)).body.closures.suggestion).toBeNull();
  });
});

describe('the public status board', () => {
  /** Every key at any depth of a JSON value. */
  const keysOf = (value: unknown): string[] =>
    Array.isArray(value) ? value.flatMap(keysOf) : value && typeof value === 'object' ? Object.entries(value).flatMap(([k, v]) => [k, ...keysOf(v)]) : [];

  test('should answer without sign-in, with statuses and plain reasons and nothing else', async () => {
    const id = api.fixture.fields.southBaseball;
    const foreman = await api.signIn('foremanSouth');
    const { version } = await fieldVersion(id);
    const closed = await foreman.post(`/api/fields/${id}/closures`).send(close({ version, reason: 'hardness', note: 'Secret internal note' }));
    expect(closed.status).toBe(201);

    const res = await (await import('supertest')).default(api.app).get('/api/public/status');
    expect(res.status).toBe(200);
    expect(res.headers['cache-control']).toMatch(/max-age=\d+/);
    expect(res.headers.etag).toBeTruthy();
    const keys = new Set(keysOf(res.body));
    expect([...keys].sort()).toEqual(['address', 'at', 'closed', 'counts', 'districts', 'expectedReopenOn', 'fields', 'name', 'open', 'reason', 'restricted', 'since', 'sport', 'sites', 'status'].sort());
    const text = JSON.stringify(res.body);
    expect(text).not.toMatch(/Secret internal note|@test\.example|Test foreman/);
    const diamond = res.body.districts.flatMap((d: { sites: { fields: unknown[] }[] }) => d.sites.flatMap((s) => s.fields)).find((f: { name: string }) => f.name === 'Diamond');
    expect(diamond).toMatchObject({ status: 'closed', reason: 'The playing surface is too hard for safe play.', expectedReopenOn: addDaysIso(today(), 3) });
    expect(diamond.since).toBe(closed.body.closure.fromAt);
    await foreman.post(`/api/fields/${id}/reopen`).send({ version: closed.body.fieldVersion });
  });

  test('should answer 304 to a matching If-None-Match and a new ETag after a change', async () => {
    const request = (await import('supertest')).default;
    const first = await request(api.app).get('/api/public/status');
    const etag = first.headers.etag as string;
    const again = await request(api.app).get('/api/public/status').set('If-None-Match', etag);
    expect(again.status).toBe(304);
    expect(again.text).toBeFalsy();
    const id = api.fixture.fields.southBaseball;
    const { version } = await fieldVersion(id);
    const foreman = await api.signIn('foremanSouth');
    const closed = await foreman.post(`/api/fields/${id}/closures`).send(close({ version, reason: 'renovation' }));
    const changed = await request(api.app).get('/api/public/status').set('If-None-Match', etag);
    expect(changed.status).toBe(200);
    expect(changed.headers.etag).not.toBe(etag);
    await foreman.post(`/api/fields/${id}/reopen`).send({ version: closed.body.fieldVersion });
  });
});
