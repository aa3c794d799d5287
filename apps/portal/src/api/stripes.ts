import type { FieldStripes, SetFieldStripesInput } from '@swardwise/domain';
import { api } from './client.ts';

export async function getFieldStripes(fieldId: number, signal?: AbortSignal): Promise<FieldStripes> {
  return (await api.get<{ stripes: FieldStripes }>(`/fields/${fieldId}/stripes`, undefined, signal)).stripes;
}

/** Sets the field's pattern (or clears it with `pattern: null`) at the stripe row's version. */
export async function updateFieldStripes(fieldId: number, input: SetFieldStripesInput): Promise<FieldStripes> {
  return (await api.patch<{ stripes: FieldStripes }>(`/fields/${fieldId}/stripes`, input)).stripes;
}
