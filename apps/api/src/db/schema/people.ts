/** Crews, users, their scopes and sessions. */
import { boolean, index, integer, jsonb, pgTable, primaryKey, real, text, timestamp, uniqueIndex } from 'drizzle-orm/pg-core';
import type { Role, UnitSystem, Weekday } from '@swardwise/domain';
import { districts, sites } from './city.ts';

export const crews = pgTable(
  'crews',
  {
    id: integer('id').primaryKey().generatedAlwaysAsIdentity(),
    districtId: integer('district_id')
      .notNull()
      .references(() => districts.id),
    name: text('name').notNull(),
    hoursPerDay: real('hours_per_day').notNull().default(8),
    members: jsonb('members').$type<string[]>().notNull().default([]),
    /** Working days of the week; the week plan puts the crew's work on these days only. */
    workDays: jsonb('work_days').$type<Weekday[]>().notNull().default(['mon', 'tue', 'wed', 'thu', 'fri']),
    version: integer('version').notNull().default(1),
    createdAt: timestamp('created_at', { withTimezone: true }).notNull().defaultNow(),
    updatedAt: timestamp('updated_at', { withTimezone: true }).notNull().defaultNow(),
  },
  (t) => [index('crews_district_idx').on(t.districtId)],
);

export const users = pgTable(
  'users',
  {
    id: integer('id').primaryKey().generatedAlwaysAsIdentity(),
    email: text('email').notNull(),
    name: text('name').notNull(),
    /** Null until an invited user sets a password. */
    passwordHash: text('password_hash'),
    role: text('role').$type<Role>().notNull(),
    districtId: integer('district_id').references(() => districts.id),
    crewId: integer('crew_id').references(() => crews.id),
    active: boolean('active').notNull().default(true),
    units: text('units').$type<UnitSystem>().notNull().default('imperial'),
    lastSignInAt: timestamp('last_sign_in_at', { withTimezone: true }),
    version: integer('version').notNull().default(1),
    createdAt: timestamp('created_at', { withTimezone: true }).notNull().defaultNow(),
    updatedAt: timestamp('updated_at', { withTimezone: true }).notNull().defaultNow(),
  },
  (t) => [uniqueIndex('users_email_key').on(t.email)],
);

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
    expiresAt: timestamp('expires_at', { withTimezone: true }).notNull(),
  },
  (t) => [index('sessions_user_idx').on(t.userId), index('sessions_expires_idx').on(t.expiresAt)],
);

/** One-time tokens (invitations, password resets); only a hash of the token is kept. */
export const userTokens = pgTable(
  'user_tokens',
  {
    id: integer('id').primaryKey().generatedAlwaysAsIdentity(),
    userId: integer('user_id')
      .notNull()
      .references(() => users.id, { onDelete: 'cascade' }),
    purpose: text('purpose').$type<'invite' | 'reset'>().notNull(),
    tokenHash: text('token_hash').notNull(),
    expiresAt: timestamp('expires_at', { withTimezone: true }).notNull(),
    usedAt: timestamp('used_at', { withTimezone: true }),
    createdAt: timestamp('created_at', { withTimezone: true }).notNull().defaultNow(),
  },
  (t) => [uniqueIndex('user_tokens_hash_key').on(t.tokenHash)],
);
