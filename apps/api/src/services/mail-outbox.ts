/**
 * The head's view of the mail outbox: which invitations, resets and notices are waiting or
 * were given up, and sending a given-up one again. The message text never leaves the table
 * here: it holds sign-in links.
 */
import { appError, type MailOutboxAnswer, type MailOutboxRow, type MailState } from '@swardwise/domain';
import { desc, eq, sql } from 'drizzle-orm';
import { mailOutbox } from '../db/schema/index.ts';
import { writeAudit } from './audit.ts';
import { authorize, type Ctx } from './context.ts';

/** Rows listed at most: the newest; the counts cover all. */
export const OUTBOX_LIMIT = 200;

/** Every column but the message text. */
const visible = {
  id: mailOutbox.id,
  to: mailOutbox.to,
  subject: mailOutbox.subject,
  state: mailOutbox.status,
  attempts: mailOutbox.attempts,
  lastError: mailOutbox.lastError,
  nextAttemptAt: mailOutbox.nextAttemptAt,
  sentAt: mailOutbox.sentAt,
  createdAt: mailOutbox.createdAt,
};

export async function listOutbox(ctx: Ctx, smtpConfigured: boolean): Promise<MailOutboxAnswer<Date>> {
  authorize(ctx, 'read', 'MailOutbox');
  const items = await ctx.db.select(visible).from(mailOutbox).orderBy(desc(mailOutbox.id)).limit(OUTBOX_LIMIT);
  const counted = await ctx.db
    .select({ state: mailOutbox.status, n: sql<number>`count(*)::int` })
    .from(mailOutbox)
    .groupBy(mailOutbox.status);
  const counts: Record<MailState, number> = { queued: 0, sent: 0, failed: 0 };
  for (const c of counted) counts[c.state] = Number(c.n);
  return { items, counts, limit: OUTBOX_LIMIT, smtpConfigured };
}

/**
 * A given-up message queued again, due now, with a fresh round of attempts; its last error
 * stays until the next attempt. Only a failed one: a queued one is being tried already.
 */
export async function retryMail(ctx: Ctx, id: number): Promise<MailOutboxRow<Date>> {
  authorize(ctx, 'update', 'MailOutbox');
  return ctx.db.transaction(async (tx) => {
    const [before] = await tx.select(visible).from(mailOutbox).where(eq(mailOutbox.id, id)).for('update');
    if (!before) throw appError('mail/not_found', `No e-mail with id ${id} in the outbox`);
    if (before.state !== 'failed') throw appError('mail/not_failed', `This e-mail is ${before.state}, not failed: only a failed one can be sent again`);
    const [after] = await tx
      .update(mailOutbox)
      .set({ status: 'queued', attempts: 0, nextAttemptAt: sql`now()` })
      .where(eq(mailOutbox.id, id))
      .returning(visible);
    // Recipient, subject and state only: the text holds sign-in links.
    await writeAudit(tx, { actorId: ctx.actor.id, action: 'update', entity: 'mail_outbox', entityId: id, districtId: null, before, after: after! });
    return after!;
  });
}
