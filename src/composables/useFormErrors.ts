import { ref } from 'vue';
import type { z } from 'zod';
import { ApiError } from '@/api/client';
import { messageFor } from '@/api/messages';

/**
 * Field messages for one form: from the shared zod schema before sending, and from the
 * server's `fields` after. `general` holds a message that names no field.
 */
export function useFormErrors() {
  const fields = ref<Record<string, string>>({});
  const general = ref<string | null>(null);

  function clear(): void {
    fields.value = {};
    general.value = null;
  }

  /** Returns the parsed value, or null after filling in the messages. */
  function validate<T extends z.ZodType>(schema: T, value: unknown): z.infer<T> | null {
    clear();
    const result = schema.safeParse(value);
    if (result.success) return result.data;
    for (const issue of result.error.issues) {
      const path = issue.path.map(String).join('.');
      fields.value[path] ??= issue.message;
    }
    return null;
  }

  function fromError(error: unknown): void {
    clear();
    if (error instanceof ApiError) fields.value = { ...error.fields };
    if (Object.keys(fields.value).length === 0) general.value = messageFor(error);
  }

  return { fields, general, clear, validate, fromError };
}
