import { updateUserSchema, type UserRow } from '@swardwise/domain';
import { ElMessage, ElMessageBox } from 'element-plus';
import { errorMessage, isConflict } from '../api/messages.ts';
import { updateUser } from '../api/users.ts';
import { confirmed } from '../utils/confirm.ts';

/** Deactivation and reactivation with a confirmation, and the shared answer to a 409. */
export function useUserActions(reload: () => Promise<void>) {
  async function conflict(error: unknown) {
    await ElMessageBox.alert(errorMessage(error), 'This user has changed', { confirmButtonText: 'Reload', type: 'warning' }).catch(() => undefined);
    await reload();
  }

  async function setActive(user: UserRow, active: boolean) {
    const verb = active ? 'Reactivate' : 'Deactivate';
    const message = active
      ? `${user.name} will be able to sign in again with their current password.`
      : `${user.name} will be signed out everywhere and cannot sign in until reactivated. Their history stays.`;
    if (!(await confirmed(message, `${verb} ${user.name}?`, { confirm: verb, type: active ? 'info' : 'warning', danger: !active }))) return;
    try {
      // Without a role the API keeps the stored role and scope: only `active` changes.
      const patch = updateUserSchema.parse({ version: user.version, active });
      await updateUser(user.id, patch);
      ElMessage.success(`${user.name} is ${active ? 'active again' : 'deactivated'}.`);
      await reload();
    } catch (error) {
      if (isConflict(error)) return conflict(error);
      ElMessage.error(errorMessage(error));
    }
  }

  return { setActive, conflict };
}
