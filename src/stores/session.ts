import { defineStore } from 'pinia';
import { computed, ref } from 'vue';
import type { LoginRequest, RegisterRequest, User } from '../../shared/schemas/auth';
import * as authApi from '@/api/auth';

/** Who is signed in. `loaded` turns true once the first /me answer came back. */
export const useSessionStore = defineStore('session', () => {
  const user = ref<User | null>(null);
  const loaded = ref(false);
  let loading: Promise<void> | undefined;

  const isSignedIn = computed(() => user.value !== null);
  const isAdmin = computed(() => user.value?.role === 'admin');

  function load(): Promise<void> {
    loading ??= authApi.fetchCurrentUser()
      .then((u) => { user.value = u; })
      .finally(() => { loaded.value = true; });
    return loading;
  }

  async function signIn(credentials: LoginRequest): Promise<void> {
    user.value = await authApi.login(credentials);
    loaded.value = true;
  }

  async function register(details: RegisterRequest): Promise<void> {
    user.value = await authApi.register(details);
    loaded.value = true;
  }

  async function signOut(): Promise<void> {
    await authApi.logout();
    user.value = null;
  }

  return { user, loaded, isSignedIn, isAdmin, load, signIn, register, signOut };
});
