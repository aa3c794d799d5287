import { onBeforeUnmount, ref } from 'vue';

/** The width under which pages take their phone layout (the same as the CSS breakpoints). */
export const PHONE_QUERY = '(max-width: 800px)';

/** True while the window is phone-wide; follows rotation and resizing. */
export function usePhone() {
  const query = typeof window !== 'undefined' && window.matchMedia ? window.matchMedia(PHONE_QUERY) : null;
  const phone = ref(query?.matches ?? false);
  const follow = (e: MediaQueryListEvent) => (phone.value = e.matches);
  query?.addEventListener('change', follow);
  onBeforeUnmount(() => query?.removeEventListener('change', follow));
  return phone;
}
