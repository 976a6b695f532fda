import type { Router } from 'vue-router';
import { setUnauthorizedHandler } from 'src/api/http';
import { useAuthStore } from 'src/stores/auth-store';

/** When any API call says the session has ended, forget it and go to sign-in. */
export function installAuthBoot(router: Router): void {
  setUnauthorizedHandler(() => {
    const auth = useAuthStore();
    if (!auth.user) return;
    auth.clear();
    void router.push({ name: 'sign-in', query: { next: router.currentRoute.value.fullPath } });
  });
}
