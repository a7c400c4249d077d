import { onBeforeUnmount, ref, shallowRef } from 'vue';
import { messageOf } from '../api/client.ts';

/**
 * Options a select finds on the server as the person types: a short pause before asking,
 * and an answer that arrives after a newer question is dropped.
 */
export function useRemoteSearch<T>(fetch: (q: string | undefined) => Promise<T[]>, delayMs = 250) {
  const found = shallowRef<T[]>([]);
  const loading = ref(false);
  const error = ref<string | null>(null);
  let timer: ReturnType<typeof setTimeout> | undefined;
  let latest = 0;

  async function search(q = '') {
    clearTimeout(timer);
    const ticket = ++latest;
    loading.value = true;
    error.value = null;
    try {
      const items = await fetch(q.trim() || undefined);
      if (ticket === latest) found.value = items;
    } catch (failure) {
      if (ticket === latest) error.value = messageOf(failure);
    } finally {
      if (ticket === latest) loading.value = false;
    }
  }

  /** For the select's `search` event: waits for a pause in typing. */
  function onSearch(q: string) {
    clearTimeout(timer);
    timer = setTimeout(() => void search(q), delayMs);
  }

  onBeforeUnmount(() => clearTimeout(timer));

  /** What the dropdown says when it has no option to show. */
  const emptyText = (nothing: string) => (loading.value ? 'Searching…' : (error.value ?? nothing));

  return { found, loading, error, search, onSearch, emptyText };
}
