import { listDistricts } from '../api/districts.ts';
import { useAsync } from './useAsync.ts';

export function useDistricts() {
  return useAsync((_key: undefined, signal) => listDistricts(signal));
}
