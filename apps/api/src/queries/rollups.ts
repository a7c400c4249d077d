import type { Db } from '@busbar/db';
import type { Category, RollupGrain } from '@busbar/shared';
import { sql } from 'kysely';
import type { LocationScope } from '../access/locations.ts';

/** The stored sums of a period (migration 021), from which every roll-up figure is made. */
export interface RollupSums {
  buildsDelivered: number;
  buildsBooked: number;
  revenueCents: number;
  partsCostCents: number;
  laborCentihours: number;
  claimsOpened: number;
  warrantyCostCents: number;
  creditsReceivedCents: number;
}

export const SUM_FIELDS = [
  'buildsDelivered', 'buildsBooked', 'revenueCents', 'partsCostCents', 'laborCentihours', 'claimsOpened', 'warrantyCostCents', 'creditsReceivedCents',
] as const satisfies readonly (keyof RollupSums)[];

export interface JobMixCount {
  period: string;
  category: Category;
  builds: number;
}

/** Each location's sums in these periods of `grain`, for the locations of `scope`, read from `rollup_figures`. */
export function locationSums(db: Db, grain: RollupGrain, periods: string[], scope: LocationScope) {
  let query = db.selectFrom('rollupFigures').select(['locationId', 'period', ...SUM_FIELDS]).where('grain', '=', grain).where('period', 'in', periods);
  if (scope !== 'all') query = query.where('locationId', 'in', scope);
  return query.execute();
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

/** Each location's delivered builds by category in these periods, from `rollup_job_mix`. */
export function locationJobMix(db: Db, grain: RollupGrain, periods: string[], scope: LocationScope) {
  let query = db
    .selectFrom('rollupJobMix')
    .select(['locationId', 'period', 'category', 'builds'])
    .where('grain', '=', grain)
    .where('period', 'in', periods)
    .where('builds', '!=', 0);
  if (scope !== 'all') query = query.where('locationId', 'in', scope);
  return query.execute();
}

/** The whole network's delivered builds by category in these periods. */
export function networkJobMix(db: Db, grain: RollupGrain, periods: string[]): Promise<JobMixCount[]> {
  return db
    .selectFrom('rollupJobMix')
    .select(['period', 'category', sql<number>`sum(builds)`.as('builds')])
    .where('grain', '=', grain)
    .where('period', 'in', periods)
    .groupBy(['period', 'category'])
    .having(sql`sum(builds)`, '!=', 0)
    .execute();
}

/** Every location with its region, to sum regions wholly in a person's scope. */
export const locationRegions = (db: Db) => db.selectFrom('locations').select(['id', 'regionId']).execute();
