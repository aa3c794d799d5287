import type { CreateCrewInput, CrewAnswer, CrewList, CrewRow, UpdateCrewInput } from '@swardwise/domain';
import { api } from './client.ts';
import { rowWrites } from './rowWrites.ts';

export async function listCrews(signal?: AbortSignal): Promise<CrewRow[]> {
  return (await api.get<CrewList>('/crews', undefined, signal)).items;
}

const writes = rowWrites<CrewAnswer, CreateCrewInput, UpdateCrewInput>('crews', 'crew');
export const { create: createCrew, update: updateCrew, remove: removeCrew } = writes;
