import { listCrews } from '../api/crews.ts';
import { queryKeys } from '../api/queryKeys.ts';
import { useApiQuery } from './useApiQuery.ts';

export function useCrews() {
  return useApiQuery(queryKeys.crews(), listCrews);
}
