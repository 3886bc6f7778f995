import { ref } from 'vue';
import type { useFormErrors } from '@/composables/useFormErrors';

/**
 * Sends a form: `busy` is true while `action` runs (the button shows it and ignores clicks), and
 * what it throws lands on `errors` (field messages, or the general one).
 */
export function useFormSubmit(errors: ReturnType<typeof useFormErrors>) {
  const busy = ref(false);

  async function run(action: () => Promise<void>): Promise<void> {
    busy.value = true;
    try {
      await action();
    } catch (error) {
      errors.fromError(error);
    } finally {
      busy.value = false;
    }
  }

  return { busy, run };
}

/** Where to go after signing in or up: the guard's `?next=` when it is a path of this app, else the farm list. */
export function nextPath(query: Record<string, unknown>): string {
  const next = query.next;
  return typeof next === 'string' && next.startsWith('/') ? next : '/farms';
}
