/** E-mail waiting to go out: written before any attempt, so an SMTP outage loses nothing. */
import { index, integer, pgTable, text } from 'drizzle-orm/pg-core';
import { createdAt, id, instant } from './columns.ts';

export const mailOutbox = pgTable(
  'mail_outbox',
  {
    ...id,
    to: text('to').notNull(),
    subject: text('subject').notNull(),
    text: text('text').notNull(),
    /** queued until delivered (sent) or given up after the last attempt (failed). */
    status: text('status').$type<'queued' | 'sent' | 'failed'>().notNull().default('queued'),
    attempts: integer('attempts').notNull().default(0),
    lastError: text('last_error'),
    /** Also the lease of a sender that took the row: no other sender touches it before then. */
    nextAttemptAt: instant('next_attempt_at').notNull().defaultNow(),
    sentAt: instant('sent_at'),
    ...createdAt,
  },
  (t) => [index('mail_outbox_due_idx').on(t.status, t.nextAttemptAt)],
);
