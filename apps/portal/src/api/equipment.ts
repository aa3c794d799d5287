import type { CreateEquipmentInput, EquipmentAnswer, EquipmentList, EquipmentRow, UpdateEquipmentInput } from '@swardwise/domain';
import { api } from './client.ts';

export async function listEquipment(signal?: AbortSignal): Promise<EquipmentRow[]> {
  return (await api.get<EquipmentList>('/equipment', undefined, signal)).items;
}

export async function createEquipment(input: CreateEquipmentInput): Promise<EquipmentRow> {
  return (await api.post<EquipmentAnswer>('/equipment', input)).equipment;
}

export async function updateEquipment(id: number, input: UpdateEquipmentInput): Promise<EquipmentRow> {
  return (await api.patch<EquipmentAnswer>(`/equipment/${id}`, input)).equipment;
}

export async function removeEquipment(id: number, version: number): Promise<void> {
  await api.delete<void>(`/equipment/${id}?version=${version}`);
}
