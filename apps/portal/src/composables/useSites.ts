import type { MaybeRefOrGetter } from 'vue';
import { getSite, listSites } from '../api/sites.ts';
import { useAsync } from './useAsync.ts';

export function useSites(query: MaybeRefOrGetter<{ districtId?: number }> = {}) {
  return useAsync((q, signal) => listSites(q, signal), query);
}

export function useSite(id: MaybeRefOrGetter<number>) {
  return useAsync((siteId, signal) => getSite(siteId, signal), id);
}
