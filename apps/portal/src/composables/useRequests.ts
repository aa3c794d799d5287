import type { RequestListQuery } from '@swardwise/domain';
import { toValue, type MaybeRefOrGetter } from 'vue';
import { getRequest, listRequests } from '../api/requests.ts';
import { queryKeys } from '../api/queryKeys.ts';
import { useApiQuery } from './useApiQuery.ts';

/** The partners' requests the signed-in person may read (a partner's sites, a foreman's district). */
export function useRequests(query: MaybeRefOrGetter<RequestListQuery> = {}) {
  return useApiQuery(() => queryKeys.requests(toValue(query)), (signal) => listRequests(toValue(query), signal));
}

/** One request with its thread, photos and work; nothing is fetched while `id` is null. */
export function useRequest(id: MaybeRefOrGetter<number | null>) {
  return useApiQuery(
    () => queryKeys.request(toValue(id) ?? 0),
    (signal) => getRequest(toValue(id)!, signal),
    { enabled: () => toValue(id) !== null },
  );
}
