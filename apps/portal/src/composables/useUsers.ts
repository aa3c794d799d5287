import { listUsers } from '../api/users.ts';
import { useAsync } from './useAsync.ts';

export function useUsers() {
  return useAsync((_key: undefined, signal) => listUsers(signal));
}
