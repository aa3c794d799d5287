import { getStandards } from '../api/standards.ts';
import { useAsync } from './useAsync.ts';

export function useStandards() {
  return useAsync((_key, signal) => getStandards(signal));
}
