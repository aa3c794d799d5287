/** Crews, users, their scopes and sessions. */
import { boolean, index, integer, jsonb, pgTable, primaryKey, real, text, uniqueIndex } from 'drizzle-orm/pg-core';
import type { Role, UnitSystem, Weekday } from '@swardwise/domain';
import { districtRef, districts, sites } from './city.ts';
import { createdAt, id, instant, versioned } from './columns.ts';

export const crews = pgTable(
  'crews',
  {
    ...id,
    ...districtRef,
    name: text('name').notNull(),
    hoursPerDay: real('hours_per_day').notNull().default(8),
    members: jsonb('members').$type<string[]>().notNull().default([]),
    /** Working days of the week; the week plan puts the crew's work on these days only. */
    workDays: jsonb('work_days').$type<Weekday[]>().notNull().default(['mon', 'tue', 'wed', 'thu', 'fri']),
    ...versioned,
  },
  (t) => [index('crews_district_idx').on(t.districtId)],
);

export const users = pgTable(
  'users',
  {
    ...id,
    email: text('email').notNull(),
    name: text('name').notNull(),
    /** Null until an invited user sets a password. */
    passwordHash: text('password_hash'),
    role: text('role').$type<Role>().notNull(),
    districtId: integer('district_id').references(() => districts.id),
    crewId: integer('crew_id').references(() => crews.id),
    active: boolean('active').notNull().default(true),
    units: text('units').$type<UnitSystem>().notNull().default('imperial'),
    lastSignInAt: instant('last_sign_in_at'),
    ...versioned,
  },
  (t) => [uniqueIndex('users_email_key').on(t.email)],
);

/** Who wrote the row. */
export const createdBy = { createdBy: integer('created_by').references(() => users.id) };

/** A photo stored in the uploads folder: re-encoded here, its metadata dropped, its name made here. */
export const storedPhoto = {
  /** File name inside the uploads folder (never a client-supplied path). */
  fileName: text('file_name').notNull(),
  mime: text('mime').notNull(),
  width: integer('width').notNull(),
  height: integer('height').notNull(),
  bytes: integer('bytes').notNull(),
  ...createdBy,
  ...createdAt,
};

/** The sites a partner (school athletic director, league contact) is linked to. */
export const userSites = pgTable(
  'user_sites',
  {
    userId: integer('user_id')
      .notNull()
      .references(() => users.id, { onDelete: 'cascade' }),
    siteId: integer('site_id')
      .notNull()
      .references(() => sites.id, { onDelete: 'cascade' }),
  },
  (t) => [primaryKey({ columns: [t.userId, t.siteId] })],
);

/** Server-side sessions behind the httpOnly cookie (express-session store). */
export const sessions = pgTable(
  'sessions',
  {
    sid: text('sid').primaryKey(),
    userId: integer('user_id').references(() => users.id, { onDelete: 'cascade' }),
    data: jsonb('data').$type<Record<string, unknown>>().notNull(),
    expiresAt: instant('expires_at').notNull(),
  },
  (t) => [index('sessions_user_idx').on(t.userId), index('sessions_expires_idx').on(t.expiresAt)],
);

/**
 * Sign-in and reset attempt counters (`http/rate-limit-store.ts`), kept in the database so
 * that every API process behind one database counts the same attempts.
 */
export const rateLimits = pgTable(
  'rate_limits',
  {
    key: text('key').primaryKey(),
    hits: integer('hits').notNull(),
    resetAt: instant('reset_at').notNull(),
  },
  (t) => [index('rate_limits_reset_idx').on(t.resetAt)],
);

/** One-time tokens (invitations, password resets); only a hash of the token is kept. */
export const userTokens = pgTable(
  'user_tokens',
  {
    ...id,
    userId: integer('user_id')
      .notNull()
      .references(() => users.id, { onDelete: 'cascade' }),
    purpose: text('purpose').$type<'invite' | 'reset'>().notNull(),
    tokenHash: text('token_hash').notNull(),
    expiresAt: instant('expires_at').notNull(),
    usedAt: instant('used_at'),
    ...createdAt,
  },
  (t) => [uniqueIndex('user_tokens_hash_key').on(t.tokenHash)],
);

/**
 * Private calendar feeds: a partner's own (bookings, game-day work and closures of his fields)
 * or a crew's, made by its foreman. Only a hash of the secret is kept; making a new one for the
 * same owner revokes the old, so a leaked address stops working.
 */
export const calendarFeeds = pgTable(
  'calendar_feeds',
  {
    ...id,
    kind: text('kind').$type<'partner' | 'crew'>().notNull(),
    /** The partner whose feed it is (kind partner). */
    userId: integer('user_id').references(() => users.id, { onDelete: 'cascade' }),
    /** The crew whose work it shows (kind crew), with its district for scope. */
    crewId: integer('crew_id').references(() => crews.id, { onDelete: 'cascade' }),
    districtId: integer('district_id').references(() => districts.id, { onDelete: 'cascade' }),
    tokenHash: text('token_hash').notNull(),
    createdBy: integer('created_by').references(() => users.id, { onDelete: 'set null' }),
    revokedAt: instant('revoked_at'),
    ...createdAt,
  },
  (t) => [
    uniqueIndex('calendar_feeds_hash_key').on(t.tokenHash),
    index('calendar_feeds_user_idx').on(t.userId),
    index('calendar_feeds_crew_idx').on(t.crewId),
  ],
);
