import { asSubject, type ConfirmAnswer, type PlanDiff, type WeekBoard, type WorkOrderRow, type WorkTask } from '@swardwise/domain';
import { useQueryClient } from '@tanstack/vue-query';
import { ElMessage } from 'element-plus';
import { computed, reactive, ref, shallowRef, toValue, type MaybeRefOrGetter } from 'vue';
import { ability } from '../ability.ts';
import { ApiError } from '../api/client.ts';
import { errorMessage, isConflict } from '../api/messages.ts';
import { queryKeys } from '../api/queryKeys.ts';
import { confirmWeek, generateWeek, getWeekBoard } from '../api/weekPlans.ts';
import { updateWorkOrder } from '../api/workOrders.ts';
import { crewDayMap, filterOptions, groupCells, type CellKey } from '../components/week/board.ts';
import { useSessionStore } from '../stores/session.ts';
import { useApiQuery } from './useApiQuery.ts';
import { useInvalidate } from './useInvalidate.ts';

export interface WeekKey {
  districtId: number | null;
  weekStart: string;
}

export type OrderChange = Partial<Pick<WorkOrderRow, 'crewId' | 'plannedDate' | 'plannedHours' | 'pinned' | 'notes'>>;

/**
 * The week board of one district: loads it through the query cache, groups its orders into
 * crew-day cells once per change, moves and edits orders with the version they were read at
 * (a 409 reloads), and previews then applies a generated plan.
 *
 * After a write the board is asked again in the background. The cache keeps the objects of
 * the orders and crew-days that came back unchanged (structural sharing), and the grouping
 * keeps a cell's array while its orders are the same objects, so only the cells a write
 * touched render again.
 */
export function useWeekBoard(key: MaybeRefOrGetter<WeekKey>) {
  const session = useSessionStore();
  const client = useQueryClient();
  const invalidate = useInvalidate();
  const queryKey = () => queryKeys.weekBoard(toValue(key).districtId, toValue(key).weekStart);
  const query = useApiQuery(
    queryKey,
    (signal) => {
      const { districtId, weekStart } = toValue(key);
      return getWeekBoard({ districtId: districtId!, weekStart }, signal);
    },
    { enabled: () => toValue(key).districtId !== null },
  );
  // No district chosen (yet): no board, not the one of the district before.
  const data = computed<WeekBoard | null>(() => (toValue(key).districtId === null ? null : query.data.value));
  /** Orders whose write is under way, so their cards can say so. */
  const saving = reactive(new Set<number>());
  const filter = reactive<{ siteIds: number[]; tasks: WorkTask[] }>({ siteIds: [], tasks: [] });

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
    client.setQueryData<WeekBoard>(queryKey(), (board) => board && { ...board, orders: board.orders.map((o) => (o.id === id ? next(o) : o)) });
  }

  /** Shows the board a write answered with; the other answers that list the week's orders go stale. */
  async function showBoard(board: WeekBoard) {
    client.setQueryData(queryKeys.weekBoard(board.districtId, board.weekStart), board);
    await Promise.all([client.invalidateQueries({ queryKey: ['work-orders'] }), client.invalidateQueries({ queryKey: ['records'] })]);
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
      await invalidate('workOrder');
      return true;
    } catch (cause) {
      saving.delete(order.id);
      if (isConflict(cause)) {
        ElMessage.warning(errorMessage(cause));
        await invalidate('workOrder');
      } else {
        replaceOrder(order.id, () => before);
        if (cause instanceof ApiError && cause.status === 401) session.expire(cause);
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

  /** Runs one week-wide action with `generating` set to it; a failure is said once (a 401 ends the session). */
  async function running<T>(what: NonNullable<typeof generating.value>, run: () => Promise<T>): Promise<T | null> {
    generating.value = what;
    try {
      return await run();
    } catch (cause) {
      if (cause instanceof ApiError && cause.status === 401) session.expire(cause);
      ElMessage.error(errorMessage(cause));
      return null;
    } finally {
      generating.value = null;
    }
  }

  function generate(dryRun: boolean): Promise<PlanDiff | null> {
    const board = data.value;
    if (!board) return Promise.resolve(null);
    return running(dryRun ? 'preview' : 'apply', async () => {
      const answer = await generateWeek({ districtId: board.districtId, weekStart: board.weekStart, dryRun });
      planWarnings.value = answer.warnings ?? [];
      if (dryRun) diff.value = answer.diff;
      else {
        await showBoard(answer.board);
        diff.value = null;
      }
      return answer.diff;
    });
  }

  /** Confirms the suggested crews of the week; answers how many orders and e-mails that made. */
  function confirm(): Promise<Pick<ConfirmAnswer, 'assigned' | 'emailed' | 'mail'> | null> {
    const board = data.value;
    if (!board) return Promise.resolve(null);
    return running('confirm', async () => {
      const answer = await confirmWeek({ districtId: board.districtId, weekStart: board.weekStart });
      await showBoard(answer.board);
      return { assigned: answer.assigned, emailed: answer.emailed, mail: answer.mail };
    });
  }

  /** Orders with a suggested crew that nobody confirmed yet. */
  const unconfirmed = computed(() => (data.value?.orders ?? []).filter((o) => o.status === 'planned' && o.crewId !== null).length);

  return {
    data,
    loading: query.loading,
    error: query.error,
    refetch: query.refetch,
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
