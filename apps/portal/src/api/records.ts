import type { ApplicationsAnswer, Records } from '@swardwise/domain';
import { api } from './client.ts';

export function getRecords(query: { districtId?: number; from: string; to: string }, signal?: AbortSignal): Promise<Records> {
  return api.get<Records>('/records', query, signal);
}

export function listApplications(query: { districtId?: number; from: string; to: string }, signal?: AbortSignal): Promise<ApplicationsAnswer> {
  return api.get<ApplicationsAnswer>('/records/applications', query, signal);
}
