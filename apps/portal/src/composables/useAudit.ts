import { toValue, type MaybeRefOrGetter } from 'vue';
import { listAudit } from '../api/audit.ts';
import { queryKeys } from '../api/queryKeys.ts';
import { useApiQuery } from './useApiQuery.ts';

export function useAudit(query: MaybeRefOrGetter<{ entity?: string; limit?: number }> = {}) {
  return useApiQuery(() => queryKeys.audit(toValue(query)), (signal) => listAudit(toValue(query), signal));
}
