import { computed, onScopeDispose, ref, shallowRef } from 'vue';
import { reportWork, uploadWorkPhoto } from '../api/workOrders.ts';
import { useSessionStore } from '../stores/session.ts';
import { createReportQueue, type NewReport, type QueuedReport, type ReportQueue, type ReportTransport } from '../utils/reportQueue.ts';

/** How often a waiting report is tried again while the page is open. */
const RETRY_INTERVAL_MS = 30_000;

export const apiTransport: ReportTransport = {
  report: (orderId, body) => reportWork(orderId, body),
  photo: (orderId, blob, name, ref) => uploadWorkPhoto(orderId, blob, name, ref),
};

let shared: ReportQueue | null = null;
/** One outbox per page, over the API. */
function sharedReportQueue(): ReportQueue {
  shared ??= createReportQueue(apiTransport);
  return shared;
}

export interface ReportQueueOptions {
  queue?: ReportQueue;
  intervalMs?: number;
  /** After a report has fully reached the server (e.g. reload the orders). */
  onSent?: (report: QueuedReport) => void;
}

/**
 * The signed-in crew lead's outbox: what is waiting to be sent, what the server refused,
 * and `submit` to queue a report. Sends on start, when the browser comes back online,
 * when the page is shown again and on an interval.
 */
export function useReportQueue(options: ReportQueueOptions = {}) {
  const queue = options.queue ?? sharedReportQueue();
  const session = useSessionStore();
  const all = shallowRef<QueuedReport[]>([]);
  const sending = ref(false);
  const userId = () => session.user?.id ?? null;

  const items = computed(() => all.value.filter((i) => i.userId === userId()));
  const waiting = computed(() => items.value.filter((i) => i.state === 'waiting'));
  const failed = computed(() => items.value.filter((i) => i.state === 'failed'));
  /** The newest queued report of each order, to show on its card until the server has it. */
  const byOrder = computed(() => new Map(items.value.map((i) => [i.orderId, i])));

  async function refresh() {
    all.value = await queue.list();
  }

  async function flush() {
    const id = userId();
    if (id == null) return;
    sending.value = true;
    try {
      await queue.flush(id);
    } finally {
      sending.value = false;
      await refresh();
    }
  }

  async function submit(report: Omit<NewReport, 'userId'>) {
    const id = userId();
    if (id == null) throw new Error('Sign in to send reports');
    const item = await queue.add({ ...report, userId: id });
    await refresh();
    void flush();
    return item;
  }

  async function retry(ref: string) {
    const id = userId();
    if (id != null) await queue.retry(ref, id);
    await refresh();
  }

  async function discard(ref: string) {
    await queue.discard(ref);
    await refresh();
  }

  const stops: (() => void)[] = [queue.subscribe(() => void refresh())];
  if (options.onSent) stops.push(queue.onSent(options.onSent));
  if (typeof window !== 'undefined') {
    const online = () => void flush();
    const visible = () => {
      if (document.visibilityState === 'visible') void flush();
    };
    window.addEventListener('online', online);
    document.addEventListener('visibilitychange', visible);
    const timer = window.setInterval(() => void flush(), options.intervalMs ?? RETRY_INTERVAL_MS);
    stops.push(() => {
      window.removeEventListener('online', online);
      document.removeEventListener('visibilitychange', visible);
      window.clearInterval(timer);
    });
  }
  onScopeDispose(() => stops.forEach((stop) => stop()));
  const ready = refresh().then(flush);

  return { items, waiting, failed, byOrder, sending, submit, flush, retry, discard, ready };
}
