import { useQuasar } from 'quasar';
import { computed } from 'vue';

const STORAGE_KEY = 'tarnish.dark';

/** Light/dark switch remembered in this browser; follows the system until the user picks one. */
export function useDarkMode() {
  const $q = useQuasar();
  const stored = localStorage.getItem(STORAGE_KEY);
  if (stored === 'on' || stored === 'off') $q.dark.set(stored === 'on');

  const isDark = computed(() => $q.dark.isActive);
  function toggle(): void {
    const next = !$q.dark.isActive;
    $q.dark.set(next);
    localStorage.setItem(STORAGE_KEY, next ? 'on' : 'off');
  }
  return { isDark, toggle };
}
