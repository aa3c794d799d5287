/**
 * Every e-mail goes through the `mail_outbox` table: `send` writes the row and returns, a
 * sender delivers it over SMTP. An SMTP outage therefore never fails or slows a request;
 * the row waits and is tried again with a growing delay, each attempt's error kept on it.
 *
 * A sender takes rows by moving their `next_attempt_at` past a lease (FOR UPDATE SKIP
 * LOCKED), so two processes over one PostgreSQL database never send the same row. A
 * process killed between the SMTP answer and the `sent` mark sends that one mail again
 * once the lease has passed: at least once, never lost.
 */
import { sql } from 'drizzle-orm';
import type { Logger } from 'pino';
import type { Db, Queryable } from '../db/client.ts';
import { mailOutbox } from '../db/schema/index.ts';
import type { BackgroundTasks } from '../services/background.ts';
import type { Mailer, OutgoingMail } from './mailer.ts';

export interface OutboxOptions {
  /** The delay after the first failed attempt; it doubles with each further one. */
  firstRetryMs?: number;
  /** The longest delay between two attempts. */
  maxRetryMs?: number;
  /** After this many failed attempts the row is marked failed and left alone. */
  maxAttempts?: number;
  /** How long a taken row is left to its sender before another may try it. */
  leaseMs?: number;
}

interface Claimed {
  id: number;
  to: string;
  subject: string;
  text: string;
  attempts: number;
}

const BATCH = 20;

export class MailOutbox implements Mailer {
  readonly enabled: boolean;
  private readonly options: Required<OutboxOptions>;
  private running: Promise<void> | null = null;
  private again = false;
  private timer: NodeJS.Timeout | null = null;

  constructor(
    private readonly db: Db,
    private readonly transport: Mailer,
    private readonly logger: Logger,
    private readonly background: BackgroundTasks,
    options: OutboxOptions = {},
  ) {
    this.enabled = transport.enabled;
    this.options = { firstRetryMs: 30_000, maxRetryMs: 3600_000, maxAttempts: 20, leaseMs: 300_000, ...options };
  }

  /** Queues the message (in the caller's transaction when one is given) and starts a delivery pass. */
  async send(mail: OutgoingMail, db: Queryable = this.db): Promise<boolean> {
    // With no SMTP configured nothing would ever deliver the row: the transport logs it instead.
    if (!this.enabled) return this.transport.send(mail);
    await db.insert(mailOutbox).values({ to: mail.to, subject: mail.subject, text: mail.text });
    this.background.run('mail outbox', () => this.flush());
    return true;
  }

  /** Delivers every row that is due; a pass already running is followed by one more. */
  flush(): Promise<void> {
    if (this.running) {
      this.again = true;
      return this.running;
    }
    this.running = (async () => {
      do {
        this.again = false;
        while ((await this.pass()) === BATCH);
      } while (this.again);
    })().finally(() => {
      this.running = null;
    });
    return this.running;
  }

  /** Tries the due rows every `intervalMs` (the retries of a running server). */
  start(intervalMs: number): void {
    this.stop();
    this.timer = setInterval(() => void this.flush().catch((err: unknown) => this.logger.warn({ err }, 'mail outbox pass failed')), intervalMs);
    this.timer.unref();
  }

  stop(): void {
    if (this.timer) clearInterval(this.timer);
    this.timer = null;
  }

  private async pass(): Promise<number> {
    const lease = `${Math.ceil(this.options.leaseMs / 1000)} seconds`;
    const claimed = (
      await this.db.execute<Record<string, unknown>>(sql`
        update mail_outbox set next_attempt_at = now() + ${lease}::interval, attempts = attempts + 1
        where id in (
          select id from mail_outbox where status = 'queued' and next_attempt_at <= now()
          order by id limit ${BATCH} for update skip locked
        )
        returning id, "to", subject, text, attempts`)
    ).rows as unknown as Claimed[];
    for (const row of claimed.sort((a, b) => a.id - b.id)) await this.deliverOne(row);
    return claimed.length;
  }

  private async deliverOne(row: Claimed): Promise<void> {
    const mail = { to: row.to, subject: row.subject, text: row.text };
    try {
      if (this.transport.deliver) await this.transport.deliver(mail);
      else if (!(await this.transport.send(mail))) throw new Error('the mailer did not send the message');
    } catch (err) {
      const error = err instanceof Error ? err.message : String(err);
      const last = row.attempts >= this.options.maxAttempts;
      const delayS = Math.min(this.options.maxRetryMs, this.options.firstRetryMs * 2 ** (row.attempts - 1)) / 1000;
      await this.db.execute(sql`
        update mail_outbox set last_error = ${error.slice(0, 500)},
          status = ${last ? 'failed' : 'queued'},
          next_attempt_at = now() + ${`${delayS} seconds`}::interval
        where id = ${row.id}`);
      this.logger.warn({ outboxId: row.id, attempts: row.attempts, error, gaveUp: last }, last ? 'e-mail given up after its last attempt' : 'e-mail not delivered; will retry');
      return;
    }
    await this.db.execute(sql`update mail_outbox set status = 'sent', sent_at = now(), last_error = null where id = ${row.id}`);
  }
}
