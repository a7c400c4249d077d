import type { Db } from '@busbar/db';
import type { CustomerBuildRow, CustomerHistoryQuery, Page } from '@busbar/shared';
import { sql } from 'kysely';
import type { LocationScope } from '../access/locations.ts';
import type { PlanRow } from './plans.ts';
import { cappedCount, offsetOf } from './paging.ts';

const empty = (paging: CustomerHistoryQuery) => ({ items: [], total: 0, totalCapped: false, ...paging });

/** A customer's builds in the scope, newest first (the builds' customer index). */
export async function customerBuilds(db: Db, customerId: number, scope: LocationScope, paging: CustomerHistoryQuery): Promise<Page<CustomerBuildRow>> {
  if (scope !== 'all' && scope.length === 0) return empty(paging);
  let matching = db.selectFrom('builds as b').where('b.customerId', '=', customerId);
  if (scope !== 'all') matching = matching.where('b.locationId', 'in', scope);
  const [items, count] = await Promise.all([
    matching
      .innerJoin('vehicles as v', 'v.id', 'b.vehicleId')
      .select([
        'b.id', 'b.number', 'b.locationId', 'b.vehicleId', 'b.status', 'b.bookedFor', 'b.deliveredAt', 'b.createdAt', 'b.totalCents',
        sql<string>`v.year || ' ' || v.make || ' ' || v.model`.as('vehicleLabel'),
      ])
      .orderBy('b.createdAt', 'desc')
      .orderBy('b.id', 'desc')
      .limit(paging.pageSize)
      .offset(offsetOf(paging.page, paging.pageSize))
      .execute(),
    cappedCount(db, matching.select('b.id')),
  ]);
  return { items, ...count, ...paging };
}

/** The plans of a customer's builds in the scope (of builds and of plans), most recently saved first. */
export async function customerPlans(db: Db, customerId: number, scope: LocationScope, paging: CustomerHistoryQuery) {
  if (scope !== 'all' && scope.length === 0) return { rows: [] as (PlanRow & { buildNumber: string })[], total: 0, totalCapped: false, ...paging };
  let matching = db.selectFrom('powerPlans as p').innerJoin('builds as b', 'b.id', 'p.buildId').where('b.customerId', '=', customerId);
  if (scope !== 'all') matching = matching.where('b.locationId', 'in', scope).where('p.locationId', 'in', scope);
  const [rows, count] = await Promise.all([
    matching
      .leftJoin('users as u', 'u.id', 'p.updatedBy')
      .select(['p.id', 'p.buildId', 'p.locationId', 'p.name', 'p.input', 'p.version', 'p.updatedAt', 'u.name as updatedByName', 'b.number as buildNumber'])
      .orderBy('p.updatedAt', 'desc')
      .orderBy('p.id', 'desc')
      .limit(paging.pageSize)
      .offset(offsetOf(paging.page, paging.pageSize))
      .execute(),
    cappedCount(db, matching.select('p.id')),
  ]);
  return { rows, ...count, ...paging };
}
