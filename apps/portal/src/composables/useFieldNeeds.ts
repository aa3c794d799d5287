import type { MaybeRefOrGetter } from 'vue';
import { getFieldNeeds } from '../api/fields.ts';
import { useAsync } from './useAsync.ts';

/** What the turf engine says a field needs for the week of `date` (today when undefined). */
/** `version` (the field row's) only triggers a reload after the field changes. */
export function useFieldNeeds(key: MaybeRefOrGetter<{ id: number; date?: string | undefined; version?: number | undefined }>) {
  return useAsync((k, signal) => getFieldNeeds(k.id, k.date, signal), key);
}
