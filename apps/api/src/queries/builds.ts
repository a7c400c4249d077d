import type { Db } from '@busbar/db';
import type { BuildEventView, BuildItemView, BuildQuery, BuildStatus, BuildView, Page } from '@busbar/shared';
import { sql } from 'kysely';
import { contains } from './search.ts';

export type BuildRow = Required<Omit<BuildView, 'marginCents'>>;


function buildsWithNames(db: Db) {
  return db
    .selectFrom('builds as b')
    .innerJoin('locations as l', 'l.id', 'b.locationId')
    .innerJoin('customers as c', 'c.id', 'b.customerId')
    .innerJoin('vehicles as v', 'v.id', 'b.vehicleId')
    .leftJoin('users as t', 't.id', 'b.leadTechnicianId')
    .select([
      'b.id', 'b.number', 'b.locationId', 'l.code as locationCode', 'b.customerId', 'c.name as customerName', 'b.vehicleId',
      sql<string>`v.year || ' ' || v.make || ' ' || v.model`.as('vehicleLabel'),
      'b.status', 'b.leadTechnicianId', 't.name as leadTechnicianName', 'b.bookedFor', 'b.startedAt', 'b.deliveredAt',
      'b.laborHours', 'b.laborRateCents', 'b.laborCents', 'b.partsPriceCents', 'b.partsCostCents', 'b.totalCents',
      'b.notes', 'b.version', 'b.createdAt', 'b.updatedAt',
    ]);
}

const SORT_COLUMNS = {
  number: 'b.number',
  bookedFor: 'b.bookedFor',
  status: 'b.status',
  totalCents: 'b.totalCents',
  updatedAt: 'b.updatedAt',
} as const;

/** One page of builds at the given locations, filtered and sorted as asked. */
export async function listBuilds(db: Db, locationIds: number[], query: BuildQuery): Promise<Page<BuildRow>> {
  const page = { page: query.page, pageSize: query.pageSize };
  if (locationIds.length === 0) return { items: [], total: 0, ...page };
  const statuses = query.status === undefined ? [] : ([] as BuildStatus[]).concat(query.status);
  const filtered = buildsWithNames(db).where((eb) => {
    const conditions = [eb('b.locationId', 'in', locationIds)];
    if (statuses.length > 0) conditions.push(eb('b.status', 'in', statuses));
    if (query.locationId) conditions.push(eb('b.locationId', '=', query.locationId));
    if (query.technicianId) conditions.push(eb('b.leadTechnicianId', '=', query.technicianId));
    if (query.from) conditions.push(eb('b.bookedFor', '>=', query.from));
    if (query.to) conditions.push(eb('b.bookedFor', '<=', query.to));
    if (query.hasPlan) {
      const planned = eb.exists(eb.selectFrom('powerPlans as p').select('p.id').whereRef('p.buildId', '=', 'b.id'));
      conditions.push(query.hasPlan === 'true' ? planned : eb.not(planned));
    }
    if (query.q) {
      const q = query.q;
      const bySerial = eb.exists(
        eb.selectFrom('buildItems as i').select('i.id').whereRef('i.buildId', '=', 'b.id').where(contains('i.serialNumber', q)),
      );
      conditions.push(eb.or([contains('b.number', q), contains('c.name', q), bySerial]));
    }
    return eb.and(conditions);
  });
  const [items, count] = await Promise.all([
    filtered
      .orderBy(SORT_COLUMNS[query.sort], query.order)
      .orderBy('b.id', query.order)
      .limit(query.pageSize)
      .offset((query.page - 1) * query.pageSize)
      .execute(),
    filtered.clearSelect().select((eb) => eb.fn.countAll<number>().as('n')).executeTakeFirstOrThrow(),
  ]);
  return { items, total: Number(count.n), ...page };
}

export function findBuild(db: Db, id: number): Promise<BuildRow | undefined> {
  return buildsWithNames(db).where('b.id', '=', id).executeTakeFirst();
}

export async function buildItems(db: Db, buildId: number): Promise<Required<BuildItemView>[]> {
  const rows = await db
    .selectFrom('buildItems as i')
    .innerJoin('catalogItems as ci', 'ci.id', 'i.catalogItemId')
    .select(['i.id', 'i.catalogItemId', 'i.sku', 'ci.name', 'ci.category', 'i.quantity', 'ci.serialized', 'i.serialNumber', 'i.unitPriceCents', 'i.unitCostCents'])
    .where('i.buildId', '=', buildId)
    .orderBy('i.id')
    .execute();
  return rows.map((row) => ({ ...row, serialized: row.serialized === 1 }));
}

export function buildEvents(db: Db, buildId: number): Promise<BuildEventView[]> {
  return db
    .selectFrom('buildEvents as e')
    .leftJoin('users as u', 'u.id', 'e.actorId')
    .select(['e.id', 'e.at', 'u.name as actorName', 'e.kind', 'e.fromStatus', 'e.toStatus', 'e.note'])
    .where('e.buildId', '=', buildId)
    .orderBy('e.id')
    .execute();
}

/** The next number of a location's builds: its code and a five-digit sequence. */
export async function nextBuildNumber(db: Db, location: { id: number; code: string }): Promise<{ sequence: number; number: string }> {
  const row = await db
    .selectFrom('builds')
    .select((eb) => eb.fn.max('sequence').as('last'))
    .where('locationId', '=', location.id)
    .executeTakeFirst();
  const sequence = Number(row?.last ?? 0) + 1;
  return { sequence, number: `${location.code}-${String(sequence).padStart(5, '0')}` };
}
