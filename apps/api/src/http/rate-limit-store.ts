/**
 * An express-rate-limit store over the `rate_limits` table: the counters of sign-in and reset
 * attempts live in the database, so several API processes behind one database count the same
 * attempts (a memory store would give a guesser one allowance per process). Each count is one
 * statement, atomic on PostgreSQL and PGlite alike.
 */
import { and, eq, gt, lt, sql } from 'drizzle-orm';
import type { ClientRateLimitInfo, IncrementResponse, Options, Store } from 'express-rate-limit';
import type { Db } from '../db/client.ts';
import { rateLimits } from '../db/schema/index.ts';

export class DrizzleRateLimitStore implements Store {
  readonly localKeys = false;
  private windowMs = 60_000;

  /** @param prefix names the limit (keys of two limits never meet) */
  constructor(
    private readonly db: Db,
    readonly prefix: string,
  ) {}

  init(options: Options): void {
    this.windowMs = options.windowMs;
  }

  private key(key: string): string {
    return `${this.prefix}|${key}`;
  }

  async get(key: string): Promise<ClientRateLimitInfo | undefined> {
    const [row] = await this.db
      .select()
      .from(rateLimits)
      .where(and(eq(rateLimits.key, this.key(key)), gt(rateLimits.resetAt, new Date())));
    return row ? { totalHits: row.hits, resetTime: row.resetAt } : undefined;
  }

  /** One more hit; a window that has run out starts again at one. */
  async increment(key: string): Promise<IncrementResponse> {
    const now = new Date();
    const resetAt = new Date(now.getTime() + this.windowMs);
    const expired = sql`${rateLimits.resetAt} <= ${now.toISOString()}::timestamptz`;
    const [row] = await this.db
      .insert(rateLimits)
      .values({ key: this.key(key), hits: 1, resetAt })
      .onConflictDoUpdate({
        target: rateLimits.key,
        set: {
          hits: sql`case when ${expired} then 1 else ${rateLimits.hits} + 1 end`,
          resetAt: sql`case when ${expired} then excluded.reset_at else ${rateLimits.resetAt} end`,
        },
      })
      .returning({ hits: rateLimits.hits, resetAt: rateLimits.resetAt });
    return { totalHits: row!.hits, resetTime: row!.resetAt };
  }

  async decrement(key: string): Promise<void> {
    await this.db
      .update(rateLimits)
      .set({ hits: sql`greatest(${rateLimits.hits} - 1, 0)` })
      .where(eq(rateLimits.key, this.key(key)));
  }

  async resetKey(key: string): Promise<void> {
    await this.db.delete(rateLimits).where(eq(rateLimits.key, this.key(key)));
  }

  /** Removes counters whose window has ended; the server calls it now and then. */
  static async prune(db: Db): Promise<void> {
    await db.delete(rateLimits).where(lt(rateLimits.resetAt, new Date()));
  }
}
