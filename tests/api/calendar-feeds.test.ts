import { eq } from 'drizzle-orm';
import ICAL from 'ical.js';
import supertest from 'supertest';
import { describe, expect, test } from 'vitest';
import { addDaysIso, localDateOf, localTimeOf } from '@swardwise/domain';
import { auditLog, calendarFeeds, fields, workOrders } from '../../apps/api/src/db/schema/index.ts';
import { giveWork } from '../support/fixture.ts';
import { useTestApi } from '../support/app.ts';

const api = useTestApi();
const today = () => api.clock.today();

interface Parsed {
  zone: string;
  events: ICAL.Event[];
}

/** Reads a feed back with ical.js, its time zone registered so instants come out right. */
function parseFeed(text: string): Parsed {
  const calendar = new ICAL.Component(ICAL.parse(text));
  const vtimezone = calendar.getFirstSubcomponent('vtimezone')!;
  const zone = new ICAL.Timezone(vtimezone);
  ICAL.TimezoneService.register(zone, zone.tzid);
  return { zone: zone.tzid, events: calendar.getAllSubcomponents('vevent').map((e) => new ICAL.Event(e)) };
}

const feedPath = (url: string) => new URL(url).pathname;
const anonymous = () => supertest(api.app);

async function fieldVersion(id: number) {
  const [row] = await api.database.db.select({ version: fields.version }).from(fields).where(eq(fields.id, id));
  return row!.version;
}

describe('calendar feeds', () => {
  test('should give a partner a private feed of his fields’ bookings, game-day work and closures in the department’s time zone', async () => {
    const { db } = api.database;
    const stadium = api.fixture.fields.northSchoolFootball;
    const partner = await api.signIn('partner');
    const foreman = await api.signIn('foreman');
    const game = addDaysIso(today(), 6);
    expect((await partner.post('/api/field-events').send({ fieldId: stadium, kind: 'game', title: 'Varsity v Rivals', startsOn: game, startTime: '18:30' })).status).toBe(201);
    expect((await partner.post('/api/field-events').send({ fieldId: stadium, kind: 'practice', title: 'Open practice', startsOn: addDaysIso(today(), 8) })).status).toBe(201);
    // Another school's booking never shows.
    const south = await api.signIn('foremanSouth');
    expect((await south.post('/api/field-events').send({ fieldId: api.fixture.fields.southBaseball, kind: 'game', title: 'South league final', startsOn: game })).status).toBe(201);
    // Lines before the game, a mowing on its day, a mowing on no game day and a feed (not shown to a partner).
    const lines = await giveWork(db, stadium, api.fixture.crews.north, 5);
    await db.update(workOrders).set({ task: 'paint_lines' }).where(eq(workOrders.id, lines));
    await giveWork(db, stadium, api.fixture.crews.north, 6);
    await giveWork(db, stadium, api.fixture.crews.north, 12);
    const feed = await giveWork(db, stadium, api.fixture.crews.north, 7);
    await db.update(workOrders).set({ task: 'feed' }).where(eq(workOrders.id, feed));
    const reopen = addDaysIso(today(), 4);
    const closed = await foreman
      .post(`/api/fields/${stadium}/closures`)
      .send({ status: 'closed', reason: 'lightning', note: 'Internal: radio 4 reported strikes', expectedReopenOn: reopen, version: await fieldVersion(stadium) });
    expect(closed.status).toBe(201);

    const made = await partner.post('/api/calendar-feeds').send({});
    expect(made.status).toBe(201);
    expect(made.body.url).toMatch(/^http:\/\/portal\.test\/api\/calendar\/[A-Za-z0-9_-]{43}\.ics$/);
    const token = feedPath(made.body.url).split('/').pop()!.replace('.ics', '');
    // Only a hash is stored, and the audit log never sees the secret.
    const stored = await db.select().from(calendarFeeds);
    expect(JSON.stringify(stored)).not.toContain(token);
    expect(JSON.stringify(await db.select().from(auditLog).where(eq(auditLog.entity, 'calendar_feed')).orderBy(auditLog.id))).not.toContain(token);

    const res = await anonymous().get(feedPath(made.body.url));
    expect(res.status).toBe(200);
    expect(res.headers['content-type']).toMatch(/^text\/calendar/);
    const { zone, events } = parseFeed(res.text);
    expect(zone).toBe(api.clock.timeZone);
    const bySummary = new Map(events.map((e) => [e.summary, e]));
    expect([...bySummary.keys()].sort()).toEqual(
      [
        'Varsity v Rivals (Stadium, Test High School)',
        'Open practice (Stadium, Test High School)',
        'Line painting: Stadium, Test High School',
        'Mowing: Stadium, Test High School',
        'Closed: Stadium, Test High School',
      ].sort(),
    );
    // The game at 18:30 local, in the department's zone, two hours long.
    const match = bySummary.get('Varsity v Rivals (Stadium, Test High School)')!;
    expect(match.startDate.zone.tzid).toBe(api.clock.timeZone);
    expect(res.text).toContain(`DTSTART;TZID=${api.clock.timeZone}:${game.replaceAll('-', '')}T183000`);
    expect(localDateOf(match.startDate.toJSDate(), api.clock.timeZone)).toBe(game);
    expect(localTimeOf(match.startDate.toJSDate(), api.clock.timeZone)).toBe('18:30');
    expect(match.endDate.toJSDate().getTime() - match.startDate.toJSDate().getTime()).toBe(2 * 3600_000);
    const practice = bySummary.get('Open practice (Stadium, Test High School)')!;
    expect(practice.startDate.isDate).toBe(true);
    expect(practice.startDate.toString()).toBe(addDaysIso(today(), 8));
    expect(bySummary.get('Line painting: Stadium, Test High School')!.startDate.toString()).toBe(addDaysIso(today(), 5));
    expect(bySummary.get('Mowing: Stadium, Test High School')!.startDate.toString()).toBe(game);
    // The closure runs from today up to the expected reopening (DTEND is exclusive), with the public reason and caution only.
    const closure = bySummary.get('Closed: Stadium, Test High School')!;
    expect(closure.startDate.isDate).toBe(true);
    expect(closure.startDate.toString()).toBe(today());
    expect(closure.endDate.toString()).toBe(reopen);
    expect(closure.description).toMatch(/30 minutes after the last thunder/);
    expect(closure.description).toContain(`Expected to reopen on ${reopen}`);
    expect(res.text).not.toContain('radio 4');
    expect(res.text).not.toContain('South league');
    await foreman.post(`/api/fields/${stadium}/reopen`).send({ version: closed.body.fieldVersion });

    // The list shows the working feed, never its address.
    const list = await partner.get('/api/calendar-feeds');
    expect(list.body.items).toEqual([{ kind: 'partner', crewId: null, name: 'Your fields', feed: { id: made.body.feed.id, createdAt: made.body.feed.createdAt } }]);
  });

  test('should revoke the old address when a new one is made, answer 404 for a revoked or unknown secret, and 400 for a malformed one', async () => {
    const partner = await api.signIn('partner');
    const first = await partner.post('/api/calendar-feeds').send({});
    const second = await partner.post('/api/calendar-feeds').send({});
    expect((await anonymous().get(feedPath(first.body.url))).status).toBe(404);
    expect((await anonymous().get(feedPath(second.body.url))).status).toBe(200);
    expect((await partner.delete(`/api/calendar-feeds/${second.body.feed.id}`)).status).toBe(204);
    const gone = await anonymous().get(feedPath(second.body.url));
    expect(gone.status).toBe(404);
    expect(gone.body.error.code).toBe('calendar_feed/not_found');
    expect((await partner.delete(`/api/calendar-feeds/${second.body.feed.id}`)).status).toBe(404);
    expect((await anonymous().get(`/api/calendar/${'A'.repeat(43)}.ics`)).status).toBe(404);
    expect((await anonymous().get('/api/calendar/short.ics')).status).toBe(400);
    expect((await partner.get('/api/calendar-feeds')).body.items[0].feed).toBeNull();
    expect((await partner.post('/api/calendar-feeds').send({ extra: 1 })).status).toBe(400);
  });

  test('should give a foreman one feed per crew of his district and refuse everyone else', async () => {
    const { db } = api.database;
    const foreman = await api.signIn('foreman');
    const list = await foreman.get('/api/calendar-feeds');
    expect(list.body.items).toEqual([{ kind: 'crew', crewId: api.fixture.crews.north, name: 'North Crew', feed: null }]);
    expect((await foreman.post('/api/calendar-feeds').send({ crewId: api.fixture.crews.south })).status).toBe(403);
    expect((await foreman.post('/api/calendar-feeds').send({})).status).toBe(403);
    expect((await foreman.post('/api/calendar-feeds').send({ crewId: 999_999 })).status).toBe(400);
    for (const who of ['crew', 'head'] as const) {
      const agent = await api.signIn(who);
      expect((await agent.post('/api/calendar-feeds').send({ crewId: api.fixture.crews.north })).status, who).toBe(403);
    }
    const made = await foreman.post('/api/calendar-feeds').send({ crewId: api.fixture.crews.north });
    expect(made.status).toBe(201);
    // A partner cannot revoke a crew's feed; the south foreman cannot either.
    expect((await (await api.signIn('partner')).delete(`/api/calendar-feeds/${made.body.feed.id}`)).status).toBe(403);
    expect((await (await api.signIn('foremanSouth')).delete(`/api/calendar-feeds/${made.body.feed.id}`)).status).toBe(403);

    const order = await giveWork(db, api.fixture.fields.northSoccer, api.fixture.crews.north, 9);
    await db.update(workOrders).set({ task: 'aerate' }).where(eq(workOrders.id, order));
    await giveWork(db, api.fixture.fields.southBaseball, api.fixture.crews.south, 9);
    const res = await anonymous().get(feedPath(made.body.url));
    expect(res.status).toBe(200);
    const { events } = parseFeed(res.text);
    const aerate = events.find((e) => e.summary === 'Aerate: Soccer 1, Test Park North');
    expect(aerate?.startDate.toString()).toBe(addDaysIso(today(), 9));
    expect(events.some((e) => e.summary.includes('Diamond'))).toBe(false);
    expect((await foreman.get('/api/calendar-feeds')).body.items[0].feed.id).toBe(made.body.feed.id);
  });
});
