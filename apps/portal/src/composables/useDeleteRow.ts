import { ElMessage } from 'element-plus';
import { errorMessage, isConflict } from '../api/messages.ts';
import { confirmed } from '../utils/confirm.ts';

/**
 * Deletes a row after a confirmation, sending the version the person saw; a 409 says
 * someone else changed it and reloads the list.
 */
export function useDeleteRow<Row extends { id: number; version: number }>(remove: (id: number, version: number) => Promise<void>, reload: () => Promise<void>) {
  return async function deleteRow(row: Row, name: string, consequence = '') {
    if (!(await confirmed(`${name} will be removed.${consequence ? ` ${consequence}` : ''}`, `Delete ${name}?`, { confirm: 'Delete', danger: true }))) return false;
    try {
      await remove(row.id, row.version);
      ElMessage.success(`${name} is deleted.`);
      await reload();
      return true;
    } catch (error) {
      if (isConflict(error)) {
        ElMessage.warning(errorMessage(error));
        await reload();
        return false;
      }
      ElMessage.error(errorMessage(error));
      return false;
    }
  };
}
