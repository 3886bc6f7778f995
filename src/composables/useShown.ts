/**
 * True once `target` has come within a screen's height of the viewport: heavy tables below the
 * fold are fetched and drawn only then, so the top of a screen is usable first.
 */
import { onBeforeUnmount, ref, watch, type Ref } from 'vue';

export function useShown(target: Ref<HTMLElement | null>): Readonly<Ref<boolean>> {
  const shown = ref(false);
  let observer: IntersectionObserver | null = null;
  const stop = watch(
    target,
    (element) => {
      observer?.disconnect();
      if (!element || shown.value) return;
      if (typeof IntersectionObserver === 'undefined') {
        shown.value = true;
        return;
      }
      observer = new IntersectionObserver(
        (entries) => {
          if (entries.some((entry) => entry.isIntersecting)) {
            shown.value = true;
            observer?.disconnect();
          }
        },
        { rootMargin: '100% 0px' },
      );
      observer.observe(element);
    },
    { immediate: true, flush: 'post' },
  );
  onBeforeUnmount(() => {
    stop();
    observer?.disconnect();
  });
  return shown;
}
