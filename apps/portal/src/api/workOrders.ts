import type {
  CreateWorkOrderInput,
  PhotoAnswer,
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
