/** Installation settings kept in the database. */
import crypto from 'node:crypto';
import { eq } from 'drizzle-orm';
import type { Db } from '../db/client.ts';
import { settings } from '../db/schema/index.ts';

/** The cookie-signing secret: from SESSION_SECRET, else generated once and kept in the database. */
export async function sessionSecretFor(db: Db, configured: string | undefined): Promise<string> {
  if (configured) return configured;
  const [row] = await db.select().from(settings).where(eq(settings.key, 'session_secret'));
  if (row) return row.value as string;
  const secret = crypto.randomBytes(32).toString('hex');
  await db.insert(settings).values({ key: 'session_secret', value: secret }).onConflictDoNothing();
  const [saved] = await db.select().from(settings).where(eq(settings.key, 'session_secret'));
  return saved!.value as string;
}
