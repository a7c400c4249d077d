import type { Database, Db } from '@busbar/db';
import { CATEGORIES, type Category, type RollupGrain } from '@busbar/shared';
import { sql } from 'kysely';
import type { LocationScope } from '../access/locations.ts';

/** The stored sums of a period (migration 021), from which every roll-up figure is made. */
export type RollupSums = Omit<Database['rollupFigures'], 'grain' | 'period' | 'locationId'>;

/** The column of a category's job mix: `dc_dc_charger` is `mixDcDcCharger`. */
export const mixColumn = (category: Category) =>
  `mix${category.split('_').map((word) => word[0]!.toUpperCase() + word.slice(1)).join('')}` as keyof RollupSums;

export const SUM_FIELDS = [
  'buildsDelivered', 'buildsBooked', 'revenueCents', 'partsCostCents', 'laborCentihours', 'claimsOpened', 'warrantyCostCents', 'creditsReceivedCents',
  ...CATEGORIES.map(mixColumn),
] as const satisfies readonly (keyof RollupSums)[];

const snake = (field: string) => field.replace(/[A-Z]/g, (c) => `_${c.toLowerCase()}`);
/** The summed columns under their camelCase names, so the rows need no renaming (thousands of rows of 24 columns for the whole network). */
const SUM_COLUMNS = sql.join(SUM_FIELDS.map((field) => sql`${sql.ref(snake(field))} as ${sql.ref(field)}`));

/** Each location's sums in these periods of `grain`, for the locations of `scope`, read from `rollup_figures`. */
export function locationSumsQuery(grain: RollupGrain, periods: string[], scope: LocationScope) {
  const locations = scope === 'all' ? sql`` : sql`and location_id in (${sql.join(scope)})`;
  return sql<RollupSums & { locationId: number; period: string }>`
    select location_id as ${sql.ref('locationId')}, period, ${SUM_COLUMNS} from rollup_figures
    where grain = ${grain} and period in (${sql.join(periods)}) ${locations}`;
}

export async function locationSums(db: Db, grain: RollupGrain, periods: string[], scope: LocationScope) {
  return (await locationSumsQuery(grain, periods, scope).execute(db.withoutPlugins())).rows;
}

/** The whole network's sums in these periods, summed over the locations in `rollup_figures`. */
export function networkSums(db: Db, grain: RollupGrain, periods: string[]) {
  return db
    .selectFrom('rollupFigures')
    .select('period')
    .select((eb) => SUM_FIELDS.map((field) => eb.fn.sum<number>(field).as(field)))
    .where('grain', '=', grain)
    .where('period', 'in', periods)
    .groupBy('period')
    .execute() as Promise<(RollupSums & { period: string })[]>;
}

/** Every location with its region, to sum regions wholly in a person's scope. */
export const locationRegions = (db: Db) => db.selectFrom('locations').select(['id', 'regionId']).execute();
