/**
 * A district's "today" and "late" at a glance: the work due today, the work left undone from
 * earlier days, the fields whose mowing or field check is overdue, the checks falling due and
 * the fields closed or restricted. Figures come from the work orders and the map answer's care
 * of each field (`fieldCare.ts`), the same ones the board and the fields list show.
 */
import type { WorkOrderRow } from '@swardwise/domain';
import type { FieldCareRow } from '../fields/fieldCare.ts';

export interface DistrictAgenda {
  /** Orders planned for today not yet done or skipped. */
  dueToday: WorkOrderRow[];
  /** Orders planned before today still open (planned, assigned or started). */
  lateWork: WorkOrderRow[];
  mowingOverdue: FieldCareRow[];
  checksOverdue: FieldCareRow[];
  /** Checks falling due today. */
  checksDue: FieldCareRow[];
  closures: FieldCareRow[];
}

const open = (o: WorkOrderRow) => o.status !== 'done' && o.status !== 'skipped';
const byName = (a: FieldCareRow, b: FieldCareRow) => a.siteName.localeCompare(b.siteName) || a.name.localeCompare(b.name);

/** `today` is the department's local date. Retired fields ask for no care. */
export function districtAgenda(fields: readonly FieldCareRow[], orders: readonly WorkOrderRow[], today: string): DistrictAgenda {
  const kept = fields.filter((f) => f.status !== 'retired');
  return {
    dueToday: orders.filter((o) => o.plannedDate === today && open(o)),
    lateWork: orders.filter((o) => o.plannedDate < today && open(o)).sort((a, b) => (a.plannedDate < b.plannedDate ? -1 : a.plannedDate > b.plannedDate ? 1 : a.id - b.id)),
    mowingOverdue: kept.filter((f) => f.status !== 'closed' && f.mowOverdue).sort((a, b) => (a.mowDueOn ?? '').localeCompare(b.mowDueOn ?? '') || byName(a, b)),
    checksOverdue: kept.filter((f) => f.checkOverdue).sort((a, b) => (a.checkDueOn ?? '').localeCompare(b.checkDueOn ?? '') || byName(a, b)),
    checksDue: kept.filter((f) => f.checkDueOn === today).sort(byName),
    closures: fields.filter((f) => f.status === 'closed' || f.status === 'restricted').sort(byName),
  };
}
