import type { UnitSystem } from '@swardwise/domain';
import { ElMessage } from 'element-plus';
import { useRouter } from 'vue-router';
import { errorMessage } from '../api/messages.ts';
import { useSessionStore } from '../stores/session.ts';
import { useAction } from './useAction.ts';

/** The account's own controls (units, sign out), shared by the header and the phone menu. */
export function useAccount() {
  const session = useSessionStore();
  const router = useRouter();
  const { busy: savingUnits, run } = useAction({ toast: true });

  async function changeUnits(next: UnitSystem) {
    await run(() => session.setUnits(next));
  }

  async function signOut() {
    try {
      await session.signOut();
    } catch (error) {
      ElMessage.warning(errorMessage(error));
    }
    await router.push('/sign-in');
  }

  return { session, savingUnits, changeUnits, signOut };
}
