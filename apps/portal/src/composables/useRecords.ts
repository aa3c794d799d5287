import type { MaybeRefOrGetter } from 'vue';
import { getRecords } from '../api/records.ts';
import { useAsync } from './useAsync.ts';

export function useRecords(query: MaybeRefOrGetter<{ districtId?: number; from: string; to: string }>) {
  return useAsync((q, signal) => getRecords(q, signal), query);
}
