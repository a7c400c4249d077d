import { addMonthsIso, dayOfIso } from '@busbar/calc';
import type { Db } from '@busbar/db';
import type { Coverage, FailureMode } from '@busbar/shared';

export interface UnitFailure {
  locationId: number;
  /** Days since 1970-01-01 (UTC). */
  installedDay: number;
  failedDay: number;
  failureMode: FailureMode;
  coverage: Coverage;
}

/** Every failure of these catalog items across the network among units installed in the months (YYYY-MM, inclusive). */
export async function unitFailures(db: Db, itemIds: number[], months: { from?: string; to?: string }): Promise<UnitFailure[]> {
  if (itemIds.length === 0) return [];
  let query = db.selectFrom('unitFailures').select(['locationId', 'installedDay', 'failedDay', 'failureMode', 'coverage']).where('catalogItemId', 'in', itemIds);
  if (months.from) query = query.where('installedDay', '>=', dayOfIso(`${months.from}-01`));
  if (months.to) query = query.where('installedDay', '<', dayOfIso(addMonthsIso(`${months.to}-01`, 1)));
  return query.execute();
}

/** The catalog items of an item, category or vendor. */
export async function itemsOf(db: Db, group: { groupBy: 'item' | 'category' | 'vendor'; key: number | string }): Promise<number[]> {
  let query = db.selectFrom('catalogItems').select('id');
  if (group.groupBy === 'item') query = query.where('id', '=', Number(group.key));
  else if (group.groupBy === 'vendor') query = query.where('vendorId', '=', Number(group.key));
  else query = query.where('category', '=', group.key as never);
  return (await query.execute()).map((row) => row.id);
}
