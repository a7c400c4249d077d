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
  /** What the last load threw, for the page to say why the record did not open. */
  const failure = shallowRef<unknown>(null);

  async function load() {
    loading.value = true;
    error.value = null;
    failure.value = null;
    try {
      record.value = await fetch(id());
    } catch (thrown) {
      record.value = null;
      failure.value = thrown;
      error.value = thrown instanceof ApiError && thrown.status === 404 ? notFound : messageOf(thrown);
    } finally {
      loading.value = false;
    }
  }
  watch(id, load, { immediate: true });

  return { record, loading, error, failure, load };
}
