import type { MaybeRefOrGetter } from 'vue';
import { listAudit } from '../api/audit.ts';
import { useAsync } from './useAsync.ts';

export function useAudit(query: MaybeRefOrGetter<{ entity?: string; limit?: number }> = {}) {
  return useAsync((q, signal) => listAudit(q, signal), query);
}
