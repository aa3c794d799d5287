import { asSubject, type PlanDiff, type WeekBoard, type WorkOrderRow, type WorkTask } from '@swardwise/domain';
import { ElMessage } from 'element-plus';
import { computed, onScopeDispose, reactive, ref, shallowRef, toValue, watch, type MaybeRefOrGetter } from 'vue';
import { ability } from '../ability.ts';
import { ApiError } from '../api/client.ts';
import { errorMessage, isConflict } from '../api/messages.ts';
import { confirmWeek, generateWeek, getWeekBoard } from '../api/weekPlans.ts';
import { updateWorkOrder } from '../api/workOrders.ts';
import { crewDayMap, filterOptions, groupCells, type CellKey } from '../components/week/board.ts';
import { useSessionStore } from '../stores/session.ts';

export interface WeekKey {
  districtId: number | null;
  weekStart: string;
}

export type OrderChange = Partial<Pick<WorkOrderRow, 'crewId' | 'plannedDate' | 'plannedHours' | 'pinned' | 'notes'>>;

function sameJson(a: unknown, b: unknown): boolean {
  return JSON.stringify(a) === JSON.stringify(b);
}

/**
 * The reloaded board with the previous objects of every order and crew-day that did not
 * change, so after a write only the cells it touched render again.
 */
export function keepUnchanged(prev: WeekBoard | null, next: WeekBoard): WeekBoard {
  if (!prev || prev.districtId !== next.districtId || prev.weekStart !== next.weekStart) return next;
  const orders = new Map(prev.orders.map((o) => [o.id, o]));
  const days = new Map(prev.crewDays.map((d) => [`${d.crewId}|${d.date}`, d]));
  return {
    ...next,
    orders: next.orders.map((o) => {
      const old = orders.get(o.id);
      return old && sameJson(old, o) ? old : o;
    }),
    crewDays: next.crewDays.map((d) => {
      const old = days.get(`${d.crewId}|${d.date}`);
      return old && sameJson(old, d) ? old : d;
    }),
  };
}

/**
 * The week board of one district: loads it, groups its orders into crew-day cells once per
 * change, moves and edits orders with the version they were read at (a 409 reloads), and
 * previews then applies a generated plan.
 */
export function useWeekBoard(key: MaybeRefOrGetter<WeekKey>) {
  const session = useSessionStore();
  const data = shallowRef<WeekBoard | null>(null);
  const loading = ref(false);
  const error = ref<string | null>(null);
  /** Orders whose write is under way, so their cards can say so. */
  const saving = reactive(new Set<number>());
  const filter = reactive<{ siteIds: number[]; tasks: WorkTask[] }>({ siteIds: [], tasks: [] });
  let controller: AbortController | null = null;

  /** Loads the week; `quiet` keeps the board on screen (after a write) instead of showing the spinner. */
  async function load(quiet = false) {
    const { districtId, weekStart } = toValue(key);
    controller?.abort();
    if (districtId === null) {
      data.value = null;
      return;
    }
    const mine = new AbortController();
    controller = mine;
    if (!quiet) loading.value = true;
    error.value = null;
    try {
      const next = await getWeekBoard({ districtId, weekStart }, mine.signal);
      data.value = quiet ? keepUnchanged(data.value, next) : next;
    } catch (cause) {
      if (mine.signal.aborted) return;
      if (cause instanceof ApiError && cause.status === 401) session.expire();
      error.value = errorMessage(cause);
    } finally {
      if (controller === mine) loading.value = false;
    }
  }

  watch(
    () => ({ ...toValue(key) }),
    (next, prev) => {
      if (prev && next.districtId === prev.districtId && next.weekStart === prev.weekStart) return;
      void load();
    },
    { immediate: true },
  );
  onScopeDispose(() => controller?.abort());

  const crewDays = computed(() => crewDayMap(data.value?.crewDays ?? []));
  let lastCells: Map<CellKey, WorkOrderRow[]> | undefined;
  const cells = computed(() => {
    // Plain copies: the grouping then reads no reactive proxies in its loop over every order.
    const plain = { siteIds: [...filter.siteIds], tasks: [...filter.tasks] };
    lastCells = groupCells(data.value?.orders ?? [], crewDays.value, plain, lastCells);
    return lastCells;
  });
  const options = computed(() => filterOptions(data.value));
  const canEdit = computed(() => {
    const board = data.value;
    return !!board && ability.can('update', asSubject('WorkOrder', { districtId: board.districtId }));
  });

  function replaceOrder(id: number, next: (o: WorkOrderRow) => WorkOrderRow) {
    const board = data.value;
    if (!board) return;
    data.value = { ...board, orders: board.orders.map((o) => (o.id === id ? next(o) : o)) };
  }

  /** Saves a change of one order; the card moves at once and goes back if the API refuses. */
  async function change(order: WorkOrderRow, patch: OrderChange): Promise<boolean> {
    const before = data.value?.orders.find((o) => o.id === order.id);
    if (!before || saving.has(order.id)) return false;
    replaceOrder(order.id, (o) => ({ ...o, ...patch, crewName: patch.crewId === undefined ? o.crewName : crewName(patch.crewId), pinned: patch.pinned ?? true }));
    saving.add(order.id);
    try {
      const saved = await updateWorkOrder(order.id, { version: before.version, ...patch });
      if (saved && typeof saved.version === 'number') replaceOrder(order.id, () => saved);
      saving.delete(order.id);
      // The plan's hours and routes of both crew-days are the server's to compute.
      await load(true);
      return true;
    } catch (cause) {
      saving.delete(order.id);
      if (isConflict(cause)) {
        ElMessage.warning(errorMessage(cause));
        await load(true);
      } else {
        replaceOrder(order.id, () => before);
        if (cause instanceof ApiError && cause.status === 401) session.expire();
        ElMessage.error(errorMessage(cause));
      }
      return false;
    }
  }

  function crewName(crewId: number | null): string | null {
    return data.value?.crews.find((c) => c.id === crewId)?.name ?? null;
  }

  /** A card dropped on another cell. */
  function move(orderId: number, crewId: number | null, plannedDate: string): Promise<boolean> {
    const order = data.value?.orders.find((o) => o.id === orderId);
    if (!order || (order.crewId === crewId && order.plannedDate === plannedDate)) return Promise.resolve(false);
    return change(order, { crewId, plannedDate });
  }

  const diff = shallowRef<PlanDiff | null>(null);
  /** What the planner could not do, from the last preview. */
  const planWarnings = shallowRef<string[]>([]);
  const generating = ref<'preview' | 'apply' | 'confirm' | null>(null);

  async function generate(dryRun: boolean): Promise<PlanDiff | null> {
    const board = data.value;
    if (!board) return null;
    generating.value = dryRun ? 'preview' : 'apply';
    try {
      const answer = await generateWeek({ districtId: board.districtId, weekStart: board.weekStart, dryRun });
      planWarnings.value = answer.warnings ?? [];
      if (dryRun) diff.value = answer.diff;
      else {
        data.value = answer.board;
        diff.value = null;
      }
      return answer.diff;
    } catch (cause) {
      if (cause instanceof ApiError && cause.status === 401) session.expire();
      ElMessage.error(errorMessage(cause));
      return null;
    } finally {
      generating.value = null;
    }
  }

  /** Confirms the suggested crews of the week; answers how many orders and e-mails that made. */
  async function confirm(): Promise<{ assigned: number; emailed: number } | null> {
    const board = data.value;
    if (!board) return null;
    generating.value = 'confirm';
    try {
      const answer = await confirmWeek({ districtId: board.districtId, weekStart: board.weekStart });
      data.value = answer.board;
      return { assigned: answer.assigned, emailed: answer.emailed };
    } catch (cause) {
      if (cause instanceof ApiError && cause.status === 401) session.expire();
      ElMessage.error(errorMessage(cause));
      return null;
    } finally {
      generating.value = null;
    }
  }

  /** Orders with a suggested crew that nobody confirmed yet. */
  const unconfirmed = computed(() => (data.value?.orders ?? []).filter((o) => o.status === 'planned' && o.crewId !== null).length);

  return {
    data,
    loading,
    error,
    refetch: () => load(),
    cells,
    crewDays,
    filter,
    options,
    canEdit,
    saving,
    move,
    change,
    diff,
    planWarnings,
    generating,
    confirm,
    unconfirmed,
    preview: () => generate(true),
    apply: () => generate(false),
  };
}
