import type { Page } from '@busbar/shared';
import type { TablePaginationConfig } from 'ant-design-vue';
import { computed, ref, shallowRef, watch } from 'vue';
import { messageOf } from '../../api/client.ts';
import type { HistoryPaging } from '../../api/customers.ts';
import { countLabel } from '../../composables/usePagedList.ts';

const PAGE_SIZE = 10;

/**
 * One page at a time of a list on a customer's page. Two such lists share the page, so their
 * page numbers stay here rather than in the address bar; an answer older than the last asked is dropped.
 */
export function useHistoryPage<T>(customerId: () => number, fetchPage: (id: number, paging: HistoryPaging) => Promise<Page<T>>) {
  const page = ref(1);
  const result = shallowRef<Page<T> | null>(null);
  const loading = ref(false);
  const error = ref<string | null>(null);
  let latest = 0;

  async function load() {
    const ticket = ++latest;
    loading.value = true;
    error.value = null;
    try {
      const answer = await fetchPage(customerId(), { page: page.value, pageSize: PAGE_SIZE });
      if (ticket === latest) result.value = answer;
    } catch (failure) {
      if (ticket === latest) error.value = messageOf(failure);
    } finally {
      if (ticket === latest) loading.value = false;
    }
  }
  watch(customerId, () => (page.value = 1));
  watch([customerId, page], load, { immediate: true });

  const pagination = computed<TablePaginationConfig | false>(() => {
    const total = result.value?.total ?? 0;
    if (total <= PAGE_SIZE) return false;
    return { current: page.value, pageSize: PAGE_SIZE, total, showSizeChanger: false, size: 'small', showTotal: () => `${countLabel(result.value!)} in all` };
  });
  const onChange = (p: TablePaginationConfig) => (page.value = p.current ?? 1);

  return { result, loading, error, load, pagination, onChange };
}
