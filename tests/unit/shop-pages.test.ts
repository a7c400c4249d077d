import { describe, expect, it } from 'vitest';
import { ref } from 'vue';
import { SHOPS_A_PAGE, useShopPages } from '../../apps/web/src/composables/useShopPages.ts';

const shops = (n: number) => Array.from({ length: n }, (_, i) => ({ locationId: i + 1 }));

describe('pages of a report’s rows of shops', () => {
  it('show every row on one page, with no pager, while they fit one', () => {
    for (const n of [0, 1, SHOPS_A_PAGE]) {
      const pages = useShopPages(() => shops(n));
      expect([pages.pages.value, pages.shown.value.length, pages.pagination.value]).toEqual([1, n, false]);
    }
  });

  it('split more rows into pages of 25, each row on exactly one page, in order', () => {
    const rows = shops(2 * SHOPS_A_PAGE + 3);
    const pages = useShopPages(() => rows);
    expect(pages.pages.value).toBe(3);
    const seen = [];
    for (let page = 1; page <= pages.pages.value; page++) {
      pages.page.value = page;
      seen.push(...pages.shown.value);
    }
    expect(seen).toEqual(rows);
    pages.page.value = 3;
    expect(pages.shown.value.map((s) => s.locationId)).toEqual([51, 52, 53]);
  });

  it('give the table a pager on the same page, which turns the cards too, and names the rows on view', () => {
    const pages = useShopPages(() => shops(60));
    const pager = pages.pagination.value;
    if (!pager) throw new Error('a pager was expected');
    expect(pager).toMatchObject({ current: 1, pageSize: SHOPS_A_PAGE, total: 60, showSizeChanger: false });
    expect(pager.showTotal!(60, [26, 50])).toBe('Shops 26–50 of 60');
    pager.onChange!(2, SHOPS_A_PAGE);
    expect([pages.page.value, pages.shown.value[0]!.locationId]).toEqual([2, 26]);
    expect(pages.pagination.value && pages.pagination.value.current).toBe(2);
  });

  it('show the last page when fewer rows come (a narrower scope)', () => {
    const count = ref(80);
    const pages = useShopPages(() => shops(count.value));
    pages.page.value = 4;
    count.value = 30;
    expect([pages.page.value, pages.shown.value.map((s) => s.locationId)]).toEqual([2, [26, 27, 28, 29, 30]]);
    count.value = 5;
    expect([pages.page.value, pages.shown.value.length, pages.pagination.value]).toEqual([1, 5, false]);
  });
});
