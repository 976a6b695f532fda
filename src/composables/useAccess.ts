import { computed, type ComputedRef } from 'vue';
import { allows, type Access } from '@shared/access/capabilities';
import { useAuthStore } from 'src/stores/auth-store';

/** Whether the signed-in user has an access from the capability table, kept up to date with their role. */
export function useAccess(access: Access): ComputedRef<boolean> {
  const auth = useAuthStore();
  return computed(() => allows(auth.role, access));
}
