import type { CreateFieldEventInput, UpdateFieldEventInput } from '@swardwise/domain';
import { api } from './client.ts';
import type { FieldEventRow, Items } from './types.ts';

export interface FieldEventQuery {
  from?: string;
  to?: string;
  fieldId?: number;
  siteId?: number;
  districtId?: number;
}

export async function listFieldEvents(query: FieldEventQuery, signal?: AbortSignal): Promise<FieldEventRow[]> {
  return (await api.get<Items<FieldEventRow>>('/field-events', { ...query }, signal)).items;
}

export async function createFieldEvent(input: CreateFieldEventInput): Promise<FieldEventRow> {
  return (await api.post<{ event: FieldEventRow }>('/field-events', input)).event;
}

export async function updateFieldEvent(id: number, input: UpdateFieldEventInput): Promise<FieldEventRow> {
  return (await api.patch<{ event: FieldEventRow }>(`/field-events/${id}`, input)).event;
}

export async function deleteFieldEvent(id: number, version: number): Promise<void> {
  await api.delete(`/field-events/${id}?version=${version}`);
}
