/**
 * The one loading state of a screen: `active` from the first tracked request until the last one
 * ends, and `slow` (what shows the spinner) only once a request has taken longer than `delayMs`,
 * so quick loads never flash a spinner (docs/design.md: no flicker).
 */
import { getCurrentScope, onScopeDispose, reactive, readonly, ref } from 'vue';

/** How long a request may take before the spinner appears. */
export const SPINNER_DELAY_MS = 200;

/** Reactive, so a template reads `loading.slow` as it is. */
export interface Loading {
  /** True while anything tracked is running (hide empty states, disable buttons). */
  readonly active: boolean;
  /** True once it has run longer than the delay (show the spinner). */
  readonly slow: boolean;
  /** Runs `work` under the loading state and returns what it returns (or throws what it throws). */
  track<T>(work: Promise<T> | (() => Promise<T>)): Promise<T>;
}

export function useLoading(delayMs = SPINNER_DELAY_MS): Loading {
  const active = ref(false);
  const slow = ref(false);
  let running = 0;
  let timer: ReturnType<typeof setTimeout> | undefined;

  function stopTimer(): void {
    clearTimeout(timer);
    timer = undefined;
  }

  async function track<T>(work: Promise<T> | (() => Promise<T>)): Promise<T> {
    running += 1;
    if (running === 1) {
      active.value = true;
      timer = setTimeout(() => (slow.value = true), delayMs);
    }
    try {
      return await (typeof work === 'function' ? work() : work);
    } finally {
      running -= 1;
      if (running === 0) {
        stopTimer();
        active.value = false;
        slow.value = false;
      }
    }
  }

  if (getCurrentScope()) onScopeDispose(stopTimer);
  return reactive({ active: readonly(active), slow: readonly(slow), track });
}
