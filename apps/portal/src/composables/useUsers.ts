import { queryKeys } from '../api/queryKeys.ts';
import { listUsers } from '../api/users.ts';
import { useApiQuery } from './useApiQuery.ts';

export function useUsers() {
  return useApiQuery(queryKeys.users(), listUsers);
}
