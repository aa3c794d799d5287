/** The audit log of every change. */
import type { Instant, Items } from './common.ts';

/** A row of `GET /api/audit`: who changed what, with the row before and after. */
export interface AuditEntry<At extends Instant = string> {
  id: number;
  at: At;
  actorId: number | null;
  actorName: string | null;
  action: 'create' | 'update' | 'delete';
  entity: string;
  entityId: number | null;
  districtId: number | null;
  before: Record<string, unknown> | null;
  after: Record<string, unknown> | null;
}

export type AuditList<At extends Instant = string> = Items<AuditEntry<At>>;
