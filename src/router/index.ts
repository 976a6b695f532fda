import { Notify } from 'quasar';
import { allows } from '@shared/access/capabilities';
import { createRouter, createWebHistory, type Router } from 'vue-router';
import { useAuthStore } from 'src/stores/auth-store';
import { routes } from './routes';

/** The router with its one guard: signed-out visitors go to sign-in, roles are checked against `meta.access`. */
export function createAppRouter(): Router {
  const router = createRouter({ history: createWebHistory(), routes, scrollBehavior: () => ({ top: 0 }) });

  router.beforeEach(async (to) => {
    const auth = useAuthStore();
    if (!auth.loaded) await auth.load();
    if (to.meta.guestOnly && auth.user) return { name: 'overview' };
    if (!to.meta.access) return true;
    if (!auth.user) return { name: 'sign-in', query: to.fullPath === '/' ? {} : { next: to.fullPath } };
    if (!allows(auth.user.role, to.meta.access)) {
      Notify.create({ type: 'warning', message: 'Your role does not give access to that page.', position: 'top' });
      return { name: 'overview' };
    }
    return true;
  });

  router.afterEach((to) => {
    document.title = to.meta.title ? `${to.meta.title} · Tarnish` : 'Tarnish';
  });

  return router;
}
