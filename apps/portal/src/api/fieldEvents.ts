import type { CreateFieldEventInput, FieldEventAnswer, FieldEventList, FieldEventRow, UpdateFieldEventInput } from '@swardwise/domain';
import { api } from './client.ts';

/** Without dates the API answers from today for three months. */
export interface FieldEventQuery {
  from?: string;
  to?: string;
  fieldId?: number;
  siteId?: number;
  districtId?: number;
}

export async function listFieldEvents(query: FieldEventQuery, signal?: AbortSignal): Promise<FieldEventRow[]> {
  return (await api.get<FieldEventList>('/field-events', { ...query }, signal)).items;
}

export async function createFieldEvent(input: CreateFieldEventInput): Promise<FieldEventRow> {
  return (await api.post<FieldEventAnswer>('/field-events', input)).event;
}

export async function updateFieldEvent(id: number, input: UpdateFieldEventInput): Promise<FieldEventRow> {
  return (await api.patch<FieldEventAnswer>(`/field-events/${id}`, input)).event;
}

export async function removeFieldEvent(id: number, version: number): Promise<void> {
  await api.delete<void>(`/field-events/${id}?version=${version}`);
}
