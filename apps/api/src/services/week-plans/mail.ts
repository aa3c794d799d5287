/** Mail of a confirmed week: one e-mail per crew lead, listing the crew's new work. */
import type { Queryable } from '../../db/client.ts';
import { notifyCrewsReport, type WorkMoveNotice, type WriteDeps } from '../work-orders.ts';
import { boardRows } from './load.ts';

/** Tells each crew lead about the orders (by id) newly assigned to the crew; reports who was e-mailed and why the others were not. */
export async function mailNewWork(db: Queryable, orderIds: number[], deps: WriteDeps, actorName: string) {
  const byCrew = new Map<number, WorkMoveNotice>();
  for (const row of await boardRows(db, orderIds)) {
    if (row.crewId === null) continue;
    const n = byCrew.get(row.crewId) ?? { crewId: row.crewId, kind: 'assigned', orders: [] };
    n.orders.push(row);
    byCrew.set(row.crewId, n);
  }
  return notifyCrewsReport(db, deps.mailer, [...byCrew.values()], actorName, deps.publicUrl);
}
