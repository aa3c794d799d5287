import type { WhatIfAnswer, WhatIfCompareAnswer, WhatIfInput, WhatIfScenarioList, WhatIfScenarioRow } from '@swardwise/domain';
import { api } from './client.ts';

/** The season's change if the fields moved and the Standards changed; nothing is saved. */
export function previewWhatIf(input: WhatIfInput): Promise<WhatIfAnswer> {
  return api.post<WhatIfAnswer>('/what-if', input);
}

export async function listScenarios(signal?: AbortSignal): Promise<WhatIfScenarioRow[]> {
  return (await api.get<WhatIfScenarioList>('/what-if/scenarios', undefined, signal)).items;
}

export async function saveScenario(name: string, change: WhatIfInput): Promise<WhatIfScenarioRow> {
  return (await api.post<{ scenario: WhatIfScenarioRow }>('/what-if/scenarios', { name, change })).scenario;
}

export async function removeScenario(id: number): Promise<void> {
  await api.delete<void>(`/what-if/scenarios/${id}`);
}

/** Two to four saved scenarios, each worked out again against today's outlook. */
export function compareScenarios(ids: readonly number[], signal?: AbortSignal): Promise<WhatIfCompareAnswer> {
  return api.get<WhatIfCompareAnswer>('/what-if/scenarios/compare', { ids: ids.join(',') }, signal);
}
