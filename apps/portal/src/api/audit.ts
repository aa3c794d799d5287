import type { AuditEntry, AuditList } from '@swardwise/domain';
import { api } from './client.ts';

export async function listAudit(query: { entity?: string; limit?: number } = {}, signal?: AbortSignal): Promise<AuditEntry[]> {
  return (await api.get<AuditList>('/audit', query, signal)).items;
}
