import fs from 'node:fs';
import path from 'node:path';
import { eq } from 'drizzle-orm';
import { describe, expect, test } from 'vitest';
import { addDaysIso, CLOSURE_REASON_PUBLIC, DEFAULT_TIME_ZONE, localToday, type PartnerFieldAnswer, type PartnerFieldsAnswer } from '@swardwise/domain';
import { fieldChecks, fields, workOrders, workPhotos } from '../../apps/api/src/db/schema/index.ts';
import { addUser, giveWork } from '../support/fixture.ts';
import { useTestApi } from '../support/app.ts';
import { useTempDir } from '../support/temp-dir.ts';

const uploads = useTempDir('sw-partner-');
const api = useTestApi({ UPLOADS_DIR: uploads });
const today = () => localToday(DEFAULT_TIME_ZONE);

/** Every key at any depth of an answer, as `parent.key` paths with array indices dropped. */
function keysOf(value: unknown, prefix = ''): string[] {
  if (Array.isArray(value)) return [...new Set(value.flatMap((v) => keysOf(v, prefix)))];
  if (value === null || typeof value !== 'object') return [];
  return Object.entries(value).flatMap(([k, v]) => [`${prefix}${k}`, ...keysOf(v, `${prefix}${k}.`)]);
}

const LIST_KEYS = [
  'today',
  'cautions',
  'sites',
  'sites.name',
  'sites.address',
  'sites.fields',
  ...['id', 'name', 'sport', 'score', 'checkedOn', 'comingBookings', 'status', 'nextMowing', 'nextLines'].map((k) => `sites.fields.${k}`),
  ...['status', 'headline', 'reason', 'since', 'expectedReopenOn'].map((k) => `sites.fields.status.${k}`),
  ...['on', 'basis'].flatMap((k) => [`sites.fields.nextMowing.${k}`, `sites.fields.nextLines.${k}`]),
].sort();

const FIELD_KEYS = [
  'today',
  'cautions',
  'canBook',
  'field',
  ...['id', 'name', 'sport', 'siteName', 'siteAddress'].map((k) => `field.${k}`),
  'status',
  ...['status', 'headline', 'reason', 'since', 'expectedReopenOn'].map((k) => `status.${k}`),
  'check',
  ...['checkedOn', 'score', 'targetScore', 'meaning', 'photos', 'photos.url', 'photos.width', 'photos.height'].map((k) => `check.${k}`),
  'nextMowing',
  'nextMowing.on',
  'nextMowing.basis',
  'nextLines',
  'nextLines.on',
  'nextLines.basis',
  'agenda',
  ...['type', 'id', 'kind', 'title', 'startsOn', 'startTime', 'notes', 'mine', 'version'].map((k) => `agenda.${k}`),
].sort();

async function fieldVersion(id: number) {
  const [row] = await api.database.db.select({ version: fields.version }).from(fields).where(eq(fields.id, id));
  return row!.version;
}

describe('partner view', () => {
  test('should list only the partner’s own fields, in plain words, with no key beyond the contract', async () => {
    const partner = await api.signIn('partner');
    const res = await partner.get('/api/partner/fields');
    expect(res.status).toBe(200);
    const body = res.body as PartnerFieldsAnswer;
    expect(body.sites.map((s) => s.name)).toEqual(['Test High School']);
    expect(body.sites[0]!.fields.map((f) => f.id)).toEqual([api.fixture.fields.northSchoolFootball]);
    expect(body.sites[0]!.fields[0]!.status).toEqual({ status: 'open', headline: 'Open for play', reason: null, since: null, expectedReopenOn: null });
    expect(keysOf(body).sort()).toEqual(LIST_KEYS);
    expect(body.cautions.join(' ')).toMatch(/wet/i);
    expect(body.cautions.join(' ')).toMatch(/30 minutes after the last thunder/);
    expect(body.cautions.join(' ')).toMatch(/governing body/);
  });

  test('should refuse the staff roles and answer 404 for another school’s field, however the id is guessed', async () => {
    for (const who of ['head', 'foreman', 'crew'] as const) {
      const agent = await api.signIn(who);
      expect((await agent.get('/api/partner/fields')).status, who).toBe(403);
      expect((await agent.get(`/api/partner/fields/${api.fixture.fields.northSchoolFootball}`)).status, who).toBe(403);
    }
    // A partner of another school (the south park) sees none of the high school's fields.
    const other = await addUser(api.database.db, 'otherPartner', 'partner', { siteIds: [api.fixture.sites.southPark] });
    const agent = await api.signInAs(other.email);
    const mine = await agent.get('/api/partner/fields');
    expect(mine.body.sites[0].fields.map((f: { id: number }) => f.id)).toEqual([api.fixture.fields.southBaseball]);
    for (const id of [api.fixture.fields.northSchoolFootball, api.fixture.fields.northSoccer, 999_999]) {
      const res = await agent.get(`/api/partner/fields/${id}`);
      expect(res.status, String(id)).toBe(404);
      expect(res.body.error.code).toBe('field/not_found');
    }
    expect((await agent.get('/api/partner/fields/abc')).status).toBe(400);
  });

  test('should show a closure’s public reason and expected reopening but never its internal note or who decided', async () => {
    const id = api.fixture.fields.northSchoolFootball;
    const foreman = await api.signIn('foreman');
    const reopen = addDaysIso(today(), 4);
    const closed = await foreman
      .post(`/api/fields/${id}/closures`)
      .send({ status: 'closed', reason: 'wet', note: 'Drain 3 blocked, vendor invoice pending', expectedReopenOn: reopen, version: await fieldVersion(id) });
    expect(closed.status).toBe(201);
    const partner = await api.signIn('partner');
    const res = await partner.get(`/api/partner/fields/${id}`);
    expect(res.status).toBe(200);
    const body = res.body as PartnerFieldAnswer;
    expect(body.status).toEqual({ status: 'closed', headline: 'Closed to play', reason: CLOSURE_REASON_PUBLIC.wet, since: today(), expectedReopenOn: reopen });
    expect(JSON.stringify(res.body)).not.toContain('Drain 3');
    expect(JSON.stringify(res.body)).not.toContain('Test foreman');
    const list = await partner.get('/api/partner/fields');
    expect(list.body.sites[0].fields[0].status.expectedReopenOn).toBe(reopen);
    expect(JSON.stringify(list.body)).not.toContain('Drain 3');
    await foreman.post(`/api/fields/${id}/reopen`).send({ version: closed.body.fieldVersion });
  });

  test('should give the latest check with its photos and meaning, the next mowing and line painting, and one list of bookings', async () => {
    const { db } = api.database;
    const id = api.fixture.fields.northSchoolFootball;
    // A done field-check order with a photo, and an older check without.
    const checkOrder = await giveWork(db, id, api.fixture.crews.north, -2);
    await db.update(workOrders).set({ task: 'field_check', status: 'done', plannedHours: 12.5 }).where(eq(workOrders.id, checkOrder));
    fs.writeFileSync(path.join(uploads, 'check-1.jpg'), Buffer.from([0xff, 0xd8, 0xff, 0xd9]));
    const [photo] = await db.insert(workPhotos).values({ workOrderId: checkOrder, fileName: 'check-1.jpg', mime: 'image/jpeg', width: 640, height: 480, bytes: 4 }).returning();
    const check = { fieldId: id, turfCoverPct: 90, weedsPct: 2, barePct: 3, notes: 'Crew note: sprinkler head 7 leaking', checkedBy: api.fixture.users.crew.id };
    await db.insert(fieldChecks).values({ ...check, checkedOn: addDaysIso(today(), -30), score: 40 });
    await db.insert(fieldChecks).values({ ...check, checkedOn: addDaysIso(today(), -2), score: 71.6, workOrderId: checkOrder });
    // Coming work: a mowing in 3 days (and one in 5), lines in 2 days; a done mowing tomorrow does not count.
    await giveWork(db, id, api.fixture.crews.north, 5);
    await giveWork(db, id, api.fixture.crews.north, 3);
    const lines = await giveWork(db, id, api.fixture.crews.north, 2);
    await db.update(workOrders).set({ task: 'paint_lines' }).where(eq(workOrders.id, lines));
    const done = await giveWork(db, id, api.fixture.crews.north, 1);
    await db.update(workOrders).set({ status: 'done' }).where(eq(workOrders.id, done));

    const partner = await api.signIn('partner');
    const foreman = await api.signIn('foreman');
    const own = await partner.post('/api/field-events').send({ fieldId: id, kind: 'game', title: 'Varsity v Rivals', startsOn: addDaysIso(today(), 6), startTime: '18:00', notes: 'Need home bench' });
    expect(own.status).toBe(201);
    const dept = await foreman.post('/api/field-events').send({ fieldId: id, kind: 'other', title: 'Irrigation audit', startsOn: addDaysIso(today(), 1), notes: 'Contractor quote 4,000' });
    expect(dept.status).toBe(201);
    await foreman.post('/api/field-events').send({ fieldId: id, kind: 'game', title: 'Last season', startsOn: addDaysIso(today(), -3) });

    const res = await partner.get(`/api/partner/fields/${id}`);
    expect(res.status).toBe(200);
    const body = res.body as PartnerFieldAnswer;
    expect(keysOf(body).sort()).toEqual(FIELD_KEYS);
    // Level 1's target score is 85 (Standards): 72 is more than 10 points under.
    expect(body.check).toMatchObject({ checkedOn: addDaysIso(today(), -2), score: 72, targetScore: 85 });
    expect(body.check!.meaning).toMatch(/^Worn/);
    expect(body.check!.photos).toEqual([{ url: `/api/partner/fields/${id}/photos/${photo!.id}`, width: 640, height: 480 }]);
    expect(body.nextMowing).toEqual({ on: addDaysIso(today(), 3), basis: 'planned' });
    expect(body.nextLines).toEqual({ on: addDaysIso(today(), 2), basis: 'planned' });
    expect(body.agenda).toEqual([
      { type: 'booking', id: dept.body.event.id, kind: 'other', title: 'Irrigation audit', startsOn: addDaysIso(today(), 1), startTime: null, notes: '', mine: false, version: null },
      { type: 'booking', id: own.body.event.id, kind: 'game', title: 'Varsity v Rivals', startsOn: addDaysIso(today(), 6), startTime: '18:00', notes: 'Need home bench', mine: true, version: 1 },
    ]);
    expect(body.canBook).toBe(true);
    const text = JSON.stringify(body);
    for (const secret of ['sprinkler head', 'Contractor quote', 'Test crew', '12.5', 'plannedHours', 'cost']) expect(text, secret).not.toContain(secret);

    // The photo is served to the partner, and to no other school.
    const image = await partner.get(body.check!.photos[0]!.url);
    expect(image.status).toBe(200);
    expect(image.headers['content-type']).toBe('image/jpeg');
    const other = await addUser(db, 'otherPartner2', 'partner', { siteIds: [api.fixture.sites.southPark] });
    expect((await (await api.signInAs(other.email)).get(body.check!.photos[0]!.url)).status).toBe(404);
    // A photo of another order is not reachable through this field.
    expect((await partner.get(`/api/partner/fields/${id}/photos/${photo!.id + 1000}`)).status).toBe(404);

    const list = await partner.get('/api/partner/fields');
    expect(list.body.sites[0].fields[0]).toMatchObject({ score: 72, checkedOn: addDaysIso(today(), -2), comingBookings: 2, nextMowing: { on: addDaysIso(today(), 3), basis: 'planned' } });
  });

  test('should list the field’s requests beside the bookings with their state, the reason of a decline, and changes only on the partner’s own', async () => {
    const { db } = api.database;
    const id = api.fixture.fields.northSchoolFootball;
    const partner = await api.signIn('partner');
    const foreman = await api.signIn('foreman');
    const colleague = await addUser(db, 'partnerMate', 'partner', { siteIds: [api.fixture.sites.northSchool] });
    const mate = await api.signInAs(colleague.email);
    const gameOn = addDaysIso(today(), 4);
    const game = (await partner.post('/api/requests').send({ fieldId: id, kind: 'game_lines', gameOn, startTime: '17:30', layout: 'football', description: 'Junior varsity game' })).body.request;
    const turf = (await partner.post('/api/requests').send({ fieldId: id, kind: 'damaged_turf', description: 'Goal mouth worn bare' })).body.request;
    const wet = (await partner.post('/api/requests').send({ fieldId: id, kind: 'wet_area', description: 'Puddle by the gate' })).body.request;
    const theirs = (await mate.post('/api/requests').send({ fieldId: id, kind: 'safety', description: 'Loose sprinkler cover' })).body.request;
    const scheduled = await foreman.post(`/api/requests/${turf.id}/schedule`).send({ version: 1, work: { task: 'overseed', plannedDate: addDaysIso(today(), 2), plannedHours: 1, crewId: api.fixture.crews.north } });
    expect(scheduled.status).toBe(200);
    expect((await foreman.post(`/api/requests/${wet.id}/decline`).send({ version: 1, reason: 'Drains are on the spring list' })).status).toBe(200);

    const body = (await partner.get(`/api/partner/fields/${id}`)).body as PartnerFieldAnswer;
    const requests = body.agenda.filter((a) => a.type === 'request');
    expect(requests.map((r) => r.id).sort((a, b) => a - b)).toEqual([game.id, turf.id, wet.id, theirs.id].sort((a, b) => a - b));
    const byId = new Map(requests.map((r) => [r.id, r]));
    expect(byId.get(game.id)).toEqual({ type: 'request', id: game.id, kind: 'game_lines', startsOn: gameOn, gameOn, startTime: '17:30', layout: 'football', description: 'Junior varsity game', state: 'requested', reason: '', mine: true, version: 1 });
    expect(byId.get(turf.id)).toMatchObject({ state: 'scheduled', startsOn: today(), mine: true });
    expect(byId.get(wet.id)).toMatchObject({ state: 'declined', reason: 'Drains are on the spring list' });
    expect(byId.get(theirs.id)).toMatchObject({ state: 'requested', mine: false, version: null });
    // By day: the filed-today requests come before the game four days ahead.
    const days = body.agenda.map((a) => a.startsOn);
    expect(days).toEqual([...days].sort());

    // Another school's partner sees none of it, and a staff view is not touched.
    const other = await addUser(db, 'otherPartner3', 'partner', { siteIds: [api.fixture.sites.southPark] });
    expect((await (await api.signInAs(other.email)).get(`/api/partner/fields/${id}`)).status).toBe(404);
  });
});
