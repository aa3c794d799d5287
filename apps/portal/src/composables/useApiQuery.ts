import { useQuery, type QueryKey } from '@tanstack/vue-query';
import { computed, toValue, watch, type ComputedRef, type MaybeRefOrGetter } from 'vue';
import { ApiError } from '../api/client.ts';
import { errorMessage } from '../api/messages.ts';
import { useSessionStore } from '../stores/session.ts';

export interface QueryState<T> {
  data: ComputedRef<T | null>;
  /** True while there is nothing to show yet, or the answer shown is the previous key's. */
  loading: ComputedRef<boolean>;
  error: ComputedRef<string | null>;
  refetch: () => Promise<void>;
}

/**
 * One answer of the API through the query cache (see `api/queryClient.ts`), in the shape every
 * page reads: `{ data, loading, error, refetch }`. A 401 ends the session.
 */
export function useApiQuery<T>(
  key: MaybeRefOrGetter<QueryKey>,
  fetcher: (signal: AbortSignal) => Promise<T>,
  options: { enabled?: MaybeRefOrGetter<boolean> } = {},
): QueryState<T> {
  const session = useSessionStore();
  const query = useQuery({
    queryKey: computed(() => toValue(key)),
    queryFn: ({ signal }) => fetcher(signal),
    enabled: computed(() => toValue(options.enabled ?? true)),
  });
  watch(query.error, (cause) => {
    if (cause instanceof ApiError && cause.status === 401) session.expire(cause);
  });
  return {
    data: computed(() => (query.data.value as T | undefined) ?? null),
    loading: computed(() => query.isLoading.value || (query.isFetching.value && query.isPlaceholderData.value)),
    error: computed(() => (query.error.value ? errorMessage(query.error.value) : null)),
    refetch: async () => {
      await query.refetch();
    },
  };
}
