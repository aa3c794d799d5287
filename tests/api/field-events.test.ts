import { eq } from 'drizzle-orm';
import { describe, expect, test } from 'vitest';
import { addDaysIso, DEFAULT_TIME_ZONE, localToday } from '@swardwise/domain';
import { auditLog, fieldEvents } from '../../apps/api/src/db/schema/index.ts';
import { addUser } from '../support/fixture.ts';
import { useTestApi } from '../support/app.ts';

const api = useTestApi();

const SOON = addDaysIso(localToday(DEFAULT_TIME_ZONE), 5);
const game = (fieldId: number, over: Record<string, unknown> = {}) => ({ fieldId, kind: 'game', title: 'Invented league game', startsOn: SOON, startTime: '18:30', ...over });
const count = async () => (await api.database.db.select().from(fieldEvents)).length;

describe('field events', () => {
  test('should let a foreman book, move and cancel a game in his district, audited, with the field’s site and district', async () => {
    const foreman = await api.signIn('foreman');
    const res = await foreman.post('/api/field-events').send(game(api.fixture.fields.northSoccer));
    expect(res.status).toBe(201);
    expect(res.body.event).toMatchObject({
      fieldId: api.fixture.fields.northSoccer,
      fieldName: 'Soccer 1',
      siteId: api.fixture.sites.northPark,
      siteName: 'Test Park North',
      districtId: api.fixture.districts.north,
      kind: 'game',
      startTime: '18:30',
      notes: '',
      version: 1,
    });
    const id = res.body.event.id;
    // Moving it to the school's field takes the school's site with it.
    const moved = await foreman.patch(`/api/field-events/${id}`).send({ version: 1, fieldId: api.fixture.fields.northSchoolFootball, startTime: null });
    expect(moved.status).toBe(200);
    expect(moved.body.event).toMatchObject({ siteId: api.fixture.sites.northSchool, startTime: null, version: 2 });
    expect((await foreman.delete(`/api/field-events/${id}?version=2`)).status).toBe(204);
    const audit = await api.database.db.select().from(auditLog).where(eq(auditLog.entity, 'field_event')).orderBy(auditLog.id);
    expect(audit.filter((a) => a.entityId === id).map((a) => a.action)).toEqual(['create', 'update', 'delete']);
    expect(await count()).toBe(0);
  });

  test('should refuse a foreman a booking in another district, and moving his own there', async () => {
    const foreman = await api.signIn('foreman');
    expect((await foreman.post('/api/field-events').send(game(api.fixture.fields.southBaseball))).status).toBe(403);
    const mine = await foreman.post('/api/field-events').send(game(api.fixture.fields.northLawn, { kind: 'ceremony', title: 'Invented picnic' }));
    const away = await foreman.patch(`/api/field-events/${mine.body.event.id}`).send({ version: 1, fieldId: api.fixture.fields.southBaseball });
    expect(away.status).toBe(403);
    const south = await api.signIn('foremanSouth');
    expect((await south.patch(`/api/field-events/${mine.body.event.id}`).send({ version: 1, title: 'Taken over' })).status).toBe(403);
    expect((await south.delete(`/api/field-events/${mine.body.event.id}?version=1`)).status).toBe(403);
    const [row] = await api.database.db.select().from(fieldEvents).where(eq(fieldEvents.id, mine.body.event.id));
    expect(row).toMatchObject({ title: 'Invented picnic', fieldId: api.fixture.fields.northLawn, version: 1 });
    // Nor may the south foreman see it.
    const list = await south.get('/api/field-events');
    expect(list.body.items.map((e: { id: number }) => e.id)).not.toContain(mine.body.event.id);
    await foreman.delete(`/api/field-events/${mine.body.event.id}?version=1`);
  });

  test('should let a partner book on his own site only', async () => {
    const partner = await api.signIn('partner');
    const own = await partner.post('/api/field-events').send(game(api.fixture.fields.northSchoolFootball, { kind: 'tournament', title: 'Invented school tournament' }));
    expect(own.status).toBe(201);
    expect(own.body.event.siteId).toBe(api.fixture.sites.northSchool);
    const edit = await partner.patch(`/api/field-events/${own.body.event.id}`).send({ version: 1, notes: 'Two days, eight teams' });
    expect(edit.status).toBe(200);
    expect((await partner.post('/api/field-events').send(game(api.fixture.fields.northSoccer))).status).toBe(403);
    expect((await partner.patch(`/api/field-events/${own.body.event.id}`).send({ version: 2, fieldId: api.fixture.fields.northSoccer })).status).toBe(403);
    // A foreman's booking on the city park is not the partner's to see.
    const foreman = await api.signIn('foreman');
    const park = await foreman.post('/api/field-events').send(game(api.fixture.fields.northSoccer, { title: 'Invented park game' }));
    const list = await partner.get('/api/field-events');
    expect(list.status).toBe(200);
    expect(list.body.items.map((e: { id: number }) => e.id)).toEqual([own.body.event.id]);
    expect((await partner.delete(`/api/field-events/${park.body.event.id}?version=1`)).status).toBe(403);
    expect((await partner.delete(`/api/field-events/${own.body.event.id}?version=2`)).status).toBe(204);
    await foreman.delete(`/api/field-events/${park.body.event.id}?version=1`);
  });

  test('should let a partner change or cancel only the bookings he made, not the department’s or another partner’s', async () => {
    const { db } = api.database;
    const field = api.fixture.fields.northSchoolFootball;
    const other = await addUser(db, 'otherPartner', 'partner', { siteIds: [api.fixture.sites.northSchool] });
    const partner = await api.signIn('partner');
    const otherPartner = await api.signInAs(other.email);
    const foreman = await api.signIn('foreman');
    const mine = (await partner.post('/api/field-events').send(game(field, { title: 'Invented school game' }))).body.event;
    const theirs = (await otherPartner.post('/api/field-events').send(game(field, { title: 'Invented league game' }))).body.event;
    const department = (await foreman.post('/api/field-events').send(game(field, { kind: 'ceremony', title: 'Invented department day' }))).body.event;
    expect([mine.createdBy, theirs.createdBy, department.createdBy]).toEqual([api.fixture.users.partner.id, other.id, api.fixture.users.foreman.id]);

    for (const booking of [theirs, department]) {
      const edit = await partner.patch(`/api/field-events/${booking.id}`).send({ version: 1, title: 'Taken over', startsOn: addDaysIso(SOON, 1) });
      expect(edit.status).toBe(403);
      expect(edit.body.error.code).toBe('auth/forbidden');
      expect((await partner.delete(`/api/field-events/${booking.id}?version=1`)).status).toBe(403);
      const [row] = await db.select().from(fieldEvents).where(eq(fieldEvents.id, booking.id));
      expect(row).toMatchObject({ title: booking.title, startsOn: SOON, version: 1 });
    }
    // He still sees them (the field's calendar), and changes his own.
    const list = await partner.get(`/api/field-events?fieldId=${field}`);
    expect(list.body.items.map((e: { id: number }) => e.id).sort()).toEqual([mine.id, theirs.id, department.id].sort());
    expect((await partner.patch(`/api/field-events/${mine.id}`).send({ version: 1, notes: 'Kick-off moved' })).status).toBe(200);
    expect((await partner.delete(`/api/field-events/${mine.id}?version=2`)).status).toBe(204);
    // The other partner changes his own, and the foreman any in his district.
    expect((await otherPartner.delete(`/api/field-events/${theirs.id}?version=1`)).status).toBe(204);
    expect((await foreman.delete(`/api/field-events/${department.id}?version=1`)).status).toBe(204);
  });

  test('should let a crew lead and the head read bookings but change none', async () => {
    const foreman = await api.signIn('foreman');
    const north = await foreman.post('/api/field-events').send(game(api.fixture.fields.northLawn, { title: 'Invented north game' }));
    const admin = await api.signIn('admin');
    const south = await admin.post('/api/field-events').send(game(api.fixture.fields.southBaseball, { title: 'Invented south game' }));
    expect(south.status).toBe(201);

    const crew = await api.signIn('crew');
    const crewList = await crew.get('/api/field-events');
    expect(crewList.status).toBe(200);
    expect(crewList.body.items.map((e: { id: number }) => e.id)).toEqual([north.body.event.id]);
    expect((await crew.post('/api/field-events').send(game(api.fixture.fields.northLawn))).status).toBe(403);
    expect((await crew.patch(`/api/field-events/${north.body.event.id}`).send({ version: 1, title: 'Crew edit' })).status).toBe(403);
    expect((await crew.delete(`/api/field-events/${north.body.event.id}?version=1`)).status).toBe(403);

    const head = await api.signIn('head');
    const headList = await head.get('/api/field-events');
    expect(headList.body.items.map((e: { id: number }) => e.id).sort()).toEqual([north.body.event.id, south.body.event.id].sort());
    expect((await head.post('/api/field-events').send(game(api.fixture.fields.northLawn))).status).toBe(403);
    expect((await head.patch(`/api/field-events/${south.body.event.id}`).send({ version: 1, title: 'Head edit' })).status).toBe(403);
    expect((await head.delete(`/api/field-events/${south.body.event.id}?version=1`)).status).toBe(403);

    await foreman.delete(`/api/field-events/${north.body.event.id}?version=1`);
    await admin.delete(`/api/field-events/${south.body.event.id}?version=1`);
  });

  test('should filter by dates, field, site and district', async () => {
    const admin = await api.signIn('admin');
    const made = [];
    for (const [fieldId, startsOn] of [
      [api.fixture.fields.northSoccer, '2026-06-06'],
      [api.fixture.fields.northSoccer, '2026-06-20'],
      [api.fixture.fields.northSchoolFootball, '2026-06-13'],
      [api.fixture.fields.southBaseball, '2026-06-13'],
    ] as const) {
      made.push((await admin.post('/api/field-events').send(game(fieldId, { startsOn }))).body.event);
    }
    const ids = (res: { body: { items: { id: number }[] } }) => res.body.items.map((e) => e.id);
    const june = await admin.get('/api/field-events?from=2026-06-01&to=2026-06-30');
    // In date order, then by time.
    expect(june.body.items.map((e: { startsOn: string }) => e.startsOn)).toEqual(['2026-06-06', '2026-06-13', '2026-06-13', '2026-06-20']);
    expect(ids(await admin.get('/api/field-events?from=2026-06-01&to=2026-06-10'))).toEqual([made[0].id]);
    expect(ids(await admin.get(`/api/field-events?from=2026-06-01&to=2026-06-30&fieldId=${api.fixture.fields.northSoccer}`))).toEqual([made[0].id, made[1].id]);
    expect(ids(await admin.get(`/api/field-events?from=2026-06-01&to=2026-06-30&siteId=${api.fixture.sites.northSchool}`))).toEqual([made[2].id]);
    expect(ids(await admin.get(`/api/field-events?from=2026-06-01&to=2026-06-30&districtId=${api.fixture.districts.south}`))).toEqual([made[3].id]);
    // Without dates: from today on, so June's past games are not in it.
    expect(ids(await admin.get('/api/field-events'))).toEqual([]);
    for (const e of made) await admin.delete(`/api/field-events/${e.id}?version=1`);
  });

  test('should refuse bad input with a 400 and field issues, writing nothing', async () => {
    const admin = await api.signIn('admin');
    const before = await count();
    const bad = await admin.post('/api/field-events').send({ fieldId: api.fixture.fields.northSoccer, kind: 'concert', title: 'x', startsOn: '2026-13-40', startTime: '25:00' });
    expect(bad.status).toBe(400);
    expect(bad.body.error.details.issues.map((i: { path: string }) => i.path).sort()).toEqual(['body.kind', 'body.startTime', 'body.startsOn', 'body.title']);
    const noField = await admin.post('/api/field-events').send(game(999_999));
    expect(noField.status).toBe(400);
    expect(noField.body.error.details.issues).toEqual([{ path: 'body.fieldId', message: 'no such field' }]);
    expect((await admin.post('/api/field-events').set('Content-Type', 'application/json').send('{"fieldId": ')).status).toBe(400);
    expect((await admin.get('/api/field-events?from=2026-07-01&to=2026-06-01')).status).toBe(400);
    expect((await admin.get('/api/field-events?from=2026-01-01&to=2027-12-31')).status).toBe(400);
    expect((await admin.get('/api/field-events?fieldId=abc')).status).toBe(400);
    expect((await admin.patch('/api/field-events/abc').send({ version: 1 })).status).toBe(400);
    expect((await admin.delete('/api/field-events/1')).status).toBe(400);
    expect((await admin.patch('/api/field-events/999999').send({ version: 1, title: 'Nobody' })).status).toBe(404);
    expect(await count()).toBe(before);

    const made = await admin.post('/api/field-events').send(game(api.fixture.fields.northSoccer));
    const noVersion = await admin.patch(`/api/field-events/${made.body.event.id}`).send({ title: 'No version' });
    expect(noVersion.status).toBe(400);
    expect(noVersion.body.error.details.issues[0].path).toBe('body.version');
    await admin.delete(`/api/field-events/${made.body.event.id}?version=1`);
  });

  test('should answer a stale version with 409 and keep the newer change', async () => {
    const foreman = await api.signIn('foreman');
    const made = await foreman.post('/api/field-events').send(game(api.fixture.fields.northSoccer));
    const id = made.body.event.id;
    expect((await foreman.patch(`/api/field-events/${id}`).send({ version: 1, title: 'First change' })).status).toBe(200);
    const stale = await foreman.patch(`/api/field-events/${id}`).send({ version: 1, title: 'Second change' });
    expect(stale.status).toBe(409);
    expect(stale.body.error.code).toBe('field_event/version_conflict');
    expect((await foreman.delete(`/api/field-events/${id}?version=1`)).status).toBe(409);
    const [row] = await api.database.db.select().from(fieldEvents).where(eq(fieldEvents.id, id));
    expect(row).toMatchObject({ title: 'First change', version: 2 });
    await foreman.delete(`/api/field-events/${id}?version=2`);
  });
});
