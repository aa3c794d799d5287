import type { DistrictList, DistrictRow } from '@swardwise/domain';
import { api } from './client.ts';

export async function listDistricts(signal?: AbortSignal): Promise<DistrictRow[]> {
  return (await api.get<DistrictList>('/districts', undefined, signal)).items;
}
