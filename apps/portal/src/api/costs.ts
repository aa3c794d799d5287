import type { CostSettingsAnswer, UpdateCostSettingsInput } from '@swardwise/domain';
import { api } from './client.ts';

export function getCosts(signal?: AbortSignal): Promise<CostSettingsAnswer> {
  return api.get<CostSettingsAnswer>('/costs', undefined, signal);
}

export function updateCosts(input: UpdateCostSettingsInput): Promise<CostSettingsAnswer> {
  return api.patch<CostSettingsAnswer>('/costs', input);
}
