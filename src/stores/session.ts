import { defineStore } from 'pinia';
import { computed, readonly, ref } from 'vue';
import { authApi, type Session } from '@/api/auth';
import type {
  ChangePasswordInput,
  PasswordResetInput,
  SignInInput,
  SignUpInput,
  UpdateProfileInput,
} from '@shared/schema/accounts';

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

  async function updateProfile(input: UpdateProfileInput): Promise<void> {
    session.value = await authApi.updateProfile(input);
  }

  /** Changes the password; the server ends every other session and renews this one. */
  async function changePassword(input: ChangePasswordInput): Promise<void> {
    await authApi.changePassword(input);
  }

  async function requestPasswordReset(email: string): Promise<string> {
    return (await authApi.requestPasswordReset({ email })).message;
  }

  /** Sets the new password; every session ends, so this browser is signed out too. */
  async function completePasswordReset(input: PasswordResetInput): Promise<void> {
    await authApi.completePasswordReset(input);
    session.value = null;
    loaded.value = true;
  }

  /** Takes the session an accepted link answered with (src/stores/links.ts). */
  function adopt(next: Session): void {
    session.value = next;
    loaded.value = true;
  }

  return {
    session: readonly(session),
    user,
    signedIn,
    loaded: readonly(loaded),
    ensureLoaded,
    signIn,
    signUp,
    signOut,
    forget,
    refresh,
    updateProfile,
    changePassword,
    requestPasswordReset,
    completePasswordReset,
    adopt,
  };
});
