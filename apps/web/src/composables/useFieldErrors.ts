import { reactive, ref } from 'vue';
import { ApiError, messageOf } from '../api/client.ts';

/** Props for an ant Form.Item that shows a message as an error (none when there is no message). */
export function errorProps(message: string | undefined) {
  return message ? { validateStatus: 'error' as const, help: message } : {};
}

interface Issue {
  path: PropertyKey[];
  message: string;
}

/**
 * Messages for a form: one per field (from the shared zod schema before sending, or from the
 * server's `fields` after) and one for the whole form. The form's values are never touched.
 */
export function useFieldErrors<Field extends string>() {
  const fields = reactive<Partial<Record<Field, string>>>({}) as Partial<Record<Field, string>>;
  const formError = ref<string | null>(null);

  function clear() {
    for (const key of Object.keys(fields) as Field[]) delete fields[key];
    formError.value = null;
  }

  function set(field: string, message: string) {
    const key = field as Field;
    fields[key] ??= message;
  }

  /** Puts zod issues on their fields; an issue without a field becomes the form's message. */
  function fromIssues(issues: readonly Issue[]) {
    clear();
    for (const issue of issues) {
      const [field] = issue.path;
      if (typeof field === 'string') set(field, issue.message);
      else formError.value ??= issue.message;
    }
  }

  /** Shows a failed request: field messages on their fields, the server's message above the form. */
  function fromError(error: unknown) {
    clear();
    if (error instanceof ApiError) for (const [field, message] of Object.entries(error.fields)) set(field, message);
    formError.value = messageOf(error);
  }

  const itemProps = (field: Field) => errorProps(fields[field]);

  return { fields, formError, clear, set, fromIssues, fromError, itemProps };
}
