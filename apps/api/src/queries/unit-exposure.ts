import type { Database, Db } from '@busbar/db';
import type { Category, ReliabilityGroup } from '@busbar/shared';
import { sql, type ExpressionBuilder, type RawBuilder, type SqlBool } from 'kysely';
import type { LocationScope } from '../access/locations.ts';
import { wholeRegions } from './regions.ts';

/** Which units: an item, category or vendor (or all), at these locations, installed in these months (YYYY-MM, inclusive). */
export interface UnitFilter {
  group?: { groupBy: ReliabilityGroup; key: number | Category };
  scope: LocationScope;
  from?: string;
  to?: string;
}

/** Sums over `unit_exposure` cells; `completed…` count only units whose whole warranty has passed by today. */
export interface UnitSums {
  units: number;
  installedDaySum: number;
  failures: number;
  failedInstalledDaySum: number;
  failedDaySum: number;
  completedUnits: number;
  completedWarrantyFailures: number;
}

/** What the cells are summed by; the location and the bands need the per-location cells. */
export type CellKey = 'item' | 'itemQuarter' | 'category' | 'vendor' | 'month' | 'none' | 'location' | 'bands';
const NETWORK_KEYS: readonly CellKey[] = ['item', 'itemQuarter', 'category', 'vendor', 'month', 'none'];

const KEY_COLUMNS: Record<CellKey, string> = {
  item: 'x.catalog_item_id',
  // `${itemId} ${YYYY}-Q${1–4}`: a third of the rows of item and month, each row costing more to read than to sum.
  itemQuarter: "x.catalog_item_id || ' ' || substr(x.installed_month, 1, 4) || '-Q' || ((substr(x.installed_month, 6, 2) + 2) / 3)",
  category: 'ci.category',
  vendor: 'ci.vendor_id',
  month: 'x.installed_month',
  none: '0',
  location: 'x.location_id',
  // Two digits: the margin measure (1 drop, 2 load, 3 discharge) and its band, of planned builds only.
  bands: 'x.measure * 10 + x.band',
};

/** The catalog's items as the cells are judged by: a unit installed before `completedBefore` has seen its whole warranty. */
interface ItemTerms {
  id: number;
  category: Category;
  vendorId: number;
  completedBefore: string;
}
type Cells = ExpressionBuilder<Database & { x: Database['unitExposure']; ci: ItemTerms }, 'x' | 'ci'>;

/**
 * The cells' sums by `key`, for the units `filter` picks, as of `today` (YYYY-MM-DD): the margin
 * bands from `unit_exposure_bands`, the whole network's by item or month (or bands) from
 * `unit_exposure_network` (`…_bands_network`), a few rows per item, and whole regions' from
 * `unit_exposure_region` (`…_bands_region`); the rest from `unit_exposure`.
 */
export async function unitSums(db: Db, filter: UnitFilter, key: CellKey, today: string): Promise<(UnitSums & { key: string | number })[]> {
  const keyColumn = sql.raw<string | number>(KEY_COLUMNS[key]);
  const completed = sql`x.installed_month < ci.completed_before`;
  const total = (column: RawBuilder<unknown>) => sql<number>`coalesce(sum(${column}), 0)`;
  const summed = NETWORK_KEYS.includes(key) || key === 'bands';
  const regions = filter.scope !== 'all' && summed ? await wholeRegions(db, filter.scope) : null;
  const table = !summed
    ? 'unitExposure'
    : `unitExposure${key === 'bands' ? 'Bands' : ''}${filter.scope === 'all' ? 'Network' : regions ? 'Region' : ''}`;
  // The network's and the regions' sums have their cells' columns less the location, which they are never asked by.
  let query = db
    // Worked out once per item, not once per cell: a month's date arithmetic on every cell was most of a category's time.
    .with(
      (cte) => cte('ci').materialized(),
      (q) =>
        q
          .selectFrom('catalogItems')
          // A unit installed in month M with W months of warranty has seen all of it once M + W months lies before this month.
          .select(['id', 'category', 'vendorId', sql<string>`strftime('%Y-%m', ${today}, '-' || warranty_months || ' months')`.as('completedBefore')]),
    )
    .selectFrom(`${table} as x` as 'unitExposure as x')
    .innerJoin('ci', 'ci.id', 'x.catalogItemId')
    .select([
      keyColumn.as('key'),
      total(sql`x.units`).as('units'),
      total(sql`x.installed_day_sum`).as('installedDaySum'),
      total(sql`x.failures`).as('failures'),
      total(sql`x.failed_installed_day_sum`).as('failedInstalledDaySum'),
      total(sql`x.failed_day_sum`).as('failedDaySum'),
      total(sql`case when ${completed} then x.units end`).as('completedUnits'),
      total(sql`case when ${completed} then x.warranty_failures end`).as('completedWarrantyFailures'),
    ])
    .where((eb) => eb.and(conditions(eb, filter, regions)));
  if (key !== 'none') query = query.groupBy(keyColumn);
  return (await query.execute()) as (UnitSums & { key: string | number })[];
}

/** Time in service and failures of units, without the counts of completed warranties. */
export type ServiceSums = Pick<UnitSums, 'units' | 'installedDaySum' | 'failures' | 'failedDaySum'>;

/**
 * Each location's units that `filter` picks, by location id: from `unit_exposure_lifetime` (one row
 * per item and location) when every install month is asked, else summed from the cells.
 */
export async function serviceByLocation(db: Db, filter: UnitFilter, today: string): Promise<Map<number, ServiceSums>> {
  if (filter.from || filter.to) return new Map((await unitSums(db, filter, 'location', today)).map(({ key, ...sums }) => [Number(key), sums]));
  const total = (column: string) => sql<number>`sum(${sql.ref(`x.${column}`)})`;
  const rows = await db
    .selectFrom('unitExposureLifetime as x')
    .innerJoin('catalogItems as ci', 'ci.id', 'x.catalogItemId')
    .select(['x.locationId', total('units').as('units'), total('installedDaySum').as('installedDaySum'), total('failures').as('failures'), total('failedDaySum').as('failedDaySum')])
    // The item, vendor, category and location conditions name only columns the lifetime rows share with the cells.
    .where((eb) => eb.and(conditions(eb as unknown as Cells, filter, null)))
    .groupBy('x.locationId')
    .execute();
  return new Map(rows.map(({ locationId, ...sums }) => [locationId, sums]));
}

function conditions(eb: Cells, { group, scope, from, to }: UnitFilter, regions: number[] | null) {
  const list = [];
  if (group?.groupBy === 'item') list.push(eb('x.catalogItemId', '=', Number(group.key)));
  if (group?.groupBy === 'vendor') list.push(eb('ci.vendorId', '=', Number(group.key)));
  if (group?.groupBy === 'category') list.push(eb('ci.category', '=', group.key as Category));
  if (regions) list.push(sql<SqlBool>`x.region_id in (${sql.join(regions)})`);
  else if (scope !== 'all') list.push(eb('x.locationId', 'in', scope.length > 0 ? scope : [0]));
  if (from) list.push(eb('x.installedMonth', '>=', from));
  if (to) list.push(eb('x.installedMonth', '<=', to));
  return list;
}
