import type { MaybeRefOrGetter } from 'vue';
import { fetchRecords } from '../api/weekPlans.ts';
import { useAsync } from './useAsync.ts';

export function useRecords(query: MaybeRefOrGetter<{ districtId?: number; from: string; to: string }>) {
  return useAsync((q, signal) => fetchRecords(q, signal), query);
}
