import { listCrews } from '../api/crews.ts';
import { useAsync } from './useAsync.ts';

export function useCrews() {
  return useAsync((_key: undefined, signal) => listCrews(signal));
}
