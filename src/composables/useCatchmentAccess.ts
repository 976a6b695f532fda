import { computed, type ComputedRef } from 'vue';
import { useAuthStore } from 'src/stores/auth-store';

/** Whether the signed-in user may change catchments (consultants and admins; scientists only read). */
export function useCatchmentAccess(): { canWrite: ComputedRef<boolean> } {
  const auth = useAuthStore();
  return { canWrite: computed(() => auth.role === 'consultant' || auth.role === 'admin') };
}
