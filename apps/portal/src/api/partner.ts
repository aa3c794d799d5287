import type { PartnerFieldAnswer, PartnerFieldsAnswer } from '@swardwise/domain';
import { api } from './client.ts';

export async function listPartnerFields(signal?: AbortSignal): Promise<PartnerFieldsAnswer> {
  return api.get<PartnerFieldsAnswer>('/partner/fields', {}, signal);
}

export async function getPartnerField(id: number, signal?: AbortSignal): Promise<PartnerFieldAnswer> {
  return api.get<PartnerFieldAnswer>(`/partner/fields/${id}`, {}, signal);
}
