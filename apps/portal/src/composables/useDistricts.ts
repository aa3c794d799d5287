import { listDistricts } from '../api/districts.ts';
import { queryKeys } from '../api/queryKeys.ts';
import { useApiQuery } from './useApiQuery.ts';

export function useDistricts() {
  return useApiQuery(queryKeys.districts(), listDistricts);
}
