/** The audit log of every change. */
import type { Instant, Items } from './common.ts';

/** Row changes, and account events (entity `account`). */
export type AuditAction = 'create' | 'update' | 'delete' | 'sign_in' | 'sign_in_failed' | 'sign_out' | 'reset_requested';

/** A row of `GET /api/audit`: who changed what, with the row before and after. */
export interface AuditEntry<At extends Instant = string> {
  id: number;
  at: At;
  actorId: number | null;
  actorName: string | null;
  action: AuditAction;
  entity: string;
  entityId: number | null;
  districtId: number | null;
  before: Record<string, unknown> | null;
  after: Record<string, unknown> | null;
  /** The changed row's name as a person knows it ("North Meadow 1", "Mow on North Meadow 1, 2026-09-14"); null when none. */
  entityName: string | null;
  /** What changed, in words, with ids replaced by names. */
  changes: AuditChange[];
}

/** One attribute an entry changed: its name in words and its values before and after, as text. */
export interface AuditChange {
  attribute: string;
  label: string;
  before: string;
  after: string;
}

export type AuditList<At extends Instant = string> = Items<AuditEntry<At>>;
