/**
 * The phone's outbox of crew reports. A report (with its photos as Blobs) is written to
 * IndexedDB before the first try and leaves it only when the server has it, so a dead
 * spot on a field or a closed browser loses nothing. Each report and photo carries a
 * reference made once, here, which the server uses to store a retried submission once.
 */
import { createStore, del, get, set, values, type UseStore } from 'idb-keyval';
import { ApiError } from '../api/client.ts';
import { errorMessage } from '../api/messages.ts';
import type { WorkReportBody } from '../api/workOrders.ts';

export interface QueuedPhoto {
  ref: string;
  name: string;
  blob: Blob;
  sent: boolean;
}

export interface QueuedReport {
  /** The report's clientRef, also its key in the store. */
  ref: string;
  userId: number;
  orderId: number;
  /** What the crew sees in the outbox, e.g. "Mow · Soccer 1". */
  label: string;
  body: WorkReportBody;
  reportSent: boolean;
  photos: QueuedPhoto[];
  /** waiting: will be sent (again); failed: the server refused it, the crew decides. */
  state: 'waiting' | 'failed';
  /** Why the last try did not go through. */
  error: string | null;
  attempts: number;
  queuedAt: string;
}

export interface ReportTransport {
  report(orderId: number, body: WorkReportBody): Promise<unknown>;
  photo(orderId: number, blob: Blob, name: string, ref: string): Promise<unknown>;
}

export type NewReport = Pick<QueuedReport, 'userId' | 'orderId' | 'label'> & {
  body: Omit<WorkReportBody, 'clientRef' | 'reportedAt'> & { reportedAt?: string };
  photos?: { blob: Blob; name: string }[];
};

/** A reference the server accepts (8–64 of A–Z, a–z, 0–9, - and _). */
function newRef(): string {
  if (typeof crypto !== 'undefined' && typeof crypto.randomUUID === 'function') return crypto.randomUUID();
  return `r${Date.now().toString(36)}${Math.random().toString(36).slice(2, 12)}`;
}

/** The phone's time with its UTC offset: the moment of the report (the API dates it in the department's zone). */
function localIso(date = new Date()): string {
  const pad = (n: number) => String(Math.trunc(Math.abs(n))).padStart(2, '0');
  const offset = -date.getTimezoneOffset();
  const sign = offset >= 0 ? '+' : '-';
  return (
    `${date.getFullYear()}-${pad(date.getMonth() + 1)}-${pad(date.getDate())}T${pad(date.getHours())}:${pad(date.getMinutes())}:${pad(date.getSeconds())}` +
    `${sign}${pad(offset / 60)}:${pad(offset % 60)}`
  );
}

/**
 * A failure worth trying again as it is: no connection, a server error, a lost session
 * (sent after signing in again), a timeout or too many requests. Any other 4xx is the
 * server refusing the report; sending it again unchanged would be refused again.
 */
function isTransient(error: unknown): boolean {
  if (!(error instanceof ApiError)) return !(error instanceof DOMException && error.name === 'AbortError');
  return error.status === 0 || error.status >= 500 || [401, 408, 429].includes(error.status);
}

export interface ReportQueue {
  add(report: NewReport): Promise<QueuedReport>;
  /** Every queued report of every user on this device, oldest first. */
  list(): Promise<QueuedReport[]>;
  /** Sends what is waiting for this user; one run at a time (a second call joins the first). */
  flush(userId: number): Promise<void>;
  retry(ref: string, userId: number): Promise<void>;
  discard(ref: string): Promise<void>;
  /** Called after every change of the store; returns the unsubscribe. */
  subscribe(listener: () => void): () => void;
  /** Called when a report has fully reached the server. */
  onSent(listener: (report: QueuedReport) => void): () => void;
}

export function createReportQueue(transport: ReportTransport, store: UseStore = createStore('swardwise-outbox', 'reports')): ReportQueue {
  const listeners = new Set<() => void>();
  const sentListeners = new Set<(report: QueuedReport) => void>();
  let running: Promise<void> | null = null;
  let again = false;

  const changed = () => listeners.forEach((l) => l());
  const save = async (item: QueuedReport) => {
    await set(item.ref, item, store);
    changed();
  };

  async function list() {
    const items = await values<QueuedReport>(store);
    return items.sort((a, b) => a.queuedAt.localeCompare(b.queuedAt));
  }

  /** false: stop the run (the network or the server is down, the next item would fail too). */
  async function sendOne(item: QueuedReport): Promise<boolean> {
    try {
      if (!item.reportSent) {
        await transport.report(item.orderId, item.body);
        item.reportSent = true;
        await save(item);
      }
      for (const photo of item.photos) {
        if (photo.sent) continue;
        try {
          await transport.photo(item.orderId, photo.blob, photo.name, photo.ref);
        } catch (cause) {
          if (cause instanceof ApiError && !isTransient(cause)) throw new ApiError(cause.status, cause.code, `Photo “${photo.name}”: ${errorMessage(cause)}`);
          throw cause;
        }
        photo.sent = true;
        await save(item);
      }
      await del(item.ref, store);
      changed();
      sentListeners.forEach((l) => l(item));
      return true;
    } catch (cause) {
      item.attempts += 1;
      item.error = errorMessage(cause);
      if (!isTransient(cause)) item.state = 'failed';
      await save(item);
      return !isTransient(cause);
    }
  }

  async function run(userId: number) {
    for (const item of await list()) {
      if (item.userId !== userId || item.state !== 'waiting') continue;
      // Read again: another tab may have sent or discarded it meanwhile.
      const fresh = await get<QueuedReport>(item.ref, store);
      if (!fresh || fresh.state !== 'waiting') continue;
      if (!(await sendOne(fresh))) return;
    }
  }

  function flush(userId: number): Promise<void> {
    // A call during a run (a report added meanwhile) makes the run go round once more.
    if (running) {
      again = true;
      return running;
    }
    running = (async () => {
      do {
        again = false;
        await run(userId);
      } while (again);
    })().finally(() => {
      running = null;
    });
    return running;
  }

  return {
    async add(report) {
      const item: QueuedReport = {
        ref: newRef(),
        userId: report.userId,
        orderId: report.orderId,
        label: report.label,
        body: { ...report.body, clientRef: '', reportedAt: report.body.reportedAt ?? localIso() },
        reportSent: false,
        photos: (report.photos ?? []).map((p) => ({ ref: newRef(), name: p.name, blob: p.blob, sent: false })),
        state: 'waiting',
        error: null,
        attempts: 0,
        queuedAt: new Date().toISOString(),
      };
      item.body.clientRef = item.ref;
      await save(item);
      return item;
    },
    list,
    flush,
    async retry(ref, userId) {
      const item = await get<QueuedReport>(ref, store);
      if (!item) return;
      await save({ ...item, state: 'waiting', error: null });
      await flush(userId);
    },
    async discard(ref) {
      await del(ref, store);
      changed();
    },
    subscribe(listener) {
      listeners.add(listener);
      return () => listeners.delete(listener);
    },
    onSent(listener) {
      sentListeners.add(listener);
      return () => sentListeners.delete(listener);
    },
  };
}
