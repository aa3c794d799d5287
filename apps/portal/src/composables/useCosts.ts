import { getCosts } from '../api/costs.ts';
import { queryKeys } from '../api/queryKeys.ts';
import { useApiQuery } from './useApiQuery.ts';

export function useCosts() {
  return useApiQuery(queryKeys.costs(), getCosts);
}
