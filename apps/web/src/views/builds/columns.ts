import type { BuildView } from '@busbar/shared';
import type { TableColumnsType } from 'ant-design-vue';
import type { BuildSort } from '../../api/builds.ts';

/**
 * The build list's columns. Sortable columns carry the API's sort name as their key; the shop
 * column only for people who see more than one shop, the total only for people who read prices.
 */
export function buildColumns(
  show: { shop: boolean; total: boolean },
  sort: BuildSort,
  order: 'asc' | 'desc',
): TableColumnsType<BuildView> {
  const sortable = (key: BuildSort) => ({
    sorter: true,
    sortDirections: ['ascend' as const, 'descend' as const],
    sortOrder: key === sort ? (order === 'asc' ? ('ascend' as const) : ('descend' as const)) : null,
  });
  const columns: TableColumnsType<BuildView> = [
    { key: 'number', title: 'Build', dataIndex: 'number', width: 110, ...sortable('number') },
    { key: 'customer', title: 'Customer and vehicle', width: 250, ellipsis: true },
    { key: 'status', title: 'Status', width: 140, ...sortable('status') },
    { key: 'lead', title: 'Lead technician', dataIndex: 'leadTechnicianName', width: 150, ellipsis: true },
    { key: 'bookedFor', title: 'Booked for', width: 120, ...sortable('bookedFor') },
    { key: 'updatedAt', title: 'Last change', width: 130, ...sortable('updatedAt') },
  ];
  if (show.shop) columns.splice(2, 0, { key: 'location', title: 'Shop', dataIndex: 'locationCode', width: 70 });
  if (show.total) columns.splice(-1, 0, { key: 'totalCents', title: 'Total', align: 'right', width: 110, ...sortable('totalCents') });
  return columns;
}
