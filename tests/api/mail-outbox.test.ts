/**
 * E-mail through the outbox: with the SMTP server refusing, the API answers as usual and the
 * messages wait in `mail_outbox` with the error of each attempt; once the server accepts,
 * each is delivered exactly once.
 */
import type { AddressInfo } from 'node:net';
import { asc, eq, sql } from 'drizzle-orm';
import { pino } from 'pino';
import { SMTPServer } from 'smtp-server';
import supertest from 'supertest';
import { afterAll, beforeAll, describe, expect, test } from 'vitest';
import { mailOutbox } from '../../apps/api/src/db/schema/index.ts';
import { createMailer } from '../../apps/api/src/mail/mailer.ts';
import { useTestApi } from '../support/app.ts';

const api = useTestApi();

/** An SMTP server that refuses every connection while `refusing` is set, and counts what it accepts. */
let refusing = true;
const delivered: string[] = [];
let smtp: SMTPServer;
let port = 0;
beforeAll(async () => {
  smtp = new SMTPServer({
    authOptional: true,
    disabledCommands: ['STARTTLS'],
    logger: false,
    onConnect(_session, callback) {
      if (refusing) return callback(Object.assign(new Error('Service not available, try later'), { responseCode: 421 }));
      callback();
    },
    onData(stream, session, callback) {
      stream.resume();
      stream.on('end', () => {
        delivered.push(...session.envelope.rcptTo.map((r) => r.address));
        callback();
      });
    },
  });
  await new Promise<void>((resolve) => smtp.listen(0, '127.0.0.1', () => resolve()));
  port = (smtp.server.address() as AddressInfo).port;
});
afterAll(() => new Promise<void>((resolve) => smtp.close(() => resolve())));

const flakyMailer = () => createMailer({ host: '127.0.0.1', port, secure: false, ignoreTLS: true, from: 'test@swardwise.example' }, pino({ level: 'silent' }));
const rowsTo = (address: string) => api.database.db.select().from(mailOutbox).where(eq(mailOutbox.to, address)).orderBy(asc(mailOutbox.id));

describe('mail outbox', () => {
  test('should answer while SMTP is down, keep the mail queued with its error, and deliver it exactly once when SMTP is back', async () => {
    const { app, background, outbox } = api.makeApp({}, { mailer: flakyMailer(), outbox: { firstRetryMs: 60_000 } });
    const admin = await api.signIn('admin', app);
    const invite = await admin.post('/api/users').send({ email: 'queued.person@test.example', name: 'Queued Person', role: 'head' });
    expect(invite.status).toBe(201);
    const reset = await supertest(app).post('/api/auth/forgot-password').send({ email: api.fixture.users.head.email });
    expect(reset.status).toBe(202);
    await background.idle();

    const [queued] = await rowsTo('queued.person@test.example');
    expect(queued).toMatchObject({ status: 'queued', attempts: 1, sentAt: null });
    expect(queued!.lastError).toMatch(/421|not available/i);
    // The next attempt waits out the backoff: a pass now tries nothing.
    expect(queued!.nextAttemptAt.getTime()).toBeGreaterThan(Date.now() + 50_000);
    await outbox.flush();
    expect((await rowsTo('queued.person@test.example'))[0]!.attempts).toBe(1);
    expect(delivered).toEqual([]);

    refusing = false;
    await api.database.db.update(mailOutbox).set({ nextAttemptAt: sql`now()` }).where(eq(mailOutbox.status, 'queued'));
    await Promise.all([outbox.flush(), outbox.flush()]);
    await outbox.flush();
    expect(delivered.sort()).toEqual([api.fixture.users.head.email, 'queued.person@test.example'].sort());
    const [sent] = await rowsTo('queued.person@test.example');
    expect(sent).toMatchObject({ status: 'sent', attempts: 2, lastError: null });
    expect(sent!.sentAt).toBeInstanceOf(Date);
  });

  test('should give a message up after its last attempt and keep the reason', async () => {
    refusing = true;
    const { app, background, outbox } = api.makeApp({}, { mailer: flakyMailer(), outbox: { firstRetryMs: 0, maxAttempts: 2 } });
    const admin = await api.signIn('admin', app);
    expect((await admin.post('/api/users').send({ email: 'given.up@test.example', name: 'Given Up', role: 'head' })).status).toBe(201);
    await background.idle();
    await outbox.flush();
    const [row] = await rowsTo('given.up@test.example');
    expect(row).toMatchObject({ status: 'failed', attempts: 2 });
    expect(row!.lastError).toMatch(/421|not available/i);
    await outbox.flush();
    expect((await rowsTo('given.up@test.example'))[0]!.attempts).toBe(2);
  });
});
