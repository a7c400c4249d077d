import type { CatalogItemView } from '@busbar/shared';
import type { TableColumnsType } from 'ant-design-vue';

/** Below this width (a phone) the table scrolls inside its own box; at 1280 px the columns fit. */
export const CATALOG_TABLE_MIN_WIDTH = 960;

/**
 * Catalog columns; money columns only for people who read them, edit only for people who may.
 * The item (SKU over name, with "Not offered" when it no longer is) takes what the others leave,
 * so the owner's eleven facts fit a 1280 px screen beside the menu.
 */
export function catalogColumns(show: { price: boolean; cost: boolean; edit: boolean }): TableColumnsType<CatalogItemView> {
  const money = (key: string, title: string, width = 92) => ({ key, title, align: 'right' as const, width });
  return [
    { key: 'item', title: 'Item' },
    { key: 'category', title: 'Category and vendor', width: 160 },
    { key: 'specs', title: 'Specs', width: 150, ellipsis: true },
    { key: 'serialized', title: 'Serial no.', width: 88 },
    { key: 'warranty', title: 'Warranty', width: 84, align: 'right' },
    ...(show.cost ? [money('unitCostCents', 'Unit cost'), money('marginCents', 'Margin', 84)] : []),
    ...(show.price ? [money('unitPriceCents', 'Unit price')] : []),
    ...(show.edit ? [{ key: 'actions', title: 'Actions', width: 72, align: 'right' as const }] : []),
  ];
}
