/** Installation settings kept in the database. */
import crypto from 'node:crypto';
import { eq, sql } from 'drizzle-orm';
import { errors, type UpdateDepartmentSettingsInput } from '@swardwise/domain';
import type { Db } from '../db/client.ts';
import { settings } from '../db/schema/index.ts';
import { writeAudit } from './audit.ts';
import { readTimeZoneSetting, TIME_ZONE_KEY, type DepartmentClock } from './clock.ts';
import { authorize, type Ctx } from './context.ts';

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

/** The department settings an administrator sees: the time zone, where it comes from and its version. */
export interface DepartmentSettings {
  timeZone: string;
  /** `setting` once an administrator has set it; `default` while DEPARTMENT_TIME_ZONE (or the demo city's zone) applies. */
  source: 'setting' | 'default';
  defaultTimeZone: string;
  version: number;
}

export async function getDepartmentSettings(ctx: Ctx, clock: DepartmentClock): Promise<DepartmentSettings> {
  authorize(ctx, 'manage', 'Settings');
  const stored = await readTimeZoneSetting(ctx.db);
  return stored?.valid
    ? { timeZone: stored.timeZone, source: 'setting', defaultTimeZone: clock.fallback, version: stored.version }
    : { timeZone: clock.timeZone, source: 'default', defaultTimeZone: clock.fallback, version: stored?.version ?? 1 };
}

/** Sets the department's time zone; the version must be the one read (else 409). Audited; this process uses it at once. */
export async function updateDepartmentSettings(ctx: Ctx, clock: DepartmentClock, input: UpdateDepartmentSettingsInput): Promise<DepartmentSettings> {
  authorize(ctx, 'manage', 'Settings');
  const after = await (ctx.db as Db).transaction(async (tx) => {
    const before = await readTimeZoneSetting(tx);
    const value = { timeZone: input.timeZone, version: input.version + 1 };
    // Unset reads as version 1; the conditional upsert makes two changes from the same version meet a 409.
    const [row] = await tx
      .insert(settings)
      .values({ key: TIME_ZONE_KEY, value })
      .onConflictDoUpdate({ target: settings.key, set: { value, updatedAt: new Date() }, setWhere: sql`coalesce((${settings.value}->>'version')::int, 1) = ${input.version}` })
      .returning();
    if (!row || (!before && input.version !== 1)) throw errors.versionConflict('settings');
    await writeAudit(tx, {
      actorId: ctx.actor.id,
      action: before ? 'update' : 'create',
      entity: 'settings',
      entityId: null,
      districtId: null,
      before: before ? { key: TIME_ZONE_KEY, timeZone: before.timeZone, version: before.version } : { key: TIME_ZONE_KEY, timeZone: clock.timeZone, version: 1 },
      after: { key: TIME_ZONE_KEY, ...value },
    });
    return value;
  });
  clock.use(after.timeZone);
  return { timeZone: after.timeZone, source: 'setting', defaultTimeZone: clock.fallback, version: after.version };
}
