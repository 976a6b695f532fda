import { fieldErrors } from '@shared/schemas/field-errors';
import { reactive, ref, type Ref, type UnwrapRef } from 'vue';
import type { z } from 'zod';
import { ApiError } from 'src/api/http';

export interface ZodForm<S extends z.ZodObject> {
  values: UnwrapRef<z.input<S>>;
  /** Message per field, from the shared schema or from the server's `field`. */
  errors: Partial<Record<string, string>>;
  /** A message for the whole form (e.g. wrong credentials). */
  formError: Ref<string | null>;
  busy: Ref<boolean>;
  /** Validates, then runs `action` with the parsed values; server errors land on their field. */
  submit(action: (values: z.output<S>) => Promise<void>): Promise<boolean>;
}

/** Form state validated with the same zod schema the server uses. */
export function useZodForm<S extends z.ZodObject>(schema: S, initial: z.input<S>): ZodForm<S> {
  const values = reactive(initial) as UnwrapRef<z.input<S>>;
  const errors = reactive<Partial<Record<string, string>>>({});
  const formError = ref<string | null>(null);
  const busy = ref(false);

  function clearErrors(): void {
    for (const key of Object.keys(errors)) delete errors[key];
    formError.value = null;
  }

  async function submit(action: (values: z.output<S>) => Promise<void>): Promise<boolean> {
    clearErrors();
    const parsed = schema.safeParse(values);
    if (!parsed.success) {
      Object.assign(errors, fieldErrors(parsed.error.issues));
      return false;
    }
    busy.value = true;
    try {
      await action(parsed.data);
      return true;
    } catch (err) {
      if (err instanceof ApiError && err.field) errors[err.field] = err.message;
      else formError.value = err instanceof Error ? err.message : 'Something went wrong.';
      return false;
    } finally {
      busy.value = false;
    }
  }

  return { values, errors, formError, busy, submit };
}
