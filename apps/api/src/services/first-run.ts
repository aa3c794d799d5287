/**
 * What a start does before serving: the demo city in demo mode, else the first
 * administrator of a new installation. Production never seeds demo accounts unless demo
 * mode is asked for (`--demo`, DEMO=true), never serves a database holding them outside
 * demo mode, and refuses to start with no way for anyone to sign in.
 */
import { and, eq, isNotNull, isNull, sql } from 'drizzle-orm';
import type { Logger } from 'pino';
import { z } from 'zod';
import { passwordSchema, PASSWORD_MIN_LENGTH, ROLE_LABELS, ROLES, type DemoAnnouncement } from '@swardwise/domain';
import type { Config } from '../config.ts';
import type { Db } from '../db/client.ts';
import { settings, users, userTokens } from '../db/schema/index.ts';
import { DEMO_CITY_NAME, DEMO_SIGN_INS } from '../db/seed/demo-city.ts';
import { DEMO_MARKER, hasDemoCity, seedDemoCity } from '../db/seed/index.ts';
import { StartupError } from '../startup-error.ts';
import { writeAudit } from './audit.ts';
import { hashPassword, newToken } from './users.ts';

export { StartupError };

/** How long the printed first-administrator link works. */
const SETUP_LINK_HOURS = 24;

export type FirstRunConfig = Pick<Config, 'production' | 'demo' | 'adminEmail' | 'adminPassword' | 'publicUrl'>;

/**
 * Seeds the demo city (demo mode), or makes sure someone can sign in (ADMIN_EMAIL with
 * ADMIN_PASSWORD, or ADMIN_EMAIL alone for a one-time setup link written by `print`,
 * never the log). Throws StartupError when production cannot start safely.
 */
export async function prepareInstallation(
  db: Db,
  config: FirstRunConfig,
  logger: Logger,
  print: (line: string) => void = (line) => process.stdout.write(`${line}\n`),
  /** The department's today (its clock), which the demo's season of work is laid around. */
  today?: string,
  /** The department's time zone (its clock), the zone of the demo's reported work. */
  timeZone?: string,
): Promise<void> {
  if (config.demo) {
    const seeded = await seedDemoCity(db, today, timeZone);
    if (seeded) logger.info(seeded, 'demo city seeded (invented data)');
  }
  const demoPresent = await hasDemoCity(db);
  if (config.demo && demoPresent) {
    logger.warn({ city: DEMO_CITY_NAME }, `DEMO MODE: serving the invented demo city of ${DEMO_CITY_NAME}; its sign-ins are published (README, sign-in page). Do not enter real data.`);
  } else if (config.demo) {
    logger.warn('demo mode was asked for, but this database already holds other data; the demo city is not added');
  } else if (demoPresent && config.production) {
    throw new StartupError(
      `This database holds the invented demo city, whose sign-ins are published. Start it in demo mode (npm start, or DEMO=true), or give production a new database (PGLITE_DIR or DATABASE_URL).`,
    );
  }

  const [usable] = await db.select({ n: sql<number>`count(*)::int` }).from(users).where(isNotNull(users.passwordHash));
  if (usable!.n > 0) {
    if (config.adminEmail || config.adminPassword) logger.info('ADMIN_EMAIL / ADMIN_PASSWORD are ignored: this installation already has accounts');
    return;
  }
  if (!config.adminEmail) {
    const message =
      'This is a new installation and nobody can sign in yet. Set ADMIN_EMAIL and ADMIN_PASSWORD ' +
      `(at least ${PASSWORD_MIN_LENGTH} characters) to create the first administrator, or ADMIN_EMAIL alone to be given a one-time setup link; ` +
      'or start the invented demo city with `npm start` (DEMO=true).';
    if (config.production) throw new StartupError(message);
    logger.warn(message);
    return;
  }
  await createFirstAdmin(db, config, logger, print);
}

async function createFirstAdmin(db: Db, config: FirstRunConfig, logger: Logger, print: (line: string) => void): Promise<void> {
  const email = z.string().trim().toLowerCase().pipe(z.email()).safeParse(config.adminEmail);
  if (!email.success) throw new StartupError(`ADMIN_EMAIL must be an e-mail address, got "${config.adminEmail}"`);
  let passwordHash: string | null = null;
  if (config.adminPassword !== undefined) {
    const password = passwordSchema.safeParse(config.adminPassword);
    if (!password.success) throw new StartupError(`ADMIN_PASSWORD: ${password.error.issues[0]?.message ?? 'not a usable password'}`);
    passwordHash = await hashPassword(password.data);
  }
  const setup = passwordHash ? null : newToken();
  await db.transaction(async (tx) => {
    const [existing] = await tx.select({ id: users.id }).from(users).where(eq(users.email, email.data));
    let id: number;
    if (existing) {
      // An administrator invited on an earlier start who never used the link: a new link (or the password) now.
      id = existing.id;
      await tx.update(users).set({ role: 'admin', active: true, passwordHash, districtId: null, crewId: null, updatedAt: new Date() }).where(eq(users.id, id));
    } else {
      const [created] = await tx.insert(users).values({ email: email.data, name: ROLE_LABELS.admin, role: 'admin', passwordHash }).returning({ id: users.id });
      id = created!.id;
      await writeAudit(tx, { actorId: null, action: 'create', entity: 'user', entityId: id, districtId: null, before: null, after: { email: email.data, role: 'admin', firstAdministrator: true } });
    }
    await tx.update(userTokens).set({ usedAt: new Date() }).where(and(eq(userTokens.userId, id), eq(userTokens.purpose, 'invite'), isNull(userTokens.usedAt)));
    if (setup) {
      await tx.insert(userTokens).values({ userId: id, purpose: 'invite', tokenHash: setup.tokenHash, expiresAt: new Date(Date.now() + SETUP_LINK_HOURS * 3600_000) });
    }
  });
  if (setup) {
    logger.info({ email: email.data }, `first administrator invited; the one-time setup link was written to standard output (valid ${SETUP_LINK_HOURS} hours)`);
    print(`\nSwardwise: set the first administrator's password (${email.data}) within ${SETUP_LINK_HOURS} hours at\n  ${config.publicUrl}/accept-invite?token=${setup.token}\n`);
  } else {
    logger.info({ email: email.data }, 'first administrator created from ADMIN_EMAIL / ADMIN_PASSWORD; remove ADMIN_PASSWORD from the environment');
  }
}

/** What the sign-in page shows in demo mode (null otherwise): the city is invented, and how to get in. */
export async function demoAnnouncement(db: Db, config: Pick<Config, 'demo'>): Promise<DemoAnnouncement | null> {
  if (!config.demo) return null;
  const [marker] = await db.select({ value: settings.value }).from(settings).where(eq(settings.key, DEMO_MARKER));
  if (!marker) return null;
  return {
    city: DEMO_CITY_NAME,
    note: String((marker.value as { note?: unknown }).note ?? ''),
    signIns: ROLES.map((role) => ({ role, label: ROLE_LABELS[role], ...DEMO_SIGN_INS[role] })),
  };
}
