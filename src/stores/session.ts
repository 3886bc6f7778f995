import { defineStore } from 'pinia';
import { computed, readonly, ref } from 'vue';
import { authApi, type Session } from '@/api/auth';
import { ApiError } from '@/api/client';
import type { SignInInput, SignUpInput } from '@shared/schema/accounts';

/** Who is signed in. `ensureLoaded` shares one request between concurrent callers. */
export const useSessionStore = defineStore('session', () => {
  const session = ref<Session | null>(null);
  const loaded = ref(false);
  let loading: Promise<void> | null = null;

  const user = computed(() => session.value?.user ?? null);
  const signedIn = computed(() => session.value !== null);

  function ensureLoaded(): Promise<void> {
    if (loaded.value) return Promise.resolve();
    loading ??= authApi
      .me()
      .then((s) => {
        session.value = s;
      })
      .catch((error: unknown) => {
        if (!(error instanceof ApiError) || error.status !== 401) throw error;
        session.value = null;
      })
      .finally(() => {
        loaded.value = true;
        loading = null;
      });
    return loading;
  }

  async function signIn(input: SignInInput): Promise<void> {
    session.value = await authApi.signIn(input);
    loaded.value = true;
  }

  async function signUp(input: SignUpInput): Promise<void> {
    session.value = await authApi.signUp(input);
    loaded.value = true;
  }

  async function signOut(): Promise<void> {
    try {
      await authApi.signOut();
    } finally {
      session.value = null;
    }
  }

  /** Called when the API says the session ended (401). */
  function forget(): void {
    session.value = null;
  }

  async function refresh(): Promise<void> {
    loaded.value = false;
    await ensureLoaded();
  }

  return { session: readonly(session), user, signedIn, loaded: readonly(loaded), ensureLoaded, signIn, signUp, signOut, forget, refresh };
});
