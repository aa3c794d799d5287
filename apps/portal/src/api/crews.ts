import type { CreateCrewInput, CrewAnswer, CrewList, CrewRow, StoredCrew, UpdateCrewInput } from '@swardwise/domain';
import { api } from './client.ts';

export async function listCrews(signal?: AbortSignal): Promise<CrewRow[]> {
  return (await api.get<CrewList>('/crews', undefined, signal)).items;
}

export async function createCrew(input: CreateCrewInput): Promise<StoredCrew> {
  return (await api.post<CrewAnswer>('/crews', input)).crew;
}

export async function updateCrew(id: number, input: UpdateCrewInput): Promise<StoredCrew> {
  return (await api.patch<CrewAnswer>(`/crews/${id}`, input)).crew;
}

export async function removeCrew(id: number, version: number): Promise<void> {
  await api.delete<void>(`/crews/${id}?version=${version}`);
}
