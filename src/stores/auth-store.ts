import { defineStore } from 'pinia';
import { computed, ref } from 'vue';
import type { MeResponse, Role, SignInRequest } from '@shared/schemas/auth';
import { authApi } from 'src/api/auth';
import { ApiError } from 'src/api/http';

/** The signed-in user and organisation; `loaded` once the first /api/me has answered. */
export const useAuthStore = defineStore('auth', () => {
  const session = ref<MeResponse | null>(null);
  const loaded = ref(false);

  const user = computed(() => session.value?.user ?? null);
  const organisation = computed(() => session.value?.organisation ?? null);
  const role = computed<Role | null>(() => session.value?.user.role ?? null);

  async function load(): Promise<void> {
    try {
      session.value = await authApi.me();
    } catch (err) {
      if (!(err instanceof ApiError) || err.status !== 401) throw err;
      session.value = null;
    } finally {
      loaded.value = true;
    }
  }

  async function signIn(body: SignInRequest): Promise<void> {
    session.value = await authApi.signIn(body);
    loaded.value = true;
  }

  /** Finishes a sign-up from its mailed link: the new admin is signed in. */
  async function confirmSignUp(token: string): Promise<void> {
    session.value = await authApi.confirmSignUp(token);
    loaded.value = true;
  }

  async function signOut(): Promise<void> {
    try {
      await authApi.signOut();
    } finally {
      session.value = null;
    }
  }

  /** Forget the session locally (the server said it ended). */
  function clear(): void {
    session.value = null;
  }

  return { session, loaded, user, organisation, role, load, signIn, confirmSignUp, signOut, clear };
});
