import { toValue, type MaybeRefOrGetter } from 'vue';
import { listFieldEvents, type FieldEventQuery } from '../api/fieldEvents.ts';
import { queryKeys } from '../api/queryKeys.ts';
import { useApiQuery } from './useApiQuery.ts';

/** Bookings matching a query (by default the API's: from today for three months). */
export function useFieldEvents(query: MaybeRefOrGetter<FieldEventQuery>) {
  return useApiQuery(() => queryKeys.fieldEvents(toValue(query)), (signal) => listFieldEvents(toValue(query), signal));
}
