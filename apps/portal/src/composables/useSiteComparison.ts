import { toValue, type MaybeRefOrGetter } from 'vue';
import type { CompareQuery } from '@swardwise/domain';
import { getSiteComparison } from '../api/compare.ts';
import { queryKeys } from '../api/queryKeys.ts';
import { useApiQuery } from './useApiQuery.ts';

export function useSiteComparison(query: MaybeRefOrGetter<Partial<CompareQuery>>) {
  return useApiQuery(() => queryKeys.compareSites(toValue(query)), (signal) => getSiteComparison(toValue(query), signal));
}
