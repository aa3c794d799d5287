import type { CreateEquipmentInput, EquipmentAnswer, EquipmentList, EquipmentRow, UpdateEquipmentInput } from '@swardwise/domain';
import { api } from './client.ts';
import { rowWrites } from './rowWrites.ts';

export async function listEquipment(signal?: AbortSignal): Promise<EquipmentRow[]> {
  return (await api.get<EquipmentList>('/equipment', undefined, signal)).items;
}

const writes = rowWrites<EquipmentAnswer, CreateEquipmentInput, UpdateEquipmentInput>('equipment', 'equipment');
export const { create: createEquipment, update: updateEquipment, remove: removeEquipment } = writes;
