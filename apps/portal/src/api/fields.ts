import type { CreateFieldInput, FieldAnswer, FieldDetail, FieldList, FieldNeeds, FieldNeedsAnswer, FieldRow, UpdateFieldInput } from '@swardwise/domain';
import { api } from './client.ts';
import { rowWrites } from './rowWrites.ts';

export async function listFields(query: { districtId?: number; siteId?: number } = {}, signal?: AbortSignal): Promise<FieldRow[]> {
  return (await api.get<FieldList>('/fields', query, signal)).items;
}

export async function getField(id: number, signal?: AbortSignal): Promise<FieldDetail> {
  return (await api.get<FieldAnswer>(`/fields/${id}`, undefined, signal)).field;
}

const writes = rowWrites<FieldAnswer, CreateFieldInput, UpdateFieldInput>('fields', 'field');
export const { create: createField, update: updateField, remove: removeField } = writes;

/** What the turf engine says a field needs for the week of `date` (today when undefined). */
export async function getFieldNeeds(id: number, date?: string, signal?: AbortSignal): Promise<FieldNeeds> {
  return (await api.get<FieldNeedsAnswer>(`/fields/${id}/needs`, { date }, signal)).needs;
}
