import { inject, provide, ref, shallowRef, watch, type InjectionKey, type Ref } from 'vue';
import { isStale, messageOf } from '../api/client.ts';

/** Sends one change made against the version on screen and answers the whole new record. */
export type RecordChange<T> = (send: (version: number) => Promise<T>) => Promise<boolean>;

export interface RecordState {
  stale: Ref<string | null>;
  loading: Ref<boolean>;
  load: () => Promise<void>;
}

export const recordStateKey = (what: string): InjectionKey<RecordState> => Symbol(`${what} state`);

/** The stale notice and reload of a record's page, for dialogs that cover the page's own notice. */
export function useRecordState(key: InjectionKey<RecordState>): RecordState {
  const state = inject(key);
  if (!state) throw new Error(`${key.description ?? 'record state'} needs its page above it`);
  return state;
}

/**
 * One versioned record on screen. Every change carries the version the person saw; when someone
 * else changed the record first, the page says so and offers a reload, and the forms keep what was
 * typed. Other failures are thrown to the caller.
 */
export function useVersionedRecord<T extends { version: number }>(id: () => number, get: (id: number) => Promise<T>, key: InjectionKey<RecordState>) {
  const record = shallowRef<T | null>(null);
  const loading = ref(true);
  const error = ref<string | null>(null);
  /** What the last load threw, for the page to say why the record did not open. */
  const failure = shallowRef<unknown>(null);
  const stale = ref<string | null>(null);

  async function load() {
    loading.value = true;
    error.value = null;
    failure.value = null;
    try {
      record.value = await get(id());
      stale.value = null;
    } catch (thrown) {
      record.value = null;
      failure.value = thrown;
      error.value = messageOf(thrown);
    } finally {
      loading.value = false;
    }
  }
  watch(id, load, { immediate: true });

  /** True when the change was saved; false when the record was stale. */
  const change: RecordChange<T> = async (send) => {
    if (!record.value) return false;
    try {
      record.value = await send(record.value.version);
      stale.value = null;
      return true;
    } catch (failure) {
      if (isStale(failure)) {
        stale.value = failure.message;
        return false;
      }
      throw failure;
    }
  };

  /** A whole record answered by a request that carries no version (an upload). */
  const replace = (next: T) => {
    record.value = next;
  };

  provide(key, { stale, loading, load });
  return { record, loading, error, failure, stale, load, change, replace };
}
