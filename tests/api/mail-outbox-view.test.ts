/**
 * The head's view of the mail outbox: queued and given-up e-mail with recipient, subject,
 * state, attempts and last error, never the message text (it holds sign-in links); a failed
 * message can be sent again now, which queues it and delivers it.
 */
import { eq } from 'drizzle-orm';
import { describe, expect, test } from 'vitest';
import { auditLog, mailOutbox } from '../../apps/api/src/db/schema/index.ts';
import { useTestApi } from '../support/app.ts';

const api = useTestApi();
const SECRET_LINK = 'http://portal.test/accept-invite?token=never-shown-0123456789';

async function addMail(values: Partial<typeof mailOutbox.$inferInsert>) {
  const [row] = await api.database.db
    .insert(mailOutbox)
    .values({ to: 'new.hire@test.example', subject: 'Your Swardwise invitation', text: `Open ${SECRET_LINK} to set your password.`, ...values })
    .returning();
  return row!;
}

describe('mail outbox', () => {
  test('should list queued and failed e-mail to the head without the message text', async () => {
    const failed = await addMail({ status: 'failed', attempts: 20, lastError: '550 mailbox unavailable' });
    const queued = await addMail({ to: 'reset.me@test.example', subject: 'Reset your password', attempts: 2, lastError: 'connection refused' });
    const head = await api.signIn('head');
    const res = await head.get('/api/mail-outbox');
    expect(res.status).toBe(200);
    expect(JSON.stringify(res.body)).not.toContain('never-shown');
    const byId = new Map((res.body.items as { id: number }[]).map((r) => [r.id, r]));
    expect(byId.get(failed.id)).toMatchObject({ to: 'new.hire@test.example', subject: 'Your Swardwise invitation', state: 'failed', attempts: 20, lastError: '550 mailbox unavailable' });
    expect(byId.get(queued.id)).toMatchObject({ state: 'queued', attempts: 2, lastError: 'connection refused' });
    expect(byId.get(failed.id)).not.toHaveProperty('text');
    expect(res.body.counts.failed).toBeGreaterThanOrEqual(1);
    expect(res.body.counts.queued).toBeGreaterThanOrEqual(1);
    // The newest first.
    expect(res.body.items[0].id).toBe(queued.id);
  });

  test('should refuse the outbox to a foreman, a crew lead and a partner', async () => {
    for (const role of ['foreman', 'crew', 'partner'] as const) {
      expect((await (await api.signIn(role)).get('/api/mail-outbox')).status, role).toBe(403);
    }
  });

  test('should send a failed e-mail again now and deliver it, audited without its text', async () => {
    const failed = await addMail({ to: 'again@test.example', status: 'failed', attempts: 20, lastError: 'timed out' });
    const head = await api.signIn('head');
    const res = await head.post(`/api/mail-outbox/${failed.id}/retry`);
    expect(res.status, JSON.stringify(res.body)).toBe(200);
    expect(res.body.mail).toMatchObject({ id: failed.id, state: 'queued', attempts: 0 });
    expect(JSON.stringify(res.body)).not.toContain('never-shown');
    await api.background.idle();
    const [row] = await api.database.db.select().from(mailOutbox).where(eq(mailOutbox.id, failed.id));
    expect(row).toMatchObject({ status: 'sent', lastError: null });
    expect(api.mail.messages().some((m) => m.to.includes('again@test.example'))).toBe(true);
    const [audit] = await api.database.db.select().from(auditLog).where(eq(auditLog.entity, 'mail_outbox'));
    expect(audit).toMatchObject({ entityId: failed.id, action: 'update' });
    expect(JSON.stringify(audit)).not.toContain('never-shown');
  });

  test('should refuse to send again one that is queued or sent, and say so', async () => {
    const queued = await addMail({ status: 'queued' });
    const head = await api.signIn('head');
    const res = await head.post(`/api/mail-outbox/${queued.id}/retry`);
    expect(res.status).toBe(409);
    expect(res.body.error.code).toBe('mail/not_failed');
    expect((await head.post('/api/mail-outbox/999999/retry')).status).toBe(404);
    expect((await head.post('/api/mail-outbox/abc/retry')).status).toBe(400);
  });
});
