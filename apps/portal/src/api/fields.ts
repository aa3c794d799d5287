import { api } from './client.ts';
import type { FieldDetail, FieldRow, Items } from './types.ts';

export async function listFields(query: { districtId?: number; siteId?: number } = {}, signal?: AbortSignal): Promise<FieldRow[]> {
  return (await api.get<Items<FieldRow>>('/fields', query, signal)).items;
}

export async function getField(id: number, signal?: AbortSignal): Promise<FieldDetail> {
  return (await api.get<{ field: FieldDetail }>(`/fields/${id}`, undefined, signal)).field;
}
