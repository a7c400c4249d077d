import { reactive, ref, watch } from 'vue';
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

  /**
   * Puts zod issues on their fields, a nested field named with dots as the server names it
   * (`specs.capacityAh`); an issue without a field becomes the form's message.
   */
  function fromIssues(issues: readonly Issue[]) {
    clear();
    for (const issue of issues) {
      const field = issue.path.filter((p) => typeof p === 'string' || typeof p === 'number').join('.');
      if (field) set(field, issue.message);
      else formError.value ??= issue.message;
    }
  }

  /** Shows a failed request: field messages on their fields, the server's message above the form. */
  function fromError(error: unknown) {
    clear();
    const fieldMessages = error instanceof ApiError ? Object.entries(error.fields) : [];
    for (const [field, message] of fieldMessages) set(field, message);
    // A message already shown on its field is not repeated above the form.
    const message = messageOf(error);
    if (!fieldMessages.some(([, text]) => text === message)) formError.value = message;
  }

  /** The value a shared-schema check parsed, or null after putting its issues on the fields. */
  function check<T>(result: { success: true; data: T } | { success: false; error: { issues: readonly Issue[] } }): T | null {
    fromIssues(result.success ? [] : result.error.issues);
    return result.success ? result.data : null;
  }

  /** A plainer message for a field left empty than the schema's own (which speaks of types). */
  function requireValue(field: Field, value: unknown, message: string) {
    if (value === undefined || value === null || value === '') fields[field] = message;
  }

  /** Takes a field's message away as soon as the person changes that field. */
  function clearOnEdit(draft: object) {
    for (const key of Object.keys(draft)) {
      watch(
        () => (draft as Record<string, unknown>)[key],
        () => delete fields[key as Field],
        { deep: true },
      );
    }
  }

  const itemProps = (field: Field) => errorProps(fields[field]);

  return { fields, formError, clear, set, fromIssues, fromError, check, requireValue, clearOnEdit, itemProps };
}
