import type { BuildView } from '@busbar/shared';
import type { TableColumnsType } from 'ant-design-vue';
import type { BuildSort } from '../../api/builds.ts';

/**
 * The build list's columns. Sortable columns carry the API's sort name as their key; the shop
 * column only for people who see more than one shop, the total only for people who read prices.
 * A list of deliveries (narrowed to days of delivery) shows the day of delivery where others show the booking.
 * The customer takes what the others leave: with every column, the owner's list fits 1280 px.
 */
export function buildColumns(
  show: { shop: boolean; total: boolean; deliveries: boolean },
  sort: BuildSort,
  order: 'asc' | 'desc',
): TableColumnsType<BuildView> {
  const sortable = (key: BuildSort) => ({
    sorter: true,
    sortDirections: ['ascend' as const, 'descend' as const],
    sortOrder: key === sort ? (order === 'asc' ? ('ascend' as const) : ('descend' as const)) : null,
  });
  const columns: TableColumnsType<BuildView> = [
    { key: 'number', title: 'Build', dataIndex: 'number', width: 100, ...sortable('number') },
    { key: 'customer', title: 'Customer and vehicle', ellipsis: true },
    { key: 'status', title: 'Status', width: 136, ...sortable('status') },
    { key: 'lead', title: 'Lead technician', dataIndex: 'leadTechnicianName', width: 140, ellipsis: true },
    show.deliveries
      ? { key: 'deliveredOn', title: 'Delivered', width: 112, ...sortable('deliveredOn') }
      : { key: 'bookedFor', title: 'Booked for', width: 112, ...sortable('bookedFor') },
    { key: 'updatedAt', title: 'Last change', width: 120, ...sortable('updatedAt') },
  ];
  if (show.shop) columns.splice(2, 0, { key: 'location', title: 'Shop', dataIndex: 'locationCode', width: 64 });
  if (show.total) columns.splice(-1, 0, { key: 'totalCents', title: 'Total', align: 'right', width: 100, ...sortable('totalCents') });
  return columns;
}
