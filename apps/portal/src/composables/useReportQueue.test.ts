import 'fake-indexeddb/auto';
import { Blob as NodeBlob } from 'node:buffer';
import { flushPromises, mount } from '@vue/test-utils';
import { createStore } from 'idb-keyval';
import { createPinia, setActivePinia } from 'pinia';
import { afterEach, beforeEach, describe, expect, test, vi } from 'vitest';
import { defineComponent, h } from 'vue';
import { useSessionStore } from '../stores/session.ts';
import { createReportQueue, type ReportQueue } from '../utils/reportQueue.ts';
import { apiTransport, useReportQueue } from './useReportQueue.ts';

const fetchMock = vi.fn<typeof fetch>();
const json = (status: number, body: unknown) => new Response(JSON.stringify(body), { status, headers: { 'Content-Type': 'application/json' } });
const ok = (duplicate = false) => json(duplicate ? 200 : 201, { order: { id: 41, status: 'done' }, update: { id: 1 }, duplicate });
const offline = () => Promise.reject(new TypeError('Failed to fetch'));

let storeNo = 0;
let queue: ReportQueue;
let store: ReturnType<typeof createStore>;

beforeEach(() => {
  fetchMock.mockReset();
  vi.stubGlobal('fetch', fetchMock);
  setActivePinia(createPinia());
  useSessionStore().user = { id: 7, email: 'crew@test.example', name: 'Crew', role: 'crew', districtId: 1, crewId: 2, siteIds: [], units: 'metric', version: 1 };
  // A fresh database per test, the same one a reloaded page would open again.
  store = createStore(`outbox-test-${++storeNo}`, 'reports');
  queue = createReportQueue(apiTransport, store);
});
afterEach(() => {
  vi.unstubAllGlobals();
  document.body.innerHTML = '';
});

/** A bit of the Today page: the outbox banner over the composable. */
function mountOutbox(q: ReportQueue = queue) {
  let api!: ReturnType<typeof useReportQueue>;
  const Outbox = defineComponent({
    setup() {
      api = useReportQueue({ queue: q, intervalMs: 3_600_000 });
      return () =>
        h('div', [
          h('p', { 'data-test': 'waiting' }, `${api.waiting.value.length} waiting`),
          ...api.failed.value.map((f) => h('p', { 'data-test': 'failed' }, f.error ?? '')),
        ]);
    },
  });
  const wrapper = mount(Outbox);
  return { wrapper, api: () => api };
}

const done = { status: 'done' as const, actualHours: 1.5, note: 'Cut' };
const sentBodies = () => fetchMock.mock.calls.filter(([url]) => String(url).endsWith('/reports')).map(([, init]) => JSON.parse(String(init!.body)));
const settle = async () => {
  for (let i = 0; i < 5; i++) {
    await flushPromises();
    await new Promise((r) => setTimeout(r, 5));
  }
};

describe('useReportQueue', () => {
  test('should keep a report that failed to send and send it again with the same reference when back online', async () => {
    fetchMock.mockImplementationOnce(offline);
    const { wrapper, api } = mountOutbox();
    await api().ready;
    await api().submit({ orderId: 41, label: 'Mow · Soccer 1', body: done });
    await settle();
    expect(fetchMock).toHaveBeenCalledTimes(1);
    expect(wrapper.get('[data-test="waiting"]').text()).toBe('1 waiting');
    expect(api().waiting.value[0]!.error).toMatch(/cannot be reached/);

    // Still there after the page is closed: a new queue on the same database finds it.
    const reopened = createReportQueue(apiTransport, store);
    expect((await reopened.list()).map((i) => i.orderId)).toEqual([41]);

    fetchMock.mockImplementationOnce(async () => json(503, { error: { code: 'server/unavailable', message: 'Try later' } }));
    window.dispatchEvent(new Event('online'));
    await settle();
    expect(fetchMock).toHaveBeenCalledTimes(2);
    expect(wrapper.get('[data-test="waiting"]').text()).toBe('1 waiting');

    fetchMock.mockImplementationOnce(async () => ok());
    window.dispatchEvent(new Event('online'));
    await settle();
    expect(fetchMock).toHaveBeenCalledTimes(3);
    expect(wrapper.get('[data-test="waiting"]').text()).toBe('0 waiting');
    const bodies = sentBodies();
    expect(bodies).toHaveLength(3);
    expect(new Set(bodies.map((b) => b.clientRef)).size).toBe(1);
    expect(bodies[0]).toMatchObject({ status: 'done', actualHours: 1.5, note: 'Cut' });
    expect(bodies[0].reportedAt).toMatch(/^\d{4}-\d\d-\d\dT\d\d:\d\d:\d\d[+-]\d\d:\d\d$/);
    expect(await reopened.list()).toEqual([]);
  });

  test('should not send a report again once the server has it', async () => {
    fetchMock.mockImplementation(async () => ok());
    const { api } = mountOutbox();
    await api().ready;
    await api().submit({ orderId: 41, label: 'Mow · Soccer 1', body: done });
    await settle();
    expect(fetchMock).toHaveBeenCalledTimes(1);
    window.dispatchEvent(new Event('online'));
    await api().flush();
    // A second page (another tab, or after a reload) finds nothing to send.
    const other = mountOutbox(createReportQueue(apiTransport, store));
    await other.api().ready;
    await settle();
    expect(fetchMock).toHaveBeenCalledTimes(1);
  });

  test('should count a duplicate answer as sent and resume a half-sent report at its photos', async () => {
    // happy-dom's Blob cannot be stored in IndexedDB (a browser's can); Node's can, and a
    // plain form stands in for happy-dom's FormData, which takes only its own Blob.
    class PlainForm {
      readonly parts = new Map<string, unknown>();
      append(key: string, value: unknown) {
        this.parts.set(key, value);
      }
      get(key: string) {
        return this.parts.get(key);
      }
    }
    vi.stubGlobal('Blob', NodeBlob);
    vi.stubGlobal('FormData', PlainForm);
    const photo = new Blob([new Uint8Array([137, 80, 78, 71, 1, 2, 3])], { type: 'image/png' });
    fetchMock.mockImplementationOnce(async () => ok()).mockImplementationOnce(offline);
    const { api } = mountOutbox();
    await api().ready;
    await api().submit({ orderId: 41, label: 'Mow · Soccer 1', body: done, photos: [{ blob: photo, name: 'stripes.png' }] });
    await settle();
    expect(fetchMock).toHaveBeenCalledTimes(2);
    expect(api().waiting.value[0]).toMatchObject({ reportSent: true, photos: [{ name: 'stripes.png', sent: false }] });

    fetchMock.mockImplementationOnce(async () => json(200, { photo: { id: 3 }, duplicate: true }));
    await api().flush();
    await settle();
    expect(fetchMock).toHaveBeenCalledTimes(3);
    const [url, init] = fetchMock.mock.calls[2]!;
    expect(String(url)).toBe('/api/work-orders/41/photos');
    const form = init!.body as unknown as PlainForm;
    expect(form.get('clientRef')).toMatch(/^[A-Za-z0-9_-]{8,64}$/);
    expect((form.get('photo') as Blob).size).toBe(7);
    expect(sentBodies()).toHaveLength(1);
    expect(api().items.value).toEqual([]);
  });

  test('should show a refused report with the server’s message and keep it until the crew discards it', async () => {
    fetchMock.mockImplementation(async () =>
      json(409, { error: { code: 'work_report/already_done', message: 'This work order is already logged as done; a second done report would count the hours twice' } }),
    );
    const { wrapper, api } = mountOutbox();
    await api().ready;
    await api().submit({ orderId: 41, label: 'Mow · Soccer 1', body: done });
    await settle();
    expect(wrapper.get('[data-test="failed"]').text()).toMatch(/already logged as done/);
    // Refused as it is: coming online does not send it again by itself.
    window.dispatchEvent(new Event('online'));
    await settle();
    expect(fetchMock).toHaveBeenCalledTimes(1);
    const ref = api().failed.value[0]!.ref;
    await api().retry(ref);
    expect(fetchMock).toHaveBeenCalledTimes(2);
    expect(sentBodies()[1].clientRef).toBe(ref);
    await api().discard(ref);
    await settle();
    expect(wrapper.findAll('[data-test="failed"]')).toHaveLength(0);
    expect(await queue.list()).toEqual([]);
  });

  test('should send only the signed-in user’s reports', async () => {
    await queue.add({ userId: 99, orderId: 5, label: 'Mow · Other', body: done });
    fetchMock.mockImplementation(async () => ok());
    const { api } = mountOutbox();
    await api().ready;
    await settle();
    expect(fetchMock).not.toHaveBeenCalled();
    expect(api().items.value).toEqual([]);
    expect(await queue.list()).toHaveLength(1);
  });
});
