import { api } from './client.ts';
import type { AuditEntry, Items } from './types.ts';

export async function listAudit(query: { entity?: string; limit?: number } = {}, signal?: AbortSignal): Promise<AuditEntry[]> {
  return (await api.get<Items<AuditEntry>>('/audit', query, signal)).items;
}
