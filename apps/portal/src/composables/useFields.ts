import { toValue, type MaybeRefOrGetter } from 'vue';
import { getField, listFields } from '../api/fields.ts';
import { queryKeys } from '../api/queryKeys.ts';
import { useApiQuery } from './useApiQuery.ts';

export function useFields(query: MaybeRefOrGetter<{ districtId?: number; siteId?: number }> = {}) {
  return useApiQuery(() => queryKeys.fields(toValue(query)), (signal) => listFields(toValue(query), signal));
}

export function useField(id: MaybeRefOrGetter<number>) {
  return useApiQuery(() => queryKeys.field(toValue(id)), (signal) => getField(toValue(id), signal));
}
