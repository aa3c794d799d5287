import { ElMessage, ElMessageBox } from 'element-plus';
import { ApiError } from '../api/client.ts';
import { errorMessage } from '../api/messages.ts';

/**
 * Deletes a row after a confirmation, sending the version the person saw; a 409 says
 * someone else changed it and reloads the list.
 */
export function useDeleteRow<Row extends { id: number; version: number }>(what: string, remove: (id: number, version: number) => Promise<void>, reload: () => Promise<void>) {
  return async function deleteRow(row: Row, name: string, consequence = '') {
    try {
      await ElMessageBox.confirm(`${name} will be removed.${consequence ? ` ${consequence}` : ''}`, `Delete ${name}?`, {
        confirmButtonText: 'Delete',
        cancelButtonText: 'Cancel',
        type: 'warning',
        confirmButtonClass: 'el-button--danger',
      });
    } catch {
      return false;
    }
    try {
      await remove(row.id, row.version);
      ElMessage.success(`${name} is deleted.`);
      await reload();
      return true;
    } catch (error) {
      if (error instanceof ApiError && error.code.endsWith('/version_conflict')) {
        ElMessage.warning(`Someone else changed this ${what} in the meantime; the list is reloaded — check it and delete again if you still mean to.`);
        await reload();
        return false;
      }
      ElMessage.error(errorMessage(error));
      return false;
    }
  };
}
