/** Accounts: who may sign in, with which role and scope. */
import crypto from 'node:crypto';
import { hash, verify } from '@node-rs/argon2';
import { and, asc, eq, gt, inArray, isNull, sql } from 'drizzle-orm';
import {
  appError,
  errors,
  asSubject,
  OWN_ACCOUNT_FIELDS,
  PERMISSION_FIELDS,
  scopeIssues,
  type Invitation,
  type InviteUserInput,
  type Role,
  type SessionUser,
  type UnitSystem,
  type UpdateUserInput,
  type UserRow as UserAnswerRow,
} from '@swardwise/domain';
import type { Db, Queryable } from '../db/client.ts';
import { crews, districts, sessions, sites, users, userSites, userTokens } from '../db/schema/index.ts';
import { writeAudit } from './audit.ts';
import { authorize, can, type Ctx } from './context.ts';
import { requireDistrict } from './districts.ts';

export { actorOf } from '@swardwise/domain';
export type { SessionUser };
export type UserRow = UserAnswerRow<Date>;

const INVITE_DAYS = 7;

export const hashPassword = (password: string) => hash(password);

const siteIdsOf = sql<number[]>`coalesce((select array_agg(us.site_id order by us.site_id) from user_sites us where us.user_id = ${users.id}), '{}')`;

const userColumns = {
  id: users.id,
  email: users.email,
  name: users.name,
  role: users.role,
  districtId: users.districtId,
  crewId: users.crewId,
  siteIds: siteIdsOf,
  units: users.units,
  version: users.version,
  active: users.active,
  lastSignInAt: users.lastSignInAt,
  createdAt: users.createdAt,
  districtName: sql<string | null>`${districts.name}`,
  crewName: sql<string | null>`${crews.name}`,
  pendingInvite: sql<boolean>`${users.passwordHash} is null`,
};

function selectUsers(db: Queryable) {
  return db
    .select(userColumns)
    .from(users)
    .leftJoin(districts, eq(districts.id, users.districtId))
    .leftJoin(crews, eq(crews.id, users.crewId));
}

function toSessionUser(row: UserRow): SessionUser {
  const { id, email, name, role, districtId, crewId, siteIds, units, version } = row;
  return { id, email, name, role, districtId, crewId, siteIds, units, version };
}

async function findUser(db: Queryable, id: number): Promise<UserRow | undefined> {
  const [row] = await selectUsers(db).where(eq(users.id, id));
  return row;
}

/** The active user behind a session, or undefined if the account is gone or deactivated. */
export async function sessionUser(db: Queryable, id: number): Promise<SessionUser | undefined> {
  const row = await findUser(db, id);
  return row && row.active && !row.pendingInvite ? toSessionUser(row) : undefined;
}

/**
 * Checks an e-mail and password. The same message for an unknown e-mail and a wrong
 * password, and a hash is verified either way so timing does not tell them apart. Only after
 * the right password is a deactivated account told so (403): it tells nothing to a guesser.
 */
export async function verifyCredentials(db: Queryable, email: string, password: string): Promise<SessionUser> {
  const [row] = await db.select({ id: users.id, hash: users.passwordHash, active: users.active }).from(users).where(eq(users.email, email));
  const ok = row?.hash ? await verify(row.hash, password) : (await verify(DUMMY_HASH, password), false);
  if (!row || !ok) throw errors.invalidCredentials();
  if (!row.active) throw errors.deactivated();
  await db.update(users).set({ lastSignInAt: new Date() }).where(eq(users.id, row.id));
  const user = await sessionUser(db, row.id);
  if (!user) throw errors.invalidCredentials();
  return user;
}

// A fixed hash to verify against when the e-mail is unknown (argon2id of a random string).
const DUMMY_HASH = '$argon2id$v=19$m=19456,t=2,p=1$O9WgI+1H3pTeuNZjFE6Ing$KioW9+jXs8Y58wBW7MlvbY1ViY59Fhr7zkBo3zlFOjk';

export async function listUsers(ctx: Ctx): Promise<UserRow[]> {
  authorize(ctx, 'read', 'User', { districtId: ctx.actor.districtId ?? -1, id: -1 });
  const rows = await selectUsers(ctx.db).orderBy(asc(users.role), asc(users.name));
  return rows.filter((row) => can(ctx, 'read', 'User', { id: row.id, districtId: row.districtId }));
}

/** Validates that a role's scope points at real rows and fits together (a crew lead's district is the crew's). */
async function resolveScope(db: Queryable, input: { role: Role; districtId?: number | null | undefined; crewId?: number | null | undefined; siteIds?: number[] | undefined }) {
  let districtId: number | null = null;
  let crewId: number | null = null;
  let siteIds: number[] = [];
  if (input.role === 'foreman') {
    districtId = (await requireDistrict(db, input.districtId!)).id;
  }
  if (input.role === 'crew') {
    const [c] = await db.select({ id: crews.id, districtId: crews.districtId }).from(crews).where(eq(crews.id, input.crewId!));
    if (!c) throw errors.noSuch('crew', 'body.crewId');
    crewId = c.id;
    districtId = c.districtId;
  }
  if (input.role === 'partner') {
    siteIds = [...new Set(input.siteIds ?? [])].sort((a, b) => a - b);
    const found = await db.select({ id: sites.id }).from(sites).where(inArray(sites.id, siteIds));
    if (found.length !== siteIds.length) {
      throw errors.invalid('One of the sites does not exist', [{ path: 'body.siteIds', message: 'unknown site' }]);
    }
  }
  return { districtId, crewId, siteIds };
}

async function replaceSites(db: Queryable, userId: number, siteIds: number[]) {
  await db.delete(userSites).where(eq(userSites.userId, userId));
  if (siteIds.length) await db.insert(userSites).values(siteIds.map((siteId) => ({ userId, siteId })));
}

const hashToken = (token: string) => crypto.createHash('sha256').update(token).digest('hex');

export function newToken() {
  const token = crypto.randomBytes(32).toString('base64url');
  return { token, tokenHash: hashToken(token) };
}

export async function inviteUser(ctx: Ctx, input: InviteUserInput, publicUrl: string): Promise<Invitation<Date>> {
  authorize(ctx, 'create', 'User');
  return (ctx.db as Db).transaction(async (tx) => {
    const [existing] = await tx.select({ id: users.id }).from(users).where(eq(users.email, input.email));
    if (existing) {
      throw appError('user/email_taken', `There is already an account for ${input.email}`, {
        issues: [{ path: 'body.email', message: 'already in use' }],
      });
    }
    const scope = await resolveScope(tx, input);
    const [created] = await tx
      .insert(users)
      .values({ email: input.email, name: input.name, role: input.role, districtId: scope.districtId, crewId: scope.crewId })
      .returning({ id: users.id });
    await replaceSites(tx, created!.id, scope.siteIds);
    const { token, tokenHash } = newToken();
    await tx.insert(userTokens).values({
      userId: created!.id,
      purpose: 'invite',
      tokenHash,
      expiresAt: new Date(Date.now() + INVITE_DAYS * 24 * 3600 * 1000),
    });
    const user = (await findUser(tx, created!.id))!;
    await writeAudit(tx, { actorId: ctx.actor.id, action: 'create', entity: 'user', entityId: user.id, districtId: user.districtId, before: null, after: user });
    await auditPermissions(tx, ctx.actor.id, undefined, user);
    return { user, inviteUrl: `${publicUrl}/accept-invite?token=${token}` };
  });
}

/** Marks a one-time token used and returns its user, or throws when it is unknown, used or expired. */
async function consumeToken(db: Queryable, token: string, purpose: 'invite' | 'reset'): Promise<number> {
  const [row] = await db
    .update(userTokens)
    .set({ usedAt: new Date() })
    .where(and(eq(userTokens.tokenHash, hashToken(token)), eq(userTokens.purpose, purpose), isNull(userTokens.usedAt), gt(userTokens.expiresAt, new Date())))
    .returning({ userId: userTokens.userId });
  if (!row) {
    throw appError(
      'auth/invalid_token',
      purpose === 'invite' ? 'This invitation link is not valid or has expired; ask for a new one' : 'This reset link is not valid or has expired; ask for a new one',
    );
  }
  return row.userId;
}

export async function acceptInvite(db: Queryable, token: string, password: string): Promise<SessionUser> {
  const passwordHash = await hashPassword(password);
  const userId = await consumeToken(db, token, 'invite');
  await db.update(users).set({ passwordHash, updatedAt: new Date(), version: sql`${users.version} + 1` }).where(eq(users.id, userId));
  await writeAudit(db, { actorId: userId, action: 'update', entity: 'user', entityId: userId, districtId: null, before: null, after: { invitationAccepted: true } });
  const user = await sessionUser(db, userId);
  if (!user) throw errors.deactivated();
  return user;
}

const RESET_MINUTES = 60;

/**
 * Starts a password reset for an active account with a password. Returns the link to
 * send, or null when there is no such account (the caller answers the same either way).
 * Only the newest link works: issuing one retires the account's earlier unused ones.
 */
export async function requestPasswordReset(db: Queryable, email: string, publicUrl: string): Promise<{ user: SessionUser; url: string } | null> {
  const [row] = await db.select({ id: users.id, hash: users.passwordHash, active: users.active }).from(users).where(eq(users.email, email));
  if (!row || !row.active || !row.hash) return null;
  const { token, tokenHash } = newToken();
  await (db as Db).transaction(async (tx) => {
    await tx
      .update(userTokens)
      .set({ usedAt: new Date() })
      .where(and(eq(userTokens.userId, row.id), eq(userTokens.purpose, 'reset'), isNull(userTokens.usedAt)));
    await tx.insert(userTokens).values({ userId: row.id, purpose: 'reset', tokenHash, expiresAt: new Date(Date.now() + RESET_MINUTES * 60_000) });
  });
  const user = await sessionUser(db, row.id);
  return user ? { user, url: `${publicUrl}/reset-password?token=${token}` } : null;
}

/** Sets a new password from a reset link and ends the account's other sessions. */
export async function resetPassword(db: Queryable, token: string, password: string): Promise<SessionUser> {
  const passwordHash = await hashPassword(password);
  const userId = await consumeToken(db, token, 'reset');
  await db.update(users).set({ passwordHash, updatedAt: new Date(), version: sql`${users.version} + 1` }).where(eq(users.id, userId));
  await db.delete(sessions).where(eq(sessions.userId, userId));
  await writeAudit(db, { actorId: userId, action: 'update', entity: 'user', entityId: userId, districtId: null, before: null, after: { passwordReset: true } });
  const user = await sessionUser(db, userId);
  if (!user) throw errors.deactivated();
  return user;
}

/** Role, scope and `active` of an account: what a permission-change audit entry records. */
function permissionsOf(row: UserRow | undefined) {
  return row ? { role: row.role, districtId: row.districtId, crewId: row.crewId, siteIds: row.siteIds, active: row.active } : null;
}

/** Writes a permission change (role, scope, active) as its own audit entry, when there is one. */
async function auditPermissions(db: Queryable, actorId: number, before: UserRow | undefined, after: UserRow) {
  const was = permissionsOf(before);
  const now = permissionsOf(after)!;
  if (was && JSON.stringify(was) === JSON.stringify(now)) return;
  await writeAudit(db, { actorId, action: was ? 'update' : 'create', entity: 'user_permissions', entityId: after.id, districtId: after.districtId, before: was, after: now });
}

const USER_ATTRIBUTES = [...OWN_ACCOUNT_FIELDS, ...PERMISSION_FIELDS] as const;

/**
 * Refuses (403) a change to an account that sends an attribute the caller may not change on
 * it: anyone's own name, units and password, but role, scope and `active` only an
 * administrator's. Called by the route before the body is read, and by the service again.
 */
export function checkUserAttributes(ctx: Ctx, row: { id: number; districtId?: number | null }, keys: readonly string[]): void {
  const subject = asSubject('User', { id: row.id, districtId: row.districtId ?? null });
  const refused = USER_ATTRIBUTES.filter((k) => keys.includes(k) && !ctx.ability.can('update', subject, k));
  if (!refused.length) return;
  throw appError(
    'user/forbidden_attribute',
    `Only an administrator may change the ${refused.map((k) => ATTRIBUTE_WORDS[k]).join(', ')} of an account`,
    { issues: refused.map((k) => ({ path: `body.${k}`, message: 'only an administrator may change this' })) },
  );
}

const ATTRIBUTE_WORDS: Record<(typeof USER_ATTRIBUTES)[number], string> = {
  name: 'name',
  units: 'units',
  password: 'password',
  role: 'role',
  districtId: 'district',
  crewId: 'crew',
  siteIds: 'sites',
  active: 'active state',
};

/** Why a session lost its user under the person's feet; the next request answers with it. */
export type SessionEnd = 'access_changed' | 'deactivated';

/** Signs the account out everywhere, leaving each session a note of why. */
async function endSessions(db: Queryable, userId: number, reason: SessionEnd) {
  await db
    .update(sessions)
    .set({ userId: null, data: sql`(${sessions.data} - 'userId') || jsonb_build_object('endedBecause', ${reason}::text)` })
    .where(eq(sessions.userId, userId));
}

export async function updateUser(ctx: Ctx, id: number, input: UpdateUserInput): Promise<UserRow> {
  return (ctx.db as Db).transaction(async (tx) => {
    const before = await findUser(tx, id);
    if (!before) throw errors.notFound('user', id);
    authorize({ ...ctx, db: tx }, 'update', 'User', { id, districtId: before.districtId });
    checkUserAttributes(ctx, before, Object.keys(input).filter((k) => input[k as keyof UpdateUserInput] !== undefined));
    const role = input.role ?? before.role;
    if (id === ctx.actor.id && (input.active === false || role !== before.role)) {
      throw appError('user/self_lockout', 'You cannot deactivate yourself or change your own role');
    }
    // With a role the scope is the one sent; without, what is not sent stays as it is.
    const wanted =
      input.role !== undefined
        ? { role, districtId: input.districtId, crewId: input.crewId, siteIds: input.siteIds }
        : {
            role,
            districtId: input.districtId !== undefined ? input.districtId : before.districtId,
            crewId: input.crewId !== undefined ? input.crewId : before.crewId,
            siteIds: input.siteIds ?? before.siteIds,
          };
    const missing = scopeIssues(wanted);
    if (missing.length) {
      throw errors.invalid(missing[0]!.message, missing.map((i) => ({ path: `body.${i.path}`, message: i.message })));
    }
    const scope = await resolveScope(tx, wanted);
    const [updated] = await tx
      .update(users)
      .set({
        name: input.name ?? before.name,
        units: input.units ?? before.units,
        role,
        districtId: scope.districtId,
        crewId: scope.crewId,
        active: input.active ?? before.active,
        version: sql`${users.version} + 1`,
        updatedAt: new Date(),
      })
      .where(and(eq(users.id, id), eq(users.version, input.version)))
      .returning({ id: users.id });
    if (!updated) throw errors.versionConflict('user');
    await replaceSites(tx, id, scope.siteIds);
    const after = (await findUser(tx, id))!;
    if (input.active === false || JSON.stringify(permissionsOf(before)) !== JSON.stringify(permissionsOf(after))) {
      // A deactivated or re-scoped user signs in again; the session is kept, without its user,
      // so the person's next request says why it ended (auth/access_changed) instead of "sign in".
      await endSessions(tx, id, input.active === false ? 'deactivated' : 'access_changed');
    }
    await writeAudit(tx, { actorId: ctx.actor.id, action: 'update', entity: 'user', entityId: id, districtId: after.districtId, before, after });
    await auditPermissions(tx, ctx.actor.id, before, after);
    return after;
  });
}

export async function updateProfile(ctx: Ctx, input: { version: number; name?: string | undefined; units?: UnitSystem | undefined }): Promise<SessionUser> {
  const id = ctx.actor.id;
  authorize(ctx, 'update', 'User', { id });
  const before = await findUser(ctx.db, id);
  if (!before) throw errors.notFound('user', id);
  const [updated] = await ctx.db
    .update(users)
    .set({ name: input.name ?? before.name, units: input.units ?? before.units, version: sql`${users.version} + 1`, updatedAt: new Date() })
    .where(and(eq(users.id, id), eq(users.version, input.version)))
    .returning({ id: users.id });
  if (!updated) throw errors.versionConflict('user');
  const after = (await findUser(ctx.db, id))!;
  await writeAudit(ctx.db, { actorId: id, action: 'update', entity: 'user', entityId: id, districtId: after.districtId, before, after });
  return toSessionUser(after);
}
