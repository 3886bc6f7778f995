import { onBeforeUnmount, onMounted, toValue, type MaybeRefOrGetter } from 'vue';
import { onBeforeRouteLeave, onBeforeRouteUpdate, type RouteLocationNormalized } from 'vue-router';

export const LEAVE_QUESTION = 'You have unsaved changes. Leave this page and lose them?';

/**
 * Asks before leaving while `dirty` is true: in-app navigation through the router (a confirm
 * the user can refuse), closing or reloading the tab through `beforeunload`. `sameWork` tells
 * route updates that stay on the same document (switching tabs of one scenario) from leaving it.
 */
export function useUnsavedGuard(
  dirty: MaybeRefOrGetter<boolean>,
  sameWork: (to: RouteLocationNormalized, from: RouteLocationNormalized) => boolean = () => false,
): void {
  function onBeforeUnload(event: BeforeUnloadEvent): void {
    if (!toValue(dirty)) return;
    event.preventDefault();
    // Older browsers need returnValue set to show their own prompt.
    event.returnValue = '';
  }

  const guard = (to: RouteLocationNormalized, from: RouteLocationNormalized): boolean => {
    if (!toValue(dirty) || sameWork(to, from)) return true;
    return window.confirm(LEAVE_QUESTION);
  };

  onBeforeRouteLeave(guard);
  onBeforeRouteUpdate(guard);
  onMounted(() => window.addEventListener('beforeunload', onBeforeUnload));
  onBeforeUnmount(() => window.removeEventListener('beforeunload', onBeforeUnload));
}
