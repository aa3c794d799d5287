import type { CreateFieldInput, UpdateFieldInput } from '@swardwise/domain';
import { api } from './client.ts';
import type { FieldDetail, FieldRow, Items } from './types.ts';

export async function listFields(query: { districtId?: number; siteId?: number } = {}, signal?: AbortSignal): Promise<FieldRow[]> {
  return (await api.get<Items<FieldRow>>('/fields', query, signal)).items;
}

export async function getField(id: number, signal?: AbortSignal): Promise<FieldDetail> {
  return (await api.get<{ field: FieldDetail }>(`/fields/${id}`, undefined, signal)).field;
}

export async function createField(input: CreateFieldInput): Promise<FieldDetail> {
  return (await api.post<{ field: FieldDetail }>('/fields', input)).field;
}

export async function updateField(id: number, input: UpdateFieldInput): Promise<FieldDetail> {
  return (await api.patch<{ field: FieldDetail }>(`/fields/${id}`, input)).field;
}

export async function deleteField(id: number, version: number): Promise<void> {
  await api.delete<void>(`/fields/${id}?version=${version}`);
}
