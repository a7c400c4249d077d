import type { TablePaginationConfig } from 'ant-design-vue';
import { computed, ref } from 'vue';

/** Rows of shops a report shows at once: a network of hundreds renders a page at a time, a few shops all on one. */
export const SHOPS_A_PAGE = 25;

/** The pager's words for the rows on view. */
export const shopsInView = (total: number, [first, last]: [number, number]) => `Shops ${first}–${last} of ${total}`;

/**
 * Pages of a report's rows of shops, all in the browser: the table's pager, and the page's rows for
 * a phone's cards, with the same page in both. No pager while every row fits one page. A page past
 * the last (fewer rows after a change of scope) shows the last.
 */
export function useShopPages<T>(rows: () => readonly T[]) {
  const asked = ref(1);
  const pages = computed(() => Math.max(1, Math.ceil(rows().length / SHOPS_A_PAGE)));
  const page = computed({ get: () => Math.min(asked.value, pages.value), set: (value: number) => (asked.value = value) });
  const shown = computed(() => rows().slice((page.value - 1) * SHOPS_A_PAGE, page.value * SHOPS_A_PAGE));
  const pagination = computed<TablePaginationConfig | false>(() =>
    pages.value > 1
      ? {
          current: page.value,
          pageSize: SHOPS_A_PAGE,
          total: rows().length,
          showSizeChanger: false,
          showTotal: shopsInView,
          onChange: (value) => (page.value = value),
        }
      : false,
  );
  return { page, pages, shown, pagination, total: computed(() => rows().length) };
}
