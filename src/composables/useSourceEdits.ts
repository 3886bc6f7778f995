/**
 * Lets an input inside an option form mark its figure as typed by the farm: the form provides
 * the option, the input reports its source key when the user types (shared/source-edits.ts).
 */
import { inject, provide, type InjectionKey } from 'vue';
import type { Option } from '@shared/schema';
import { markTyped } from '@shared/source-edits';

const KEY: InjectionKey<(key: string) => void> = Symbol('source-edits');

/** For an option form: inputs below mark `option().sources[key]` when the user types. */
export function provideSourceEdits(option: () => Option | undefined, canEdit: () => boolean = () => true): void {
  provide(KEY, (key) => {
    const target = option();
    if (target && canEdit()) markTyped(target, key);
  });
}

/** For an input: call with its source key after the user typed a value (nothing outside an option form). */
export function useSourceEdit(): (key: string | undefined) => void {
  const mark = inject(KEY, null);
  return (key) => {
    if (mark && key) mark(key);
  };
}
