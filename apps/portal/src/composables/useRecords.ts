import { toValue, type MaybeRefOrGetter } from 'vue';
import { queryKeys } from '../api/queryKeys.ts';
import { getRecords } from '../api/records.ts';
import { useApiQuery } from './useApiQuery.ts';

export function useRecords(query: MaybeRefOrGetter<{ districtId?: number; from: string; to: string }>) {
  return useApiQuery(() => queryKeys.records(toValue(query)), (signal) => getRecords(toValue(query), signal));
}
