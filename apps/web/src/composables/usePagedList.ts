import type { Page } from '@busbar/shared';
import type { TablePaginationConfig } from 'ant-design-vue';
import { computed, ref, shallowRef, watch } from 'vue';
import { useRoute, useRouter, type LocationQuery, type LocationQueryRaw } from 'vue-router';
import { messageOf } from '../api/client.ts';
import { useScopeStore, type ScopeParams } from '../stores/scope.ts';

const DEFAULT_PAGE_SIZE = 50;

/** A positive whole number read from the address bar, or undefined. */
export function positiveInt(value: unknown): number | undefined {
  const n = typeof value === 'string' ? Number(value) : NaN;
  return Number.isInteger(n) && n > 0 ? n : undefined;
}

/** A list's count in words: "more than 10,000" once the server stopped counting. */
export function countLabel(page: Pick<Page<unknown>, 'total' | 'totalCapped'>): string {
  const total = page.total.toLocaleString('en-US');
  return page.totalCapped ? `more than ${total}` : total;
}

interface Paging {
  page: number;
  pageSize: number;
}

/**
 * One server-paginated list whose filters and page live in the address bar, so a view can be
 * reloaded, bookmarked and shared. Answers that arrive after a newer request are dropped. A
 * `scoped` list keeps to the shop or region chosen in the header (stores/scope.ts) unless its own
 * filter names a shop (a link from a figure to one shop's builds); a new scope starts at page one.
 */
export function usePagedList<T, Filters extends object>(
  readFilters: (query: LocationQuery) => Filters,
  fetchPage: (request: Filters & Paging & ScopeParams) => Promise<Page<T>>,
  { scoped = false } = {},
) {
  const route = useRoute();
  const router = useRouter();
  const routeName = route.name;
  const scope = scoped ? useScopeStore() : null;

  const request = computed(() => ({
    ...readFilters(route.query),
    page: positiveInt(route.query.page) ?? 1,
    pageSize: positiveInt(route.query.pageSize) ?? DEFAULT_PAGE_SIZE,
  }));
  const result = shallowRef<Page<T> | null>(null);
  const loading = ref(false);
  const error = ref<string | null>(null);
  let latest = 0;

  /** The request as sent: the address bar's, within the header's scope. */
  const namesShop = () => (request.value as { locationId?: number }).locationId !== undefined;
  const sent = computed(() => (scope && !namesShop() ? { ...request.value, ...scope.params } : request.value));

  async function load() {
    const ticket = ++latest;
    loading.value = true;
    error.value = null;
    try {
      const page = await fetchPage(sent.value);
      if (ticket === latest) result.value = page;
    } catch (failure) {
      if (ticket === latest) error.value = messageOf(failure);
    } finally {
      if (ticket === latest) loading.value = false;
    }
  }

  watch(
    () => JSON.stringify(sent.value),
    () => {
      if (route.name === routeName) void load();
    },
    { immediate: true },
  );
  if (scope) {
    watch(
      () => JSON.stringify(scope.params),
      () => {
        if (route.name === routeName && route.query.page) replaceQuery({ ...route.query, page: undefined });
      },
    );
  }

  function replaceQuery(query: LocationQueryRaw) {
    for (const [key, value] of Object.entries(query)) {
      if (value === undefined || value === '' || (Array.isArray(value) && value.length === 0)) delete query[key];
    }
    void router.replace({ query });
  }

  /** Changes filters in the address bar; any filter change goes back to the first page. */
  function setFilters(changes: Partial<Record<keyof Filters, string | number | string[] | undefined>>) {
    replaceQuery({ ...route.query, ...changes, page: undefined });
  }

  function onTableChange(pagination: TablePaginationConfig) {
    const pageSize = pagination.pageSize ?? DEFAULT_PAGE_SIZE;
    const page = pageSize === request.value.pageSize ? (pagination.current ?? 1) : 1;
    replaceQuery({
      ...route.query,
      page: page > 1 ? page : undefined,
      pageSize: pageSize === DEFAULT_PAGE_SIZE ? undefined : pageSize,
    });
  }

  const pagination = computed<TablePaginationConfig>(() => ({
    current: request.value.page,
    pageSize: request.value.pageSize,
    total: result.value?.total ?? 0,
    showSizeChanger: true,
    pageSizeOptions: ['25', '50', '100', '200'],
    showTotal: (_total: number, [from, to]: [number, number]) => `${from}–${to} of ${result.value ? countLabel(result.value) : 0}`,
  }));

  /** The rows and paging for the list's Table (`v-bind`); its `change` goes to `onTableChange`. */
  const table = computed(() => ({
    dataSource: result.value?.items ?? [],
    loading: loading.value,
    pagination: pagination.value,
  }));

  return { request, result, loading, error, load, setFilters, onTableChange, table };
}
