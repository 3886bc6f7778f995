import { computed, inject, provide, type ComputedRef, type InjectionKey, type Ref } from 'vue';

/** Field messages keyed by the dotted path of the scenario or baseline field they name. */
export type FieldMessages = Readonly<Record<string, string>>;

interface FieldErrorContext {
  messages: Readonly<Ref<FieldMessages>>;
  /** Prefix added to a component's relative path, e.g. "options.2" (a getter: the selected option changes). */
  prefix: () => string;
}

const KEY: InjectionKey<FieldErrorContext> = Symbol('field-errors');

/** Makes `messages` (e.g. the server's `fields`) available to every input below this component. */
export function provideFieldErrors(messages: Readonly<Ref<FieldMessages>>): void {
  provide(KEY, { messages, prefix: () => '' });
}

/** Scopes the inputs below to a sub-object, so an option's inputs can say "lyingHoursPerDay". */
export function provideFieldPrefix(prefix: string | (() => string)): void {
  const parent = inject(KEY, null);
  if (!parent) return;
  const own = typeof prefix === 'string' ? () => prefix : prefix;
  provide(KEY, { messages: parent.messages, prefix: () => join(parent.prefix(), own()) });
}

function join(prefix: string, path: string): string {
  return prefix && path ? `${prefix}.${path}` : prefix || path;
}

/** The full path of a relative one and its message, if any (also messages on its children). */
export function useFieldError(path: () => string | undefined): { fullPath: ComputedRef<string | undefined>; message: ComputedRef<string | undefined> } {
  const context = inject(KEY, null);
  const fullPath = computed(() => {
    const relative = path();
    return relative === undefined ? undefined : join(context?.prefix() ?? '', relative);
  });
  const message = computed(() => {
    const full = fullPath.value;
    if (!full || !context) return undefined;
    return context.messages.value[full];
  });
  return { fullPath, message };
}

/** A DOM id for the input bound to a field path, so a message can point the user at it. */
export function fieldDomId(path: string): string {
  return 'field-' + path.replace(/[^a-zA-Z0-9_-]/g, '-');
}
