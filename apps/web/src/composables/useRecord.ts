import { ref, shallowRef, watch } from 'vue';
import { ApiError, messageOf } from '../api/client.ts';

/**
 * The one record a detail page shows, loaded again when its id changes. A record the person may
 * not see answers 404: the page says so in its own words (`notFound`) instead of the server's.
 */
export function useRecord<T>(id: () => number, fetch: (id: number) => Promise<T>, notFound: string) {
  const record = shallowRef<T | null>(null);
  const loading = ref(true);
  const error = ref<string | null>(null);

  async function load() {
    loading.value = true;
    error.value = null;
    try {
      record.value = await fetch(id());
    } catch (failure) {
      record.value = null;
      error.value = failure instanceof ApiError && failure.status === 404 ? notFound : messageOf(failure);
    } finally {
      loading.value = false;
    }
  }
  watch(id, load, { immediate: true });

  return { record, loading, error, load };
}
