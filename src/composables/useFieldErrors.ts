import { reactive, ref } from 'vue';
import { ApiError } from 'src/api/http';

/**
 * Field errors and a message for a form that is not one zod object (settings edited in parts):
 * `show` replaces them, `fromError` puts a server error on its field and above the form and
 * rethrows anything that is not one.
 */
export function useFieldErrors() {
  const errors = reactive<Record<string, string | undefined>>({});
  const formError = ref<string | null>(null);

  function show(issues: Record<string, string>, message: string | null): void {
    for (const key of Object.keys(errors)) delete errors[key];
    Object.assign(errors, issues);
    formError.value = message;
  }

  function fromError(error: unknown): void {
    if (!(error instanceof ApiError)) throw error;
    show(error.field ? { [error.field]: error.message } : {}, error.message);
  }

  return { errors, formError, show, fromError, clear: () => show({}, null) };
}
