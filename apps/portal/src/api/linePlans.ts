import type { FieldLinePlan, SetFieldLinePlanInput } from '@swardwise/domain';
import { api } from './client.ts';

export async function getFieldLinePlan(fieldId: number, signal?: AbortSignal): Promise<FieldLinePlan> {
  return (await api.get<{ linePlan: FieldLinePlan }>(`/fields/${fieldId}/lines`, undefined, signal)).linePlan;
}

/** Saves the field's line plan at the plan row's version. */
export async function updateFieldLinePlan(fieldId: number, input: SetFieldLinePlanInput): Promise<FieldLinePlan> {
  return (await api.patch<{ linePlan: FieldLinePlan }>(`/fields/${fieldId}/lines`, input)).linePlan;
}

/** Where the set-out sheet PDF of the saved plan is downloaded. */
export function setOutPdfUrl(fieldId: number, season: string, paper: 'a4' | 'letter'): string {
  return `/api/fields/${fieldId}/lines/set-out.pdf?season=${encodeURIComponent(season)}&paper=${paper}`;
}
