import { toValue, type MaybeRefOrGetter } from 'vue';
import { listGameDays, type GameDayQuery } from '../api/gameDays.ts';
import { queryKeys } from '../api/queryKeys.ts';
import { useApiQuery } from './useApiQuery.ts';

/** Game-day preparations matching a query (by default the API's: from today for two months). */
export function useGameDays(query: MaybeRefOrGetter<GameDayQuery>) {
  return useApiQuery(() => queryKeys.gameDays(toValue(query)), (signal) => listGameDays(toValue(query), signal));
}
