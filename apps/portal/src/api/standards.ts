import type { DepartmentParameters, LevelStandard, UpdateLevelStandardInput } from '@swardwise/domain';
import { api } from './client.ts';

export interface StandardsRow {
  level: 1 | 2 | 3 | 4;
  data: LevelStandard;
  version: number;
  updatedAt: string;
  updatedBy: number | null;
}

export interface StandardsAnswer {
  levels: StandardsRow[];
  parameters: DepartmentParameters;
}

export function getStandards(signal?: AbortSignal): Promise<StandardsAnswer> {
  return api.get<StandardsAnswer>('/standards', undefined, signal);
}

export async function updateStandard(level: number, input: UpdateLevelStandardInput): Promise<StandardsRow> {
  return (await api.patch<{ standard: StandardsRow }>(`/standards/${level}`, input)).standard;
}
