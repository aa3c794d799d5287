/**
 * Columns most tables have, written once. Drizzle builds each table from these builders, so
 * one object may be spread into several tables.
 */
import { integer, timestamp } from 'drizzle-orm/pg-core';

/** A point in time with its zone, as every `…_at` column is stored. */
export const instant = (name: string) => timestamp(name, { withTimezone: true });

/** The identity key. */
export const id = { id: integer('id').primaryKey().generatedAlwaysAsIdentity() };

/** When the row was written. */
export const createdAt = { createdAt: instant('created_at').notNull().defaultNow() };

/** When the row last changed. */
export const updatedAt = { updatedAt: instant('updated_at').notNull().defaultNow() };

/** A row people edit: the version a write must name (a stale one is refused) and its times. */
export const versioned = {
  version: integer('version').notNull().default(1),
  ...createdAt,
  ...updatedAt,
};
