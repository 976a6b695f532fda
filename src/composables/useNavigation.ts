import { computed, type ComputedRef } from 'vue';
import { useRouter } from 'vue-router';
import { allows } from '@shared/access/capabilities';
import type { Role } from '@shared/schemas/auth';

export interface NavItem {
  name: string;
  label: string;
  icon: string;
  caption?: string;
}

/** The navigation entries a role may use, read from the routes' `meta.nav` and `meta.access`. */
export function useNavigation(role: () => Role | null): ComputedRef<NavItem[]> {
  const router = useRouter();
  return computed(() => {
    const current = role();
    if (!current) return [];
    return router
      .getRoutes()
      .filter((r) => r.meta.nav && typeof r.name === 'string' && r.meta.access && allows(current, r.meta.access))
      .map((r) => ({ name: r.name as string, ...r.meta.nav! }));
  });
}
