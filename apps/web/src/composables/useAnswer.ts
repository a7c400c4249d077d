import { ref, shallowRef, watch } from 'vue';
import { ApiError, messageOf } from '../api/client.ts';

/**
 * One answer loaded again whenever its request (the address bar's filters) changes; an answer that
 * arrives after a newer request is dropped. `notFound` is said for a 404 in the page's own words.
 */
export function useAnswer<T>(requestKey: () => string, fetch: () => Promise<T>, notFound: string) {
  const data = shallowRef<T | null>(null);
  const loading = ref(true);
  const error = ref<string | null>(null);
  /** The error was a 404: asking again will not help. */
  const missing = ref(false);
  let latest = 0;

  async function load() {
    const ticket = ++latest;
    loading.value = true;
    error.value = null;
    missing.value = false;
    try {
      const answer = await fetch();
      if (ticket === latest) data.value = answer;
    } catch (failure) {
      if (ticket !== latest) return;
      data.value = null;
      missing.value = failure instanceof ApiError && failure.status === 404;
      error.value = missing.value ? notFound : messageOf(failure);
    } finally {
      if (ticket === latest) loading.value = false;
    }
  }
  watch(requestKey, load, { immediate: true });

  return { data, loading, error, missing, load };
}
