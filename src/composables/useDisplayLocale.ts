import { ref } from 'vue';
import { displayLocale, setDisplayLocale, supportedLocale, type DateStyle, type DisplayLocale } from '@shared/text/format';

const STORAGE_KEY = 'tarnish.locale';
const DATE_STYLES: readonly DateStyle[] = ['short', 'medium', 'long'];

/** The user's choice in this browser, or the browser's own language with medium dates. */
function stored(): DisplayLocale {
  try {
    const saved = JSON.parse(localStorage.getItem(STORAGE_KEY) ?? 'null') as Partial<DisplayLocale> | null;
    return {
      locale: supportedLocale(saved?.locale ?? navigator.language),
      dateStyle: saved?.dateStyle && DATE_STYLES.includes(saved.dateStyle) ? saved.dateStyle : 'medium',
    };
  } catch {
    return { locale: supportedLocale(navigator.language), dateStyle: 'medium' };
  }
}

/** Called once before the app mounts: every date and number then follows the user's setting. */
export function applyStoredDisplayLocale(): void {
  setDisplayLocale(stored());
}

/** The locale setting of the account page: the choice, and saving it (the page reloads to show it everywhere). */
export function useDisplayLocale() {
  const choice = ref<DisplayLocale>({ ...displayLocale() });
  function save(next: DisplayLocale): void {
    localStorage.setItem(STORAGE_KEY, JSON.stringify({ locale: supportedLocale(next.locale), dateStyle: next.dateStyle }));
    window.location.reload();
  }
  return { choice, save, dateStyles: DATE_STYLES };
}
