import type { CreateCrewInput, CreateEquipmentInput, UpdateCrewInput, UpdateEquipmentInput } from '@swardwise/domain';
import { api } from './client.ts';
import type { CrewRow, EquipmentRow, Items } from './types.ts';

export async function listCrews(signal?: AbortSignal): Promise<CrewRow[]> {
  return (await api.get<Items<CrewRow>>('/crews', undefined, signal)).items;
}

export async function createCrew(input: CreateCrewInput): Promise<CrewRow> {
  return (await api.post<{ crew: CrewRow }>('/crews', input)).crew;
}

export async function updateCrew(id: number, input: UpdateCrewInput): Promise<CrewRow> {
  return (await api.patch<{ crew: CrewRow }>(`/crews/${id}`, input)).crew;
}

export async function deleteCrew(id: number, version: number): Promise<void> {
  await api.delete(`/crews/${id}?version=${version}`);
}

export async function listEquipment(signal?: AbortSignal): Promise<EquipmentRow[]> {
  return (await api.get<Items<EquipmentRow>>('/equipment', undefined, signal)).items;
}

export async function createEquipment(input: CreateEquipmentInput): Promise<EquipmentRow> {
  return (await api.post<{ equipment: EquipmentRow }>('/equipment', input)).equipment;
}

export async function updateEquipment(id: number, input: UpdateEquipmentInput): Promise<EquipmentRow> {
  return (await api.patch<{ equipment: EquipmentRow }>(`/equipment/${id}`, input)).equipment;
}

export async function deleteEquipment(id: number, version: number): Promise<void> {
  await api.delete(`/equipment/${id}?version=${version}`);
}
