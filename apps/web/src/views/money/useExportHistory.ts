import type { ExportJob, Page } from '@busbar/shared';
import { onBeforeUnmount, ref, shallowRef, watch } from 'vue';
import { messageOf } from '../../api/client.ts';
import { getExport, listExports } from '../../api/exports.ts';
import { isActive } from './exportLook.ts';

const POLL_MS = 1000;
const PAGE_SIZE = 20;

/**
 * One page of the person's exports, newest first. While any shown export is queued or running, each
 * of those is read again about once a second, until it is done or failed; leaving the page stops it.
 */
export function useExportHistory() {
  const page = ref(1);
  const result = shallowRef<Page<ExportJob> | null>(null);
  const loading = ref(true);
  const error = ref<string | null>(null);
  let latest = 0;
  let timer: ReturnType<typeof setTimeout> | undefined;
  let left = false;

  function follow() {
    clearTimeout(timer);
    if (!left && result.value?.items.some(isActive)) timer = setTimeout(() => void poll(), POLL_MS);
  }

  async function load() {
    const ticket = ++latest;
    loading.value = true;
    error.value = null;
    try {
      const answer = await listExports(page.value, PAGE_SIZE);
      if (ticket === latest) result.value = answer;
    } catch (failure) {
      if (ticket === latest) error.value = messageOf(failure);
    } finally {
      if (ticket === latest) {
        loading.value = false;
        follow();
      }
    }
  }

  async function poll() {
    const ticket = latest;
    const shown = result.value!;
    // A missed reading is tried again a second later: the export goes on on the server meanwhile.
    const fresh = await Promise.all(shown.items.filter(isActive).map((job) => getExport(job.id).catch(() => job)));
    // A newer list (another page, a new export) replaced this one while it was read.
    if (ticket !== latest) return;
    const byId = new Map(fresh.map((job) => [job.id, job]));
    result.value = { ...shown, items: shown.items.map((job) => byId.get(job.id) ?? job) };
    follow();
  }

  watch(page, load, { immediate: true });
  onBeforeUnmount(() => {
    left = true;
    clearTimeout(timer);
  });

  /** Shows the first page again (where a new export appears) and follows it. */
  function showNewest() {
    if (page.value === 1) void load();
    else page.value = 1;
  }

  return { page, pageSize: PAGE_SIZE, result, loading, error, load, showNewest };
}
