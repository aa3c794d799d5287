import type { UnitSystem } from '@swardwise/domain';
import { ElMessage } from 'element-plus';
import { ref } from 'vue';
import { useRouter } from 'vue-router';
import { errorMessage } from '../api/messages.ts';
import { useSessionStore } from '../stores/session.ts';

/** The account's own controls (units, sign out), shared by the header and the phone menu. */
export function useAccount() {
  const session = useSessionStore();
  const router = useRouter();
  const savingUnits = ref(false);

  async function changeUnits(next: UnitSystem) {
    savingUnits.value = true;
    try {
      await session.setUnits(next);
    } catch (error) {
      ElMessage.error(errorMessage(error));
    } finally {
      savingUnits.value = false;
    }
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
