import type { WorkReport, WorkStatus, WorkTask } from '@swardwise/domain';
import { api } from './client.ts';

export interface WorkOrderRow {
  id: number;
  fieldId: number;
  fieldName: string;
  siteId: number;
  siteName: string;
  districtId: number;
  task: WorkTask;
  plannedDate: string;
  crewId: number | null;
  crewName: string | null;
  equipmentId?: number | null;
  equipmentName?: string | null;
  plannedHours: number;
  actualHours: number | null;
  status: WorkStatus;
  reason: string;
  notes?: string;
  /** `mowerKind` from the week plan; older demo rows name the mower as `mower`. */
  details: { hocMm?: number; mowerKind?: string; mower?: string } & Record<string, unknown>;
  version: number;
  siteLat?: number;
  siteLng?: number;
  photoCount?: number;
}

/** Work orders the caller may read, from `from` for a week unless `to` is given. */
export async function fetchWorkOrders(query: { from?: string; to?: string; crewId?: number }, signal?: AbortSignal): Promise<WorkOrderRow[]> {
  return (await api.get<{ items: WorkOrderRow[] }>('/work-orders', query, signal)).items;
}

/** A crew's report as the API takes it (`workReportSchema`). */
export interface WorkReportBody {
  status: WorkReport;
  actualHours: number | null;
  note: string;
  clientRef: string;
  /** The moment reported, with the phone's offset; the API takes the department's date of it. */
  reportedAt: string;
}

export interface WorkUpdate {
  id: number;
  status: WorkStatus;
  actualHours: number | null;
  note: string;
  reportedAt: string;
}

export interface WorkPhoto {
  id: number;
  width: number;
  height: number;
  bytes: number;
  url: string;
}

export function reportWork(orderId: number, body: WorkReportBody) {
  return api.post<{ order: WorkOrderRow; update: WorkUpdate; duplicate: boolean }>(`/work-orders/${orderId}/reports`, body);
}

export function uploadWorkPhoto(orderId: number, photo: Blob, name: string, clientRef: string) {
  const form = new FormData();
  form.append('clientRef', clientRef);
  form.append('photo', photo, name);
  return api.upload<{ photo: WorkPhoto; duplicate: boolean }>(`/work-orders/${orderId}/photos`, form);
}

export function getWorkOrder(orderId: number, signal?: AbortSignal) {
  return api.get<{ order: WorkOrderRow; updates: WorkUpdate[]; photos: WorkPhoto[] }>(`/work-orders/${orderId}`, undefined, signal);
}
