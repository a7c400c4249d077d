import { ref } from 'vue';
import { isStale } from '../api/client.ts';

/**
 * Sending a form: `saving` while the request runs. When someone saved the record first, `stale`
 * holds the server's message for the stale notice and what was typed stays; any other failure
 * goes on the form's fields.
 */
export function useSubmit(errors: { fromError: (error: unknown) => void }) {
  const saving = ref(false);
  const stale = ref<string | null>(null);

  async function run(send: () => Promise<void>) {
    saving.value = true;
    try {
      await send();
      stale.value = null;
    } catch (error) {
      if (isStale(error)) stale.value = error.message;
      else errors.fromError(error);
    } finally {
      saving.value = false;
    }
  }

  return { saving, stale, run };
}
