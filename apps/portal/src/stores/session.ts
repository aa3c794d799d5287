import { actorOf, DEFAULT_TIME_ZONE, defineAbilityFor, isTimeZone, localToday, localWeekStart, type Role, type SessionAnswer, type SessionUser, type UnitSystem } from '@swardwise/domain';
import { defineStore } from 'pinia';
import { computed, ref } from 'vue';
import { ability } from '../ability.ts';
import * as auth from '../api/auth.ts';
import { ApiError } from '../api/client.ts';
import { errorMessage, messageFor } from '../api/messages.ts';
import { queryClient } from '../api/queryClient.ts';
import { forgetOfflineAnswers, refreshOfflineSession } from '../utils/offlineCache.ts';
import { setDisplayTimeZone } from '../utils/units.ts';

/** Where each role lands after sign-in and when a route is not theirs. */
const LANDING: Record<Role, string> = {
  admin: '/admin/users',
  head: '/overview',
  foreman: '/district',
  crew: '/today',
  partner: '/my-fields',
};

export const useSessionStore = defineStore('session', () => {
  const user = ref<SessionUser | null>(null);
  /** The department's IANA time zone, from the session answer. */
  const timeZone = ref(DEFAULT_TIME_ZONE);
  const loaded = ref(false);
  /** True once the person chose to sign out, so the end of the session is not treated as an expiry. */
  const signedOut = ref(false);
  /** Why the last session ended under the person (expired, access changed); the sign-in page says it. */
  const endNotice = ref<string | null>(null);
  let loading: Promise<void> | null = null;

  const units = computed<UnitSystem>(() => user.value?.units ?? 'imperial');
  const landing = computed(() => (user.value ? LANDING[user.value.role] : '/sign-in'));

  function setUser(next: SessionUser | null) {
    if (next) endNotice.value = null;
    // Answers cached for one person are not another's to see (nor a signed-out screen's).
    if (!next || next.id !== user.value?.id) queryClient.clear();
    // The service worker's copies too, but not when a page opens and learns who it is
    // (perhaps from those copies, with no signal).
    if (!next || (user.value && next.id !== user.value.id)) void forgetOfflineAnswers();
    user.value = next;
    if (next) signedOut.value = false;
    ability.update(next ? defineAbilityFor(actorOf(next)).rules : []);
  }

  function setSession(answer: SessionAnswer) {
    setTimeZone(answer.timeZone);
    setUser(answer.user);
  }

  /** Takes the department's zone (from a session answer or after an administrator changed it); a name the browser does not know is ignored. */
  function setTimeZone(next: string | undefined) {
    if (next && isTimeZone(next)) {
      timeZone.value = next;
      setDisplayTimeZone(next);
    }
  }

  /** The department's local date (YYYY-MM-DD) at `now`: the one "today" of every page. */
  function today(now: Date = new Date()): string {
    return localToday(timeZone.value, now);
  }

  /** Monday of the department's current week. */
  function weekStart(now: Date = new Date()): string {
    return localWeekStart(timeZone.value, now);
  }

  /** Asks the API once who is signed in; a 401 simply means nobody. */
  function load(): Promise<void> {
    if (loaded.value) return Promise.resolve();
    loading ??= auth
      .getMe()
      .then(setSession, (error: unknown) => {
        if (!(error instanceof ApiError && error.status === 401)) throw error;
        // A plain 401 here is nobody signed in; an ended one says why.
        if (error.code === 'auth/access_changed') endNotice.value = errorMessage(error);
        setUser(null);
      })
      .finally(() => {
        loaded.value = true;
        loading = null;
      });
    return loading;
  }

  async function signIn(email: string, password: string) {
    setSession(await auth.signIn(email, password));
    loaded.value = true;
    refreshOfflineSession();
  }

  async function acceptInvite(token: string, password: string) {
    setSession(await auth.acceptInvite(token, password));
    loaded.value = true;
    refreshOfflineSession();
  }

  async function resetPassword(token: string, password: string) {
    setSession(await auth.resetPassword(token, password));
    loaded.value = true;
    refreshOfflineSession();
  }

  async function signOut() {
    signedOut.value = true;
    try {
      await auth.signOut();
    } finally {
      // Forget the session locally even if the server is unreachable.
      setUser(null);
    }
  }

  async function setUnits(next: UnitSystem) {
    if (!user.value || user.value.units === next) return;
    setSession(await auth.updateMe({ version: user.value.version, units: next }));
    refreshOfflineSession();
  }

  /** Called when any request finds the session gone (401); the sign-in page says why. */
  function expire(cause?: unknown) {
    endNotice.value = cause instanceof ApiError && cause.status === 401 ? errorMessage(cause) : messageFor('auth/unauthenticated') ?? null;
    setUser(null);
  }

  return { user, timeZone, loaded, signedOut, endNotice, units, landing, load, signIn, acceptInvite, resetPassword, signOut, setUnits, expire, setTimeZone, today, weekStart };
});
