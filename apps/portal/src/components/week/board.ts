/**
 * The week board's arithmetic, kept out of components so it runs once per change of the
 * orders or filters (not once per render) and can be tested without a DOM.
 */
import { addDaysIso, CAUTIONS, weekdayOf, type CautionKey, type CrewDay, type WeekBoard, type WorkOrderRow, type WorkTask } from '@swardwise/domain';
import { crewHoursText } from '../../utils/units.ts';

/** Row key of the orders no crew has yet. */
const UNASSIGNED = 'none';

export type CellKey = string;

/** The drag payload type: only the board's own cards can be dropped on a cell. */
export const DRAG_TYPE = 'application/x-swardwise-order';

export function cellKey(crewId: number | null, date: string): CellKey {
  return `${crewId ?? UNASSIGNED}|${date}`;
}

export interface BoardFilter {
  siteIds: readonly number[];
  tasks: readonly WorkTask[];
}

function matchesFilter(order: WorkOrderRow, filter: BoardFilter): boolean {
  // A yard job is at no site: a site filter leaves it out.
  if (filter.siteIds.length && (order.siteId === null || !filter.siteIds.includes(order.siteId))) return false;
  if (filter.tasks.length && !filter.tasks.includes(order.task)) return false;
  return true;
}

/** Crew-days by cell key. */
export function crewDayMap(crewDays: readonly CrewDay[]): Map<CellKey, CrewDay> {
  return new Map(crewDays.map((d) => [cellKey(d.crewId, d.date), d]));
}

function sameItems<T>(a: readonly T[] | undefined, b: readonly T[]): boolean {
  if (!a || a.length !== b.length) return false;
  for (let i = 0; i < a.length; i++) if (a[i] !== b[i]) return false;
  return true;
}

/**
 * The orders of each crew-day cell (plus the unassigned row), in the day's route order where
 * the plan has one, else by site and field. A cell whose orders did not change keeps the
 * array it had in `previous`, so only the cells a change touched render again.
 */
export function groupCells(
  orders: readonly WorkOrderRow[],
  crewDays: ReadonlyMap<CellKey, CrewDay>,
  filter: BoardFilter,
  previous?: ReadonlyMap<CellKey, WorkOrderRow[]>,
): Map<CellKey, WorkOrderRow[]> {
  const cells = new Map<CellKey, WorkOrderRow[]>();
  for (const order of orders) {
    if (!matchesFilter(order, filter)) continue;
    const key = cellKey(order.crewId, order.plannedDate);
    const list = cells.get(key);
    if (list) list.push(order);
    else cells.set(key, [order]);
  }
  for (const [key, list] of cells) {
    const rank = new Map(crewDays.get(key)?.orderIds.map((id, i) => [id, i]));
    list.sort(
      (a, b) =>
        (rank.get(a.id) ?? Number.MAX_SAFE_INTEGER) - (rank.get(b.id) ?? Number.MAX_SAFE_INTEGER) ||
        a.siteName.localeCompare(b.siteName) ||
        a.fieldName.localeCompare(b.fieldName) ||
        a.id - b.id,
    );
    const before = previous?.get(key);
    if (before && sameItems(before, list)) cells.set(key, before);
  }
  return cells;
}

export interface LoadBar {
  /** Widths in percent of the bar, work, drive and load/unload, in that order. */
  work: number;
  drive: number;
  loadUnload: number;
  /** Where the available hours end on the bar, in percent. */
  availableAt: number;
  totalHours: number;
  availableHours: number;
  overloaded: boolean;
  /** Total as a share of the available hours, in percent (rounded). */
  percent: number;
}

/**
 * A crew-day's bar: the bar spans the larger of the available and the total hours, so an
 * overloaded day shows how far past the line it runs.
 */
export function loadBar(day: Pick<CrewDay, 'workHours' | 'driveHours' | 'loadUnloadHours' | 'availableHours'>): LoadBar {
  const total = day.workHours + day.driveHours + day.loadUnloadHours;
  const span = Math.max(total, day.availableHours, 1e-9);
  const pct = (h: number) => (h / span) * 100;
  return {
    work: pct(day.workHours),
    drive: pct(day.driveHours),
    loadUnload: pct(day.loadUnloadHours),
    availableAt: pct(day.availableHours),
    totalHours: total,
    availableHours: day.availableHours,
    // A few minutes of rounding is not an overload.
    overloaded: total > day.availableHours + 0.01,
    percent: day.availableHours > 0 ? Math.round((total / day.availableHours) * 100) : total > 0 ? Infinity : 0,
  };
}

/** Hours of the cell's orders; used where the plan has no crew-day (the unassigned row, a moved card). */
export function sumHours(orders: readonly WorkOrderRow[]): number {
  return orders.reduce((s, o) => s + o.plannedHours, 0);
}

/** Crew hours as h:mm ("1:30 h"), the way a crew reads time. */
export function formatHours(h: number): string {
  return crewHoursText(h);
}

const SHORT_DAY: Record<string, string> = { mon: 'Mon', tue: 'Tue', wed: 'Wed', thu: 'Thu', fri: 'Fri', sat: 'Sat', sun: 'Sun' };

/** "Mon 30 Nov" in the English the portal uses. */
export function dayLabel(iso: string): string {
  const d = new Date(`${iso}T12:00:00Z`);
  return `${SHORT_DAY[weekdayOf(iso)]} ${d.getUTCDate()} ${d.toLocaleString('en-US', { month: 'short', timeZone: 'UTC' })}`;
}

/** "30 Nov – 6 Dec 2026". */
export function weekLabel(weekStart: string): string {
  const a = new Date(`${weekStart}T12:00:00Z`);
  const b = new Date(`${addDaysIso(weekStart, 6)}T12:00:00Z`);
  const m = (d: Date) => d.toLocaleString('en-US', { month: 'short', timeZone: 'UTC' });
  return `${a.getUTCDate()} ${m(a)} – ${b.getUTCDate()} ${m(b)} ${b.getUTCFullYear()}`;
}

/** Sites and tasks present in the week, for the filters. */
export function filterOptions(board: WeekBoard | null): { sites: { id: number; name: string }[]; tasks: WorkTask[] } {
  const sites = new Map<number, string>();
  const tasks = new Set<WorkTask>();
  for (const o of board?.orders ?? []) {
    if (o.siteId !== null) sites.set(o.siteId, o.siteName);
    tasks.add(o.task);
  }
  return {
    sites: [...sites].map(([id, name]) => ({ id, name })).sort((a, b) => a.name.localeCompare(b.name)),
    tasks: [...tasks].sort(),
  };
}

const TASK_CAUTIONS: Partial<Record<WorkTask, CautionKey[]>> = {
  mow: ['mowing'],
  feed: ['feed'],
  weed_control: ['pesticide', 'application'],
  paint_lines: ['lines'],
  irrigate: ['water'],
  colourant: ['colourant'],
};

/** Mowing first (most jobs), chemicals next, then the weather that stops all work. */
const CAUTION_ORDER: CautionKey[] = ['mowing', 'feed', 'pesticide', 'application', 'colourant', 'lines', 'water', 'wetField', 'lightning'];

/**
 * The cautions for a set of tasks: each task's own, then the weather ones every outdoor job
 * carries (wet fields, lightning).
 */
export function cautionsFor(tasks: Iterable<WorkTask>): { key: CautionKey; text: string }[] {
  const keys = new Set<CautionKey>(['wetField', 'lightning']);
  for (const t of tasks) for (const k of TASK_CAUTIONS[t] ?? []) keys.add(k);
  return CAUTION_ORDER.filter((k) => keys.has(k)).map((key) => ({ key, text: CAUTIONS[key] }));
}

/**
 * What a crew takes for an order: the unit the plan assigned, else for a mowing the kind of
 * mower its HOC needs (older rows name the kind under `mower`); empty when nothing is named.
 */
export function equipmentText(o: Pick<WorkOrderRow, 'task' | 'equipmentName' | 'details'>): string {
  if (o.equipmentName) return o.equipmentName;
  if (o.task !== 'mow') return '';
  const kind = o.details.mowerKind ?? o.details.mower;
  if (kind === 'reel') return 'Reel mower';
  if (kind === 'rotary') return 'Rotary mower';
  return typeof kind === 'string' && kind ? kind : '';
}
