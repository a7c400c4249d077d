import type { CatalogItemView } from '@busbar/shared';
import type { TableColumnsType } from 'ant-design-vue';

/** Catalog columns; money columns only for people who read them, edit only for people who may. */
export function catalogColumns(show: {
  price: boolean;
  cost: boolean;
  status: boolean;
  edit: boolean;
}): TableColumnsType<CatalogItemView> {
  const money = (key: string, title: string) => ({ key, title, align: 'right' as const, width: 100 });
  return [
    { key: 'sku', title: 'SKU', dataIndex: 'sku', width: 130 },
    { key: 'name', title: 'Name', dataIndex: 'name', width: 240, ellipsis: true },
    { key: 'category', title: 'Category', width: 150, ellipsis: true },
    { key: 'vendor', title: 'Vendor', dataIndex: 'vendorName', width: 160, ellipsis: true },
    { key: 'specs', title: 'Specs', width: 220, ellipsis: true },
    { key: 'serialized', title: 'Serial no.', width: 100 },
    { key: 'warranty', title: 'Warranty', width: 90, align: 'right' },
    ...(show.cost ? [money('unitCostCents', 'Unit cost'), money('marginCents', 'Margin')] : []),
    ...(show.price ? [money('unitPriceCents', 'Unit price')] : []),
    ...(show.status ? [{ key: 'active', title: 'Status', width: 110 }] : []),
    ...(show.edit ? [{ key: 'actions', title: 'Actions', width: 80, align: 'right' as const }] : []),
  ];
}
