import { computed, onMounted, ref, type ComputedRef, type Ref } from 'vue';
import { useRoute } from 'vue-router';
import { messageFor } from '@/api/messages';

/**
 * What an e-mailed link (invitation, lender share) opens, loaded once the screen mounts from the
 * route's `:token`. `loadError` holds the server's message (a used or expired link), or
 * `fallback` when the request failed without one.
 */
export function useLinkPreview<T>(
  load: (token: string) => Promise<T>,
  fallback: string,
): { token: ComputedRef<string>; preview: Ref<T | null>; loadError: Ref<string | null> } {
  const route = useRoute();
  const token = computed(() => String(route.params.token ?? ''));
  // The cast keeps T as given: ref() would type a generic T as its deep-unwrapped form.
  const preview = ref<T | null>(null) as Ref<T | null>;
  const loadError = ref<string | null>(null);

  onMounted(async () => {
    try {
      preview.value = await load(token.value);
    } catch (error) {
      loadError.value = messageFor(error, fallback);
    }
  });

  return { token, preview, loadError };
}
