import type { MaybeRefOrGetter } from 'vue';
import { type FieldEventQuery, listFieldEvents } from '../api/fieldEvents.ts';
import { useAsync } from './useAsync.ts';

/** Bookings matching a query (by default the API's: from today for three months). */
export function useFieldEvents(query: MaybeRefOrGetter<FieldEventQuery>) {
  return useAsync((q, signal) => listFieldEvents(q, signal), query);
}
