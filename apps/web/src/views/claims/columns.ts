import { localDay } from '@busbar/calc';
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

/**
 * Days since the claim was logged, counted in days at its location as its due days and the
 * logging-day filters are (logged yesterday evening there is "1 day" this morning), e.g. "12 days".
 */
export function claimAge(createdAt: string, timeZone: string, now = Date.now()): string {
  const days = Math.max(0, localDay(timeZone, now) - localDay(timeZone, Date.parse(createdAt)));
  return days === 1 ? '1 day' : `${days} days`;
}
