import { api } from './client.ts';
import type { CrewRow, Items } from './types.ts';

export async function listCrews(signal?: AbortSignal): Promise<CrewRow[]> {
  return (await api.get<Items<CrewRow>>('/crews', undefined, signal)).items;
}
