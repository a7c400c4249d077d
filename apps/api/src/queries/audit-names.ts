import type { Db } from '@busbar/db';
import { sql } from 'kysely';
import type { LocationScope } from '../access/locations.ts';

/** Names and numbers of the records audit rows point at, as far as the reader may see them. */
export interface AuditNames {
  builds: Map<number, string>;
  claims: Map<number, string>;
  customers: Map<number, string>;
  vehicles: Map<number, string>;
  users: Map<number, string>;
  locations: Map<number, string>;
  regions: Map<number, string>;
  vendors: Map<number, string>;
  catalog: Map<number, string>;
  /** Catalog names by SKU, for build lines (which keep their SKU). */
  skus: Map<string, string>;
  plans: Map<number, string>;
}

export type NameKind = keyof AuditNames;

/** Which record kind an entity of the log, or an id field of its before/after, names. */
export const ENTITY_KINDS: Record<string, NameKind> = {
  build: 'builds',
  claim: 'claims',
  customer: 'customers',
  vehicle: 'vehicles',
  user: 'users',
  location: 'locations',
  vendor: 'vendors',
  catalog_item: 'catalog',
  plan: 'plans',
};
const FIELD_KINDS: Record<string, NameKind> = {
  buildId: 'builds',
  customerId: 'customers',
  vehicleId: 'vehicles',
  leadTechnicianId: 'users',
  userId: 'users',
  locationId: 'locations',
  regionId: 'regions',
  vendorId: 'vendors',
  catalogItemId: 'catalog',
};

export interface AuditRowRef {
  actorId?: number | null;
  entity: string;
  entityId: number | null;
  before: unknown;
  after: unknown;
}

/** Every id (and SKU) the rows point at, by kind. */
export function referencesOf(rows: readonly AuditRowRef[]): Map<NameKind, Set<number | string>> {
  const refs = new Map<NameKind, Set<number | string>>();
  const add = (kind: NameKind, value: unknown) => {
    if (!(typeof value === 'number' && Number.isInteger(value)) && !(kind === 'skus' && typeof value === 'string')) return;
    if (!refs.has(kind)) refs.set(kind, new Set());
    refs.get(kind)!.add(value);
  };
  for (const row of rows) {
    const kind = ENTITY_KINDS[row.entity];
    if (kind) add(kind, row.entityId);
    add('users', row.actorId);
    for (const side of [row.before, row.after]) {
      if (!side || typeof side !== 'object') continue;
      for (const [field, value] of Object.entries(side)) {
        if (FIELD_KINDS[field]) add(FIELD_KINDS[field], value);
        if (field === 'sku') add('skus', value);
      }
    }
  }
  return refs;
}

const inScope = (scope: LocationScope, column: string) => (scope === 'all' ? sql<boolean>`1 = 1` : scope.length === 0 ? sql<boolean>`1 = 0` : sql<boolean>`${sql.ref(column)} in (${sql.join(scope)})`);

/**
 * Looks up the names the rows point at. Records bound to a location are named only inside `scope`
 * (the reader's locations), people only where they hold a role at one of them: a name the reader
 * could not look up is left out, and the words say "a build", "a person".
 */
export async function loadAuditNames(db: Db, scope: LocationScope, refs: Map<NameKind, Set<number | string>>): Promise<AuditNames> {
  const ids = (kind: NameKind) => [...(refs.get(kind) ?? [])] as number[];
  const pairs = async <T extends string | number>(kind: NameKind, read: (list: number[]) => Promise<{ id: T; name: string }[]>) => {
    const list = ids(kind);
    return new Map(list.length === 0 ? [] : (await read(list)).map((r) => [r.id, r.name] as const));
  };
  const [builds, claims, customers, vehicles, users, locations, regions, vendors, catalog, skus, plans] = await Promise.all([
    pairs('builds', (list) => db.selectFrom('builds').select(['id', 'number as name']).where('id', 'in', list).where(inScope(scope, 'locationId')).execute()),
    pairs('claims', (list) => db.selectFrom('warrantyClaims').select(['id', 'number as name']).where('id', 'in', list).where(inScope(scope, 'locationId')).execute()),
    pairs('customers', (list) => db.selectFrom('customers').select(['id', 'name']).where('id', 'in', list).where(inScope(scope, 'locationId')).execute()),
    pairs('vehicles', (list) =>
      db.selectFrom('vehicles').select(['id', sql<string>`year || ' ' || make || ' ' || model`.as('name')]).where('id', 'in', list).where(inScope(scope, 'locationId')).execute()),
    pairs('users', (list) => {
      let q = db.selectFrom('users').select(['id', 'name']).where('id', 'in', list);
      if (scope !== 'all') q = q.where('id', 'in', db.selectFrom('roleAssignments').select('userId').where(inScope(scope, 'locationId')));
      return q.execute();
    }),
    pairs('locations', (list) =>
      db.selectFrom('locations').select(['id', sql<string>`name || ' (' || code || ')'`.as('name')]).where('id', 'in', list).where(inScope(scope, 'id')).execute()),
    pairs('regions', (list) => {
      let q = db.selectFrom('regions').select(['id', 'name']).where('id', 'in', list);
      if (scope !== 'all') q = q.where('id', 'in', db.selectFrom('locations').select('regionId').where(inScope(scope, 'id')));
      return q.execute();
    }),
    pairs('vendors', (list) => db.selectFrom('vendors').select(['id', 'name']).where('id', 'in', list).execute()),
    pairs('catalog', (list) => db.selectFrom('catalogItems').select(['id', sql<string>`name || ' (SKU ' || sku || ')'`.as('name')]).where('id', 'in', list).execute()),
    pairs<string>('skus', async () => {
      const list = [...(refs.get('skus') ?? [])] as string[];
      return db.selectFrom('catalogItems').select(['sku as id', 'name']).where('sku', 'in', list).execute();
    }),
    pairs('plans', (list) =>
      db
        .selectFrom('powerPlans as p')
        .leftJoin('builds as b', 'b.id', 'p.buildId')
        .select(['p.id', sql<string>`coalesce('build ' || b.number, '"' || p.name || '"')`.as('name')])
        .where('p.id', 'in', list)
        .where(inScope(scope, 'p.locationId'))
        .execute()),
  ]);
  return { builds, claims, customers, vehicles, users, locations, regions, vendors, catalog, skus, plans } as AuditNames;
}
