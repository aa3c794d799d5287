import type { WorkStatus, WorkTask } from '@swardwise/domain';
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
  plannedHours: number;
  actualHours: number | null;
  status: WorkStatus;
  reason: string;
  details: { hocMm?: number; mower?: string } & Record<string, unknown>;
  version: number;
}

/** Work orders the caller may read, from `from` for a week unless `to` is given. */
export async function fetchWorkOrders(query: { from?: string; to?: string; crewId?: number }, signal?: AbortSignal): Promise<WorkOrderRow[]> {
  return (await api.get<{ items: WorkOrderRow[] }>('/work-orders', query, signal)).items;
}
