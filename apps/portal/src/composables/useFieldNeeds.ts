import { toValue, type MaybeRefOrGetter } from 'vue';
import { getFieldNeeds } from '../api/fields.ts';
import { queryKeys } from '../api/queryKeys.ts';
import { useApiQuery } from './useApiQuery.ts';

/**
 * What the turf engine says a field needs for the week of `date` (today when undefined). A
 * write of the field makes it stale with the field (its key starts with `fields`).
 */
export function useFieldNeeds(key: MaybeRefOrGetter<{ id: number; date?: string | undefined }>) {
  return useApiQuery(
    () => {
      const k = toValue(key);
      return queryKeys.fieldNeeds(k.id, k.date ?? null);
    },
    (signal) => {
      const k = toValue(key);
      return getFieldNeeds(k.id, k.date, signal);
    },
  );
}
