import type { MaybeRefOrGetter } from 'vue';
import { getField, listFields } from '../api/fields.ts';
import { useAsync } from './useAsync.ts';

export function useFields(query: MaybeRefOrGetter<{ districtId?: number; siteId?: number }> = {}) {
  return useAsync((q, signal) => listFields(q, signal), query);
}

export function useField(id: MaybeRefOrGetter<number>) {
  return useAsync((fieldId, signal) => getField(fieldId, signal), id);
}
