import { toValue, type MaybeRefOrGetter } from 'vue';
import { queryKeys } from '../api/queryKeys.ts';
import { getSite, listSites } from '../api/sites.ts';
import { useApiQuery } from './useApiQuery.ts';

export function useSites(query: MaybeRefOrGetter<{ districtId?: number }> = {}) {
  return useApiQuery(() => queryKeys.sites(toValue(query)), (signal) => listSites(toValue(query), signal));
}

export function useSite(id: MaybeRefOrGetter<number>) {
  return useApiQuery(() => queryKeys.site(toValue(id)), (signal) => getSite(toValue(id), signal));
}
