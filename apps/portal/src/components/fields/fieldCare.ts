/**
 * The care of each field beside its row: last mowed, next mowing due, what is overdue and the
 * latest surface score. Every figure is the map answer's (`GET /api/map`), which the API works
 * out once per field with the engine's `mowingDue` and `fieldCheckDue`; the pages only show it.
 */
import type { FieldRow, Level, MapField } from '@swardwise/domain';
import { h } from 'vue';
import { columnHelper, labelled, type DataColumn } from '../data-table/features.ts';
import { emptyCell } from '../data-table/columns.ts';
import { DAY_MONTH, formatDay } from '../../utils/calendarDate.ts';

export type OverdueKey = 'mowing_check' | 'mowing' | 'check' | 'none';

export const OVERDUE_LABELS: Record<OverdueKey, string> = {
  mowing_check: 'Mowing and check',
  mowing: 'Mowing',
  check: 'Check',
  none: 'Nothing',
};

export interface FieldCareRow extends FieldRow {
  lastMowedOn: string | null;
  /** Next mowing due by the one mowing policy; null when not due by the day the map describes. */
  mowDueOn: string | null;
  mowWaitingForGrowth: boolean;
  mowOverdue: boolean;
  checkDueOn: string | null;
  checkOverdue: boolean;
  overdue: OverdueKey;
  score: number | null;
  scoredOn: string | null;
  /** The latest score against the level's target; unknown until the Standards are read. */
  target?: TargetKey;
}

/** A mowing is overdue when the grass has passed 1.5 × HOC or the policy's due day has gone by. */
export function mowingOverdue(m: Pick<MapField, 'overdue' | 'mowDueState'>): boolean {
  return m.overdue === true || m.mowDueState === 'overdue';
}

/** A field check is overdue past its level's interval, or when none is on record. */
export function checkOverdue(m: Pick<MapField, 'checkState'>): boolean {
  return m.checkState === 'overdue' || m.checkState === 'never';
}

/** The field rows with their care from the map answer (a field the map lacks gets blanks). */
export function withCare(rows: readonly FieldRow[], map: readonly MapField[]): FieldCareRow[] {
  const byId = new Map(map.map((m) => [m.id, m]));
  return rows.map((f) => {
    const m = byId.get(f.id);
    const mow = m ? mowingOverdue(m) : false;
    const check = m ? checkOverdue(m) : false;
    return {
      ...f,
      lastMowedOn: m?.lastMowedOn ?? null,
      mowDueOn: m?.mowDueOn ?? null,
      mowWaitingForGrowth: m?.mowWaitingForGrowth ?? false,
      mowOverdue: mow,
      checkDueOn: m?.checkDueOn ?? null,
      checkOverdue: check,
      overdue: mow && check ? 'mowing_check' : mow ? 'mowing' : check ? 'check' : 'none',
      score: m?.score ?? null,
      scoredOn: m?.scoredOn ?? null,
    };
  });
}

/** "Dec 2" in the department's calendar (ISO dates carry no time, so UTC formats them as written). */
export const shortDate = (iso: string) => formatDay(iso, DAY_MONTH);

const col = columnHelper<FieldCareRow>();

export type CareColumnKey = 'lastMowed' | 'mowDue' | 'overdue' | 'score' | 'checkDue';

/** The care columns; ISO dates sort as text, blanks last. */
export function careColumns(keys: CareColumnKey[]): DataColumn<FieldCareRow>[] {
  const all: Record<CareColumnKey, DataColumn<FieldCareRow>> = {
    lastMowed: col.accessor((r) => r.lastMowedOn ?? undefined, {
      id: 'lastMowed',
      header: 'Last mowed',
      sortUndefined: 'last',
      enableGlobalFilter: false,
      cell: (c) => (c.getValue() ? shortDate(c.getValue()!) : emptyCell()),
    }),
    mowDue: col.accessor((r) => r.mowDueOn ?? undefined, {
      id: 'mowDue',
      header: 'Mow due',
      sortUndefined: 'last',
      enableGlobalFilter: false,
      meta: { exportValue: (v: string | undefined) => v ?? null },
      cell: (c) => {
        const r = c.row.original;
        if (r.mowDueOn) return h('span', { class: r.mowOverdue ? 'sw-late' : undefined }, shortDate(r.mowDueOn));
        if (r.mowWaitingForGrowth) return h('span', { class: 'sw-muted' }, 'not growing');
        return r.lastMowedOn ? h('span', { class: 'sw-muted' }, 'not due') : emptyCell();
      },
    }),
    checkDue: col.accessor((r) => r.checkDueOn ?? undefined, {
      id: 'checkDue',
      header: 'Check due',
      sortUndefined: 'last',
      enableGlobalFilter: false,
      cell: (c) => {
        const r = c.row.original;
        if (!r.checkDueOn) return h('span', { class: 'sw-late' }, 'none yet');
        return h('span', { class: r.checkOverdue ? 'sw-late' : undefined }, shortDate(r.checkDueOn));
      },
    }),
    overdue: col.accessor('overdue', {
      id: 'overdue',
      header: 'Overdue',
      ...labelled(OVERDUE_LABELS),
      sortDescFirst: true,
      sortFn: (a: { original: FieldCareRow }, b: { original: FieldCareRow }) => overdueRank(a.original.overdue) - overdueRank(b.original.overdue),
      cell: (c) => (c.getValue() === 'none' ? emptyCell() : h('strong', { class: 'sw-late', 'data-test': 'overdue' }, OVERDUE_LABELS[c.getValue() as OverdueKey])),
    }),
    score: col.accessor((r) => r.score ?? undefined, {
      id: 'score',
      header: 'Score',
      sortUndefined: 'last',
      enableGlobalFilter: false,
      meta: { align: 'right' },
      cell: (c) => (c.getValue() === undefined ? emptyCell() : String(Math.round(c.getValue()!))),
    }),
  };
  return keys.map((k) => all[k]);
}

const overdueRank = (k: OverdueKey) => ({ mowing_check: 3, mowing: 2, check: 1, none: 0 })[k];

export type TargetKey = 'below' | 'met' | 'unscored';
export const TARGET_LABELS: Record<TargetKey, string> = { below: 'Below target', met: 'At or above', unscored: 'No check yet' };

/** Where a field's latest score stands against its level's target (Standards), as the overview counts it. */
export function targetOf(row: Pick<FieldCareRow, 'score' | 'maintenanceLevel'>, targets: Record<Level, number> | null): TargetKey | undefined {
  if (row.score === null) return 'unscored';
  if (!targets) return undefined;
  return row.score < targets[row.maintenanceLevel] ? 'below' : 'met';
}

/** The score against the level's target, filterable (`/fields?target=below`). */
export function targetColumn(): DataColumn<FieldCareRow> {
  return col.accessor((r) => r.target, {
    id: 'target',
    header: 'Target',
    sortUndefined: 'last',
    ...labelled(TARGET_LABELS),
    cell: (c) => {
      const v = c.getValue() as TargetKey | undefined;
      if (v === undefined) return emptyCell();
      return v === 'below' ? h('span', { class: 'sw-late' }, TARGET_LABELS.below) : h('span', { class: v === 'unscored' ? 'sw-muted' : undefined }, TARGET_LABELS[v]);
    },
  }) as DataColumn<FieldCareRow>;
}
