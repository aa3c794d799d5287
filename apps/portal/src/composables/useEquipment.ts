import { listEquipment } from '../api/equipment.ts';
import { useAsync } from './useAsync.ts';

export function useEquipment() {
  return useAsync((_key: undefined, signal) => listEquipment(signal));
}
