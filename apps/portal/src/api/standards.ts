import type { StandardAnswer, StandardsAnswer, StandardsRow, UpdateLevelStandardInput } from '@swardwise/domain';
import { api } from './client.ts';

export function getStandards(signal?: AbortSignal): Promise<StandardsAnswer> {
  return api.get<StandardsAnswer>('/standards', undefined, signal);
}

export async function updateStandard(level: number, input: UpdateLevelStandardInput): Promise<StandardsRow> {
  return (await api.patch<StandardAnswer>(`/standards/${level}`, input)).standard;
}
