import { queryKeys } from '../api/queryKeys.ts';
import { getStandards } from '../api/standards.ts';
import { useApiQuery } from './useApiQuery.ts';

export function useStandards() {
  return useApiQuery(queryKeys.standards(), getStandards);
}
