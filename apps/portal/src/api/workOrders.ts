import type {
  ApplicationInput,
  ApplicationRow,
  CreateWorkOrderInput,
  FieldCheckAnswer,
  FieldCheckBody,
  FieldCheckList,
  PhotoAnswer,
  ReopenAnswer,
  WorkHistoryPage,
  WorkOrderAnswer,
  ReportAnswer,
  UpdateWorkOrderInput,
  WorkOrderList,
  WorkOrderRow,
  WorkOrderWriteAnswer,
  WorkReportInput,
} from '@swardwise/domain';
import { api } from './client.ts';

/** Work orders the caller may read, from `from` for a week unless `to` is given. */
export async function listWorkOrders(query: { from?: string; to?: string; crewId?: number }, signal?: AbortSignal): Promise<WorkOrderRow[]> {
  return (await api.get<WorkOrderList>('/work-orders', query, signal)).items;
}

/** Sends the version the order was read at; a stale one answers 409. */
export function updateWorkOrder(id: number, body: UpdateWorkOrderInput): Promise<WorkOrderWriteAnswer> {
  return api.patch<WorkOrderWriteAnswer>(`/work-orders/${id}`, body);
}

/**
 * A crew's report as the phone sends it: always with a client reference (a retry counts once)
 * and the phone's clock with its offset (the API takes the department's local date of it).
 */
export type WorkReportBody = Omit<WorkReportInput, 'clientRef' | 'reportedAt' | 'version'> & { clientRef: string; reportedAt: string };

export function reportWork(orderId: number, body: WorkReportBody): Promise<ReportAnswer> {
  return api.post<ReportAnswer>(`/work-orders/${orderId}/reports`, body);
}

export function uploadWorkPhoto(orderId: number, photo: Blob, name: string, clientRef: string): Promise<PhotoAnswer> {
  const form = new FormData();
  form.append('clientRef', clientRef);
  form.append('photo', photo, name);
  return api.upload<PhotoAnswer>(`/work-orders/${orderId}/photos`, form);
}

/** A one-off job added by hand: it stays as entered when the week is generated again. */
export function createWorkOrder(body: CreateWorkOrderInput): Promise<WorkOrderWriteAnswer> {
  return api.post<WorkOrderWriteAnswer>('/work-orders', body);
}

/** One order with its reports (notes, who and when) and photos. */
export function getWorkOrder(id: number, signal?: AbortSignal): Promise<WorkOrderAnswer> {
  return api.get<WorkOrderAnswer>(`/work-orders/${id}`, undefined, signal);
}

/** Opens a done or skipped job again (crew lead: the same day; foreman: any time). */
export function reopenWork(id: number, body: { reason: string; version?: number }): Promise<ReopenAnswer> {
  return api.post<ReopenAnswer>(`/work-orders/${id}/reopen`, body);
}

/** Logs a field check on a field-check job: stored, scored and the job done. */
export function logFieldCheck(id: number, body: FieldCheckBody): Promise<FieldCheckAnswer> {
  return api.post<FieldCheckAnswer>(`/work-orders/${id}/field-check`, body);
}

/** One page of a field's logged work, newest first. */
export function listFieldWork(fieldId: number, page: number, pageSize: number, signal?: AbortSignal): Promise<WorkHistoryPage> {
  return api.get<WorkHistoryPage>(`/fields/${fieldId}/work`, { page, pageSize }, signal);
}

/** A field's latest field checks. */
export async function listFieldChecks(fieldId: number, signal?: AbortSignal): Promise<FieldCheckList> {
  return api.get<FieldCheckList>(`/fields/${fieldId}/checks`, undefined, signal);
}

/** Records what was applied on a feed, seeding, topdressing or weed-control order. */
export function recordApplication(orderId: number, body: ApplicationInput): Promise<{ application: ApplicationRow }> {
  return api.post<{ application: ApplicationRow }>(`/work-orders/${orderId}/application`, body);
}
