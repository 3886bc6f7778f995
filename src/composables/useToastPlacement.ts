/**
 * Where toasts appear: in the half of the screen away from the control just pressed, so a "Saved"
 * never covers the button that saved (a save bar sits at the bottom, a workspace Save at the top).
 * Pointer presses and Enter/Space on the focused control both count.
 */
import { onBeforeUnmount, onMounted, ref } from 'vue';

export type ToastPlacement = 'top-right' | 'bottom-right';

const CONTROL = 'button, a, [role="button"], input[type="submit"]';

/** The toast position for a control's box in a viewport of `height`: the half it is not in. */
export function placementAwayFrom(box: { top: number; bottom: number }, height: number): ToastPlacement {
  return (box.top + box.bottom) / 2 > height / 2 ? 'top-right' : 'bottom-right';
}

export function useToastPlacement() {
  const position = ref<ToastPlacement>('bottom-right');

  function note(target: EventTarget | null): void {
    const control = target instanceof Element ? target.closest(CONTROL) : null;
    if (!control) return;
    position.value = placementAwayFrom(control.getBoundingClientRect(), window.innerHeight);
  }
  const onPointer = (event: PointerEvent) => note(event.target);
  const onKey = (event: KeyboardEvent) => {
    if (event.key === 'Enter' || event.key === ' ') note(document.activeElement);
  };

  onMounted(() => {
    document.addEventListener('pointerdown', onPointer, true);
    document.addEventListener('keydown', onKey, true);
  });
  onBeforeUnmount(() => {
    document.removeEventListener('pointerdown', onPointer, true);
    document.removeEventListener('keydown', onKey, true);
  });
  return position;
}
