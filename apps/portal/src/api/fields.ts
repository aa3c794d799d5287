import type { CreateFieldInput, FieldAnswer, FieldDetail, FieldList, FieldNeeds, FieldNeedsAnswer, FieldRow, UpdateFieldInput } from '@swardwise/domain';
import { api } from './client.ts';

export async function listFields(query: { districtId?: number; siteId?: number } = {}, signal?: AbortSignal): Promise<FieldRow[]> {
  return (await api.get<FieldList>('/fields', query, signal)).items;
}

export async function getField(id: number, signal?: AbortSignal): Promise<FieldDetail> {
  return (await api.get<FieldAnswer>(`/fields/${id}`, undefined, signal)).field;
}

export async function createField(input: CreateFieldInput): Promise<FieldDetail> {
  return (await api.post<FieldAnswer>('/fields', input)).field;
}

export async function updateField(id: number, input: UpdateFieldInput): Promise<FieldDetail> {
  return (await api.patch<FieldAnswer>(`/fields/${id}`, input)).field;
}

export async function removeField(id: number, version: number): Promise<void> {
  await api.delete<void>(`/fields/${id}?version=${version}`);
}

/** What the turf engine says a field needs for the week of `date` (today when undefined). */
export async function getFieldNeeds(id: number, date?: string, signal?: AbortSignal): Promise<FieldNeeds> {
  return (await api.get<FieldNeedsAnswer>(`/fields/${id}/needs`, { date }, signal)).needs;
}
