import type { CreateFieldEventInput, FieldEventAnswer, FieldEventList, FieldEventRow, UpdateFieldEventInput } from '@swardwise/domain';
import { api } from './client.ts';
import { rowWrites } from './rowWrites.ts';

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

const writes = rowWrites<FieldEventAnswer, CreateFieldEventInput, UpdateFieldEventInput>('field-events', 'event');
export const { create: createFieldEvent, update: updateFieldEvent, remove: removeFieldEvent } = writes;
