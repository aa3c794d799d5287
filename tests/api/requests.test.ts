import fs from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import { and, eq } from 'drizzle-orm';
import sharp from 'sharp';
import supertest from 'supertest';
import { afterAll, beforeAll, describe, expect, test } from 'vitest';
import { auditLog, fieldEvents, fieldRequestPhotos, fieldRequests, workOrders } from '../../apps/api/src/db/schema/index.ts';
import { addUser } from '../support/fixture.ts';
import { startTestApi, type TestApi } from '../support/app.ts';

let api: TestApi;
let uploadsDir: string;
// The fixture's weather runs 4 May – 7 June 2026; the API stands on Wednesday 20 May, so the
// week of 25 May has weather and a game on Thursday 28 May lies ahead.
const NOW = new Date('2026-05-20T15:00:00Z');
const WEEK = '2026-05-25';
const GAME_ON = '2026-05-28';
/** A second school's athletic director (the south park) and a colleague at the partner's own school. */
let otherSchool: { email: string };
let colleague: { email: string };

beforeAll(async () => {
  uploadsDir = fs.mkdtempSync(path.join(os.tmpdir(), 'swardwise-requests-'));
  api = await startTestApi({ UPLOADS_DIR: uploadsDir }, { now: () => NOW });
  otherSchool = await addUser(api.database.db, 'partnerSouth', 'partner', { siteIds: [api.fixture.sites.southPark] });
  colleague = await addUser(api.database.db, 'partnerColleague', 'partner', { siteIds: [api.fixture.sites.northSchool] });
});
afterAll(async () => {
  await api.close();
  fs.rmSync(uploadsDir, { recursive: true, force: true });
});

const game = (over: Record<string, unknown> = {}) => ({ fieldId: api.fixture.fields.northSchoolFootball, kind: 'game_lines', gameOn: GAME_ON, startTime: '18:30', layout: 'football', description: 'Homecoming game against Eastfield', ...over });
const wet = (over: Record<string, unknown> = {}) => ({ fieldId: api.fixture.fields.northSchoolFootball, kind: 'wet_area', description: 'Water stands by the south end zone after every rain', ...over });
const png = () => sharp({ create: { width: 400, height: 300, channels: 3, background: { r: 60, g: 120, b: 40 } } }).png().toBuffer();
const requestRow = async (id: number) => (await api.database.db.select().from(fieldRequests).where(eq(fieldRequests.id, id)))[0]!;
const mailTo = (email: string, subject: RegExp) => api.mail.waitFor((m) => m.to.includes(email) && subject.test(m.subject));

describe('requests', () => {
  test('should let a partner file a game request for his school’s field, e-mail the foreman, audit it, and list it for both', async () => {
    const partner = await api.signIn('partner');
    const res = await partner.post('/api/requests').send(game());
    expect(res.status).toBe(201);
    expect(res.body.request).toMatchObject({ kind: 'game_lines', state: 'requested', gameOn: GAME_ON, layout: 'football', fieldName: 'Stadium', createdBy: api.fixture.users.partner.id, version: 1 });
    const id = res.body.request.id as number;
    const mail = await mailTo(api.fixture.users.foreman.email, /New request/);
    expect(mail.text).toContain('Homecoming game');
    expect(mail.text).toContain(`/requests?open=${id}`);
    // Only the district's foreman hears of it.
    expect(api.mail.messages().some((m) => m.to.includes(api.fixture.users.foremanSouth.email))).toBe(false);
    const audit = await api.database.db.select().from(auditLog).where(and(eq(auditLog.entity, 'field_request'), eq(auditLog.entityId, id))).orderBy(auditLog.id);
    expect(audit).toHaveLength(1);

    for (const who of ['partner', 'foreman', 'head', 'admin'] as const) {
      const list = await (await api.signIn(who)).get('/api/requests');
      expect(list.status, who).toBe(200);
      expect(list.body.items.map((r: { id: number }) => r.id), who).toContain(id);
    }
    expect((await (await api.signIn('foremanSouth')).get('/api/requests')).body.items).toEqual([]);
    expect((await (await api.signIn('crew')).get('/api/requests')).status).toBe(403);
  });

  test('should keep a partner of one school out of another school’s requests and fields, even by guessing ids', async () => {
    const partner = await api.signIn('partner');
    const filed = (await partner.post('/api/requests').send(wet())).body.request;
    const stranger = await api.signInAs(otherSchool.email);
    expect((await stranger.get('/api/requests')).body.items).toEqual([]);
    // Reading, changing, talking, adding photos: the request does not exist for him.
    expect((await stranger.get(`/api/requests/${filed.id}`)).status).toBe(404);
    expect((await stranger.get(`/api/requests/${filed.id + 1000}`)).status).toBe(404);
    expect((await stranger.patch(`/api/requests/${filed.id}`).send({ version: 1, description: 'mine now' })).status).toBe(404);
    expect((await stranger.post(`/api/requests/${filed.id}/messages`).send({ body: 'hello' })).status).toBe(404);
    expect((await stranger.post(`/api/requests/${filed.id}/photos`).attach('photo', await png(), 'p.png')).status).toBe(404);
    // Filing for the other school's field is refused; a field that does not exist is a bad input.
    expect((await stranger.post('/api/requests').send(wet())).status).toBe(403);
    expect((await stranger.post('/api/requests').send(wet({ fieldId: 999_999 }))).status).toBe(400);
    // A foreman of another district does not see it either.
    expect((await (await api.signIn('foremanSouth')).get(`/api/requests/${filed.id}`)).status).toBe(404);
    // A colleague at the same school reads it but changes only what he filed himself.
    const mate = await api.signInAs(colleague.email);
    expect((await mate.get(`/api/requests/${filed.id}`)).status).toBe(200);
    expect((await mate.patch(`/api/requests/${filed.id}`).send({ version: 1, description: 'changed by someone else' })).status).toBe(403);
    expect((await mate.post(`/api/requests/${filed.id}/photos`).attach('photo', await png(), 'p.png')).status).toBe(403);
    // A partner decides nothing, not even about his own request.
    for (const action of ['schedule', 'decline', 'close']) {
      expect((await partner.post(`/api/requests/${filed.id}/${action}`).send({ version: 1, reason: 'nope' })).status, action).toBe(403);
    }
    expect((await (await api.signIn('crew')).post('/api/requests').send(wet())).status).toBe(403);
    const row = await requestRow(filed.id);
    expect(row).toMatchObject({ description: filed.description, state: 'requested', version: 1 });
    expect(await api.database.db.select().from(fieldRequestPhotos).where(eq(fieldRequestPhotos.requestId, filed.id))).toEqual([]);
  });

  test('should answer 400 for a bad request and write nothing', async () => {
    const partner = await api.signIn('partner');
    const before = (await api.database.db.select().from(fieldRequests)).length;
    const cases: Array<[Record<string, unknown>, string]> = [
      [game({ gameOn: null }), 'body.gameOn'],
      [game({ layout: null }), 'body.layout'],
      [game({ layout: 'cricket' }), 'body.layout'],
      [game({ layout: 'soccer_7v7' }), 'body.layout'],
      [game({ gameOn: '2026-05-19' }), 'body.gameOn'],
      [game({ gameOn: '2026-02-30' }), 'body.gameOn'],
      [game({ startTime: '25:00' }), 'body.startTime'],
      [wet({ kind: 'fireworks' }), 'body.kind'],
      [wet({ description: '' }), 'body.description'],
      [wet({ fieldId: 'stadium' }), 'body.fieldId'],
    ];
    for (const [body, at] of cases) {
      const res = await partner.post('/api/requests').send(body);
      expect(res.status, JSON.stringify(body)).toBe(400);
      expect(res.body.error.details.issues.map((i: { path: string }) => i.path), JSON.stringify(body)).toContain(at);
    }
    expect((await api.database.db.select().from(fieldRequests)).length).toBe(before);
  });

  test('should let the partner change what he filed while it is requested, with a version check', async () => {
    const partner = await api.signIn('partner');
    const filed = (await partner.post('/api/requests').send(game())).body.request;
    const changed = await partner.patch(`/api/requests/${filed.id}`).send({ version: 1, startTime: '19:00', description: 'Kick-off moved to 7 pm' });
    expect(changed.status).toBe(200);
    expect(changed.body.request).toMatchObject({ startTime: '19:00', version: 2 });
    expect((await partner.patch(`/api/requests/${filed.id}`).send({ version: 1, startTime: '17:00' })).status).toBe(409);
    expect((await partner.patch(`/api/requests/${filed.id}`).send({ version: 2, gameOn: null })).status).toBe(400);
    expect((await requestRow(filed.id)).startTime).toBe('19:00');
  });

  test('should let only the partner who filed change the day, layout and words, and not once it is scheduled', async () => {
    const partner = await api.signIn('partner');
    const foreman = await api.signIn('foreman');
    const mate = await api.signInAs(colleague.email);
    const filed = (await partner.post('/api/requests').send(game({ description: 'Senior night' }))).body.request;
    // Own request while requested: day, layout and words change.
    const own = await partner.patch(`/api/requests/${filed.id}`).send({ version: 1, gameOn: '2026-05-29', layout: 'football', description: 'Senior night, moved a day' });
    expect(own.status).toBe(200);
    expect(own.body.request).toMatchObject({ gameOn: '2026-05-29', description: 'Senior night, moved a day', state: 'requested', version: 2 });
    // A colleague at the same school, and the foreman, may not rewrite it.
    const other = await mate.patch(`/api/requests/${filed.id}`).send({ version: 2, description: 'Changed by a colleague' });
    expect(other.status).toBe(403);
    const boss = await foreman.patch(`/api/requests/${filed.id}`).send({ version: 2, description: 'Changed by the foreman' });
    expect(boss.status).toBe(403);
    expect(boss.body.error.message).toContain('Only the partner who filed');
    expect((await requestRow(filed.id)).description).toBe('Senior night, moved a day');
    // Once scheduled, it is fixed: a clear 4xx and nothing changes.
    expect((await foreman.post(`/api/requests/${filed.id}/schedule`).send({ version: 2 })).status).toBe(200);
    const late = await partner.patch(`/api/requests/${filed.id}`).send({ version: 3, description: 'Too late' });
    expect(late.status).toBeGreaterThanOrEqual(400);
    expect(late.status).toBeLessThan(500);
    expect(late.body.error.code).toBe('field_request/not_open');
    expect((await requestRow(filed.id)).description).toBe('Senior night, moved a day');
  });

  test('should e-mail the partner the foreman’s answer and the foreman the partner’s reply', async () => {
    const partner = await api.signIn('partner');
    const foreman = await api.signIn('foreman');
    const filed = (await partner.post('/api/requests').send(wet({ kind: 'safety', description: 'A sprinkler head sticks up by the bench' }))).body.request;
    api.mail.clear();
    const answered = await foreman.post(`/api/requests/${filed.id}/messages`).send({ body: 'Thanks, we will look at it on Monday.' });
    expect(answered.status).toBe(201);
    expect(answered.body.messages).toEqual([expect.objectContaining({ body: 'Thanks, we will look at it on Monday.', authorRole: 'foreman' })]);
    const toPartner = await mailTo(api.fixture.users.partner.email, /Answer to your request/);
    expect(toPartner.text).toContain('look at it on Monday');
    await partner.post(`/api/requests/${filed.id}/messages`).send({ body: 'It is by the home bench.' });
    expect((await mailTo(api.fixture.users.foreman.email, /Reply on request/)).text).toContain('home bench');
    const detail = await partner.get(`/api/requests/${filed.id}`);
    expect(detail.body.messages.map((m: { body: string }) => m.body)).toEqual(['Thanks, we will look at it on Monday.', 'It is by the home bench.']);
    expect(detail.body.request.version).toBe(1);
  });

  test('should turn a game request into a booking the week plan paints lines before; the request is done when the crew logs the painting', async () => {
    const { db } = api.database;
    const partner = await api.signIn('partner');
    const foreman = await api.signIn('foreman');
    const filed = (await partner.post('/api/requests').send(game())).body.request;
    api.mail.clear();
    // A game request needs no work order of its own.
    expect((await foreman.post(`/api/requests/${filed.id}/schedule`).send({ version: 1, work: { task: 'mow', plannedDate: GAME_ON, plannedHours: 1 } })).status).toBe(400);
    const scheduled = await foreman.post(`/api/requests/${filed.id}/schedule`).send({ version: 1, note: 'Lines go on the day before.' });
    expect(scheduled.status).toBe(200);
    expect(scheduled.body.request).toMatchObject({ state: 'scheduled', version: 2 });
    const eventId = scheduled.body.request.eventId as number;
    const [event] = await db.select().from(fieldEvents).where(eq(fieldEvents.id, eventId));
    expect(event).toMatchObject({ fieldId: api.fixture.fields.northSchoolFootball, kind: 'game', startsOn: GAME_ON, startTime: '18:30' });
    const told = await mailTo(api.fixture.users.partner.email, /Scheduled: your request/);
    expect(told.text).toContain('Lines go on the day before.');
    // Scheduling twice is refused.
    expect((await foreman.post(`/api/requests/${filed.id}/schedule`).send({ version: 2 })).body.error.code).toBe('field_request/not_open');

    const week = await foreman.post('/api/week-plans/generate').send({ districtId: api.fixture.districts.north, weekStart: WEEK });
    expect(week.status).toBe(200);
    const paint = (week.body.board.orders as Array<{ id: number; task: string; plannedDate: string; details: Record<string, unknown> }>).find((o) => o.task === 'paint_lines' && o.details.eventId === eventId);
    expect(paint, 'a painting for the booking').toBeDefined();
    // The last working day before the Thursday game.
    expect(paint!.plannedDate).toBe('2026-05-27');
    const detail = await partner.get(`/api/requests/${filed.id}`);
    expect(detail.body.work).toEqual([expect.objectContaining({ id: paint!.id, task: 'paint_lines', plannedDate: '2026-05-27' })]);

    const crew = await api.signIn('crew');
    const logged = await crew.post(`/api/work-orders/${paint!.id}/reports`).send({ status: 'done', actualHours: 1.5 });
    expect(logged.status).toBe(201);
    expect((await requestRow(filed.id)).state).toBe('done');
    expect((await mailTo(api.fixture.users.partner.email, /Done: your request/)).text).toContain('is done');
    const audit = await db.select().from(auditLog).where(and(eq(auditLog.entity, 'field_request'), eq(auditLog.entityId, filed.id))).orderBy(auditLog.id);
    expect(audit.map((a) => (a.after as { state: string }).state)).toEqual(['requested', 'scheduled', 'done']);
  });

  test('should turn another request into one work order, done when the crew logs it', async () => {
    const partner = await api.signIn('partner');
    const foreman = await api.signIn('foreman');
    const filed = (await partner.post('/api/requests').send(wet({ kind: 'damaged_turf', description: 'Goal mouth worn to bare soil' }))).body.request;
    expect((await foreman.post(`/api/requests/${filed.id}/schedule`).send({ version: 1 })).status).toBe(400);
    expect((await foreman.post(`/api/requests/${filed.id}/schedule`).send({ version: 1, work: { task: 'overseed', plannedDate: '2026-05-26', plannedHours: 2, crewId: api.fixture.crews.south } })).status).toBe(400);
    const res = await foreman.post(`/api/requests/${filed.id}/schedule`).send({ version: 1, work: { task: 'overseed', plannedDate: '2026-05-26', plannedHours: 2, crewId: api.fixture.crews.north } });
    expect(res.status).toBe(200);
    const orderId = res.body.request.workOrderId as number;
    const [order] = await api.database.db.select().from(workOrders).where(eq(workOrders.id, orderId));
    expect(order).toMatchObject({ task: 'overseed', plannedDate: '2026-05-26', crewId: api.fixture.crews.north, status: 'assigned', origin: 'manual', pinned: true });
    expect(order!.details).toEqual({ requestId: filed.id });
    const crew = await api.signIn('crew');
    expect((await crew.post(`/api/work-orders/${orderId}/reports`).send({ status: 'done', actualHours: 2 })).status).toBe(201);
    expect((await requestRow(filed.id)).state).toBe('done');
    expect((await partner.get(`/api/requests/${filed.id}`)).body.request.state).toBe('done');
  });

  test('should schedule a done request again when its work order is reopened, and tell the partner', async () => {
    const partner = await api.signIn('partner');
    const foreman = await api.signIn('foreman');
    const filed = (await partner.post('/api/requests').send(wet({ kind: 'damaged_turf', description: 'Worn strip by the bench' }))).body.request;
    const res = await foreman.post(`/api/requests/${filed.id}/schedule`).send({ version: 1, work: { task: 'overseed', plannedDate: '2026-05-26', plannedHours: 1, crewId: api.fixture.crews.north } });
    const orderId = res.body.request.workOrderId as number;
    expect((await (await api.signIn('crew')).post(`/api/work-orders/${orderId}/reports`).send({ status: 'done', actualHours: 1 })).status).toBe(201);
    expect((await requestRow(filed.id)).state).toBe('done');

    const reopened = await foreman.post(`/api/work-orders/${orderId}/reopen`).send({ reason: 'Seed washed out' });
    expect(reopened.status).toBe(200);
    const row = await requestRow(filed.id);
    expect(row).toMatchObject({ state: 'scheduled', closedAt: null, workOrderId: orderId });
    expect((await partner.get(`/api/requests/${filed.id}`)).body.request.state).toBe('scheduled');
    const mail = await api.mail.waitFor((m) => m.to.includes(api.fixture.users.partner.email) && /Scheduled: your request/.test(m.subject) && m.text.includes('reopened'));
    expect(mail.text).toContain(`/requests?open=${filed.id}`);
    const audit = await api.database.db.select().from(auditLog).where(and(eq(auditLog.entity, 'field_request'), eq(auditLog.entityId, filed.id))).orderBy(auditLog.id);
    expect(audit.map((a) => (a.after as { state: string }).state)).toEqual(['requested', 'scheduled', 'done', 'scheduled']);

    // Logged done again, it is done again.
    expect((await (await api.signIn('crew')).post(`/api/work-orders/${orderId}/reports`).send({ status: 'done', actualHours: 1 })).status).toBe(201);
    expect((await requestRow(filed.id)).state).toBe('done');
  });

  test('should decline with the reason the partner reads, and let the foreman close a request', async () => {
    const partner = await api.signIn('partner');
    const foreman = await api.signIn('foreman');
    const a = (await partner.post('/api/requests').send(wet({ description: 'Puddle near the track' }))).body.request;
    expect((await foreman.post(`/api/requests/${a.id}/decline`).send({ version: 1, reason: '' })).status).toBe(400);
    expect((await foreman.post(`/api/requests/${a.id}/decline`).send({ version: 7, reason: 'The track is the school’s own' })).status).toBe(409);
    const declined = await foreman.post(`/api/requests/${a.id}/decline`).send({ version: 1, reason: 'The track is the school’s own' });
    expect(declined.status).toBe(200);
    expect(declined.body.request).toMatchObject({ state: 'declined', reason: 'The track is the school’s own' });
    expect((await mailTo(api.fixture.users.partner.email, /Declined: your request/)).text).toContain('Reason: The track is the school’s own');
    // A decided request is no longer the partner's to change.
    expect((await partner.patch(`/api/requests/${a.id}`).send({ version: 2, description: 'Please reconsider' })).body.error.code).toBe('field_request/not_open');

    const b = (await partner.post('/api/requests').send(wet({ description: 'Soft spot at midfield' }))).body.request;
    const closed = await foreman.post(`/api/requests/${b.id}/close`).send({ version: 1, note: 'Rolled and topdressed on the spot' });
    expect(closed.status).toBe(200);
    expect(closed.body.request.state).toBe('done');
    expect((await mailTo(api.fixture.users.partner.email, new RegExp(`Done: your request #${b.id}`))).text).toContain('Rolled and topdressed');
    // The south foreman cannot decide the north's requests.
    const c = (await partner.post('/api/requests').send(wet())).body.request;
    expect((await (await api.signIn('foremanSouth')).post(`/api/requests/${c.id}/close`).send({ version: 1 })).status).toBe(404);
    expect((await (await api.signIn('head')).post(`/api/requests/${c.id}/close`).send({ version: 1 })).status).toBe(403);
  });

  test('should store a photo from the partner who filed, refuse bad uploads, and show it to the foreman', async () => {
    const partner = await api.signIn('partner');
    const filed = (await partner.post('/api/requests').send(wet())).body.request;
    const res = await partner.post(`/api/requests/${filed.id}/photos`).attach('photo', await png(), { filename: '../../x.png', contentType: 'image/png' });
    expect(res.status).toBe(201);
    expect(res.body.photo).toMatchObject({ width: 400, height: 300, url: `/api/requests/${filed.id}/photos/${res.body.photo.id}` });
    const [row] = await api.database.db.select().from(fieldRequestPhotos).where(eq(fieldRequestPhotos.id, res.body.photo.id));
    expect(row!.fileName).toMatch(/^rq\d+-[0-9a-f]+\.jpg$/);
    const got = await (await api.signIn('foreman')).get(res.body.photo.url).buffer(true);
    expect(got.status).toBe(200);
    expect(got.headers['content-type']).toBe('image/jpeg');
    expect((await (await api.signInAs(otherSchool.email)).get(res.body.photo.url)).status).toBe(404);

    const bad = [
      [Buffer.from('just some text, not a picture'), 'note.jpg', 415, 'request_photo/not_an_image'],
      [await sharp({ create: { width: 20, height: 20, channels: 3, background: '#000' } }).gif().toBuffer(), 'a.gif', 415, 'request_photo/unsupported_format'],
      [Buffer.alloc(13 * 1024 * 1024, 1), 'huge.jpg', 413, 'request_photo/too_large'],
    ] as const;
    for (const [buffer, name, status, code] of bad) {
      const r = await partner.post(`/api/requests/${filed.id}/photos`).attach('photo', buffer, name);
      expect(r.status, name).toBe(status);
      expect(r.body.error.code, name).toBe(code);
    }
    const none = await partner.post(`/api/requests/${filed.id}/photos`).send({});
    expect(none.status).toBe(400);
    expect(none.body.error.code).toBe('request_photo/no_file');
    expect((await partner.get(`/api/requests/${filed.id}`)).body.photos).toHaveLength(1);
    expect((await supertest(api.app).get('/api/requests')).status).toBe(401);
  });
});
