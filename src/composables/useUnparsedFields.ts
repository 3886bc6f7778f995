/**
 * Inputs whose text is not a number yet ("12,5x", empty where a number is needed): the model
 * still holds the last good value, so saving would silently keep that one. A form provides the
 * tracker and disables its save button while `labels` is not empty; each input reports itself.
 */
import { computed, inject, onBeforeUnmount, provide, reactive, type ComputedRef, type InjectionKey } from 'vue';

interface Tracker {
  entries: Map<string, string>;
}

const KEY: InjectionKey<Tracker> = Symbol('unparsed-fields');

/** For the form that owns the save button: the labels of the inputs that hold no number. */
export function provideUnparsedFields(): { labels: ComputedRef<string[]> } {
  const tracker = reactive<Tracker>({ entries: new Map() });
  provide(KEY, tracker);
  return { labels: computed(() => [...tracker.entries.values()]) };
}

/** For one input: `report(true)` while its text is not a number, `report(false)` once it is. */
export function useUnparsedReport(id: () => string, label: () => string): (unparsed: boolean) => void {
  const tracker = inject(KEY, null);
  let reported: string | null = null;
  const report = (unparsed: boolean) => {
    if (!tracker) return;
    if (reported) tracker.entries.delete(reported);
    reported = unparsed ? id() : null;
    if (reported) tracker.entries.set(reported, label());
  };
  onBeforeUnmount(() => report(false));
  return report;
}
