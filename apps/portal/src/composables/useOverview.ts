import type { OverviewQuery } from '@swardwise/domain';
import { toValue, type MaybeRefOrGetter } from 'vue';
import { getOverview } from '../api/overview.ts';
import { queryKeys } from '../api/queryKeys.ts';
import { useApiQuery } from './useApiQuery.ts';

export function useOverview(query: MaybeRefOrGetter<OverviewQuery>) {
  return useApiQuery(() => queryKeys.overview(toValue(query)), (signal) => getOverview(toValue(query), signal));
}
