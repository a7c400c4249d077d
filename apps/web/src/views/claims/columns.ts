import type { ClaimView } from '@busbar/shared';
import type { TableColumnsType } from 'ant-design-vue';

/**
 * The claim queue's columns; the shop column only for people who see more than one shop. A phone
 * gets one column that stacks what matters, so the queue never scrolls sideways.
 */
export function claimColumns(show: { shop: boolean; narrow: boolean }): TableColumnsType<ClaimView> {
  if (show.narrow) return [{ key: 'summary', title: 'Claim, next step and unit' }];
  const columns: TableColumnsType<ClaimView> = [
    { key: 'number', title: 'Claim', dataIndex: 'number', width: 110 },
    { key: 'due', title: 'Next step', width: 190 },
    { key: 'status', title: 'Status', width: 140 },
    { key: 'unit', title: 'Unit and build', width: 240, ellipsis: true },
    { key: 'failure', title: 'Failure and coverage', width: 170, ellipsis: true },
    { key: 'age', title: 'Age', width: 80, align: 'right' },
  ];
  if (show.shop) columns.splice(1, 0, { key: 'location', title: 'Shop', width: 70 });
  return columns;
}

/** Whole days since the claim was logged, e.g. "12 days". */
export function claimAge(createdAt: string, now = Date.now()): string {
  const days = Math.max(0, Math.floor((now - Date.parse(createdAt)) / 86_400_000));
  return days === 1 ? '1 day' : `${days} days`;
}
