import { onScopeDispose, ref, shallowRef, toValue, watch, type MaybeRefOrGetter, type Ref, type ShallowRef } from 'vue';
import { ApiError } from '../api/client.ts';
import { errorMessage } from '../api/messages.ts';
import { useSessionStore } from '../stores/session.ts';

export interface AsyncState<T> {
  data: ShallowRef<T | null>;
  loading: Ref<boolean>;
  error: Ref<string | null>;
  refetch: () => Promise<void>;
}

/**
 * Loads data with a fetcher and reloads it when its key changes; a reload cancels the
 * request still under way so a slow old answer cannot overwrite a new one.
 */
export function useAsync<T, K = undefined>(
  fetcher: (key: K, signal: AbortSignal) => Promise<T>,
  key?: MaybeRefOrGetter<K>,
): AsyncState<T> {
  const data = shallowRef<T | null>(null);
  const loading = ref(false);
  const error = ref<string | null>(null);
  const session = useSessionStore();
  let controller: AbortController | null = null;

  async function refetch() {
    controller?.abort();
    const mine = new AbortController();
    controller = mine;
    loading.value = true;
    error.value = null;
    try {
      data.value = await fetcher(toValue(key) as K, mine.signal);
    } catch (cause) {
      if (mine.signal.aborted) return;
      if (cause instanceof ApiError && cause.status === 401) session.expire();
      error.value = errorMessage(cause);
    } finally {
      if (controller === mine) loading.value = false;
    }
  }

  watch(() => toValue(key), () => void refetch(), { immediate: true });
  onScopeDispose(() => controller?.abort());

  return { data, loading, error, refetch };
}
