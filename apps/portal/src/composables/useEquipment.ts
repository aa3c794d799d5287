import { listEquipment } from '../api/equipment.ts';
import { queryKeys } from '../api/queryKeys.ts';
import { useApiQuery } from './useApiQuery.ts';

export function useEquipment() {
  return useApiQuery(queryKeys.equipment(), listEquipment);
}
