import { reactive, ref } from 'vue';
import type { z } from 'zod';
import { ApiError } from '../api/http';

/**
 * Form state validated by a shared zod schema, the same one the server uses: `errors` holds
 * one message per field, from the browser check or from the server's 400 answer.
 */
export function useZodForm<S extends z.ZodObject>(schema: S, initial: z.input<S>) {
  const values = reactive({ ...initial }) as z.input<S>;
  const errors = ref<Record<string, string>>({});
  const formError = ref<string | null>(null);
  const submitting = ref(false);

  /** Checks the values; resolves with the parsed data, or null with `errors` filled. */
  function check(): z.output<S> | null {
    const result = schema.safeParse(values);
    if (result.success) {
      errors.value = {};
      return result.data;
    }
    const next: Record<string, string> = {};
    for (const issue of result.error.issues) next[issue.path.join('.') || '_'] ??= issue.message;
    errors.value = next;
    return null;
  }

  /** Runs a submit action with the parsed values, turning API errors into field messages. */
  async function submit(action: (data: z.output<S>) => Promise<void>) {
    formError.value = null;
    const data = check();
    if (!data) return;
    submitting.value = true;
    try {
      await action(data);
    } catch (error) {
      if (error instanceof ApiError) {
        errors.value = { ...error.fields };
        if (!Object.keys(error.fields).length || error.fields._) formError.value = error.message;
      } else formError.value = 'Something went wrong. Please try again.';
    } finally {
      submitting.value = false;
    }
  }

  /** The message for a field, for naive-ui's feedback prop. */
  const feedback = (field: string) => errors.value[field];
  const status = (field: string) => (errors.value[field] ? ('error' as const) : undefined);

  return { values, errors, formError, submitting, check, submit, feedback, status };
}
