import { api } from './client.ts';
import type { DistrictRow, Items } from './types.ts';

export async function listDistricts(signal?: AbortSignal): Promise<DistrictRow[]> {
  return (await api.get<Items<DistrictRow>>('/districts', undefined, signal)).items;
}
