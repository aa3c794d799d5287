/**
 * The mail outbox as `GET /api/mail-outbox` answers it: who a message is for, its subject and
 * its delivery state. Never the message itself: invitations and password resets carry links
 * that sign someone in.
 */
export type MailState = 'queued' | 'sent' | 'failed';

export interface MailOutboxRow<D = string> {
  id: number;
  to: string;
  subject: string;
  state: MailState;
  attempts: number;
  /** The SMTP server's answer to the last failed attempt; null once delivered. */
  lastError: string | null;
  /** When the sender tries a queued message next (for a failed one, when it last gave up). */
  nextAttemptAt: D;
  sentAt: D | null;
  createdAt: D;
}

export interface MailOutboxAnswer<D = string> {
  /** The newest messages first, at most `limit`. */
  items: MailOutboxRow<D>[];
  /** Messages per state over the whole outbox. */
  counts: Record<MailState, number>;
  limit: number;
  /** False when no SMTP server is configured: messages are logged, not queued. */
  smtpConfigured: boolean;
}
