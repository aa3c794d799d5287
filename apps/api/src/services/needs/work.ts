/**
 * The field page's planned against done: Records' tally (`getRecords`) narrowed to the field,
 * over the four weeks to the end of the week asked for. It uses the department's calendar,
 * never the week the weather falls back to, so it reads as the board and Records do.
 */
import { addDaysIso, mondayOf, type FieldNeeds, type MowingNeed, type RecordTally } from '@swardwise/domain';
import { can, type Ctx } from '../context.ts';
import { getRecords } from '../records.ts';
import type { NeedsBasis } from './basis.ts';

const WEEKS = 4;

export async function fieldWork(ctx: Ctx, b: NeedsBasis): Promise<{ compliance: FieldNeeds['level']['workCompliance']; plannedThisWeek: MowingNeed['plannedThisWeek'] }> {
  const weekStart = mondayOf(b.requested);
  const to = addDaysIso(weekStart, 6);
  const from = addDaysIso(weekStart, -7 * (WEEKS - 1));
  if (!can(ctx, 'read', 'WorkOrder', { districtId: b.field.districtId, siteId: b.field.siteId })) {
    return { compliance: { tracked: false, note: 'Work orders are outside what your role may read.', from, to, tally: null }, plannedThisWeek: null };
  }
  const records = await getRecords(ctx, { from, to }, ctx.clock.today(), b.field.id);
  const { fieldId: _f, fieldName: _n, siteName: _s, ...field } = records.byField[0] ?? { ...records.totals, fieldId: 0, fieldName: '', siteName: '' };
  const tally: RecordTally = field;
  const week = records.byWeek.find((w) => w.weekStart === weekStart);
  const note =
    tally.ordersDone + tally.ordersOpen + tally.ordersSkipped === 0
      ? `No work orders for this field from ${from} to ${to}.`
      : `From ${from} to ${to}: ${tally.ordersDone} of ${tally.ordersDone + tally.ordersOpen + tally.ordersSkipped} work orders done (${tally.ordersSkipped} skipped); mowings ${tally.mowingsDone} of ${tally.mowingsAsked} asked, ${tally.mowingsLate} late, ${tally.mowingsMissed} missed. The same figures as Records.`;
  return {
    compliance: { tracked: true, note, from, to, tally },
    plannedThisWeek: { weekStart, asked: week?.mowingsAsked ?? 0, done: week?.mowingsDone ?? 0 },
  };
}
