import type { Database, Db } from '@busbar/db';
import { sql, type Expression, type ExpressionBuilder, type SqlBool } from 'kysely';
import { SEARCH_CAP, type CustomerBody, type CustomerView, type Page } from '@busbar/shared';
import type { LocationScope } from '../access/locations.ts';
import { cappedCount, offsetOf, type Count } from './paging.ts';
import { cappedMatches, contains, countCapFor, inPlaces, inShopRange, isIndexable, newestFirst, newestOfShops, phrase, readsShopRanges, shopRowId } from './search.ts';

const CUSTOMER_COLUMNS = [
  'id', 'locationId', 'name', 'email', 'phone', 'addressLine1', 'addressLine2', 'city', 'region', 'postalCode', 'notes', 'version',
] as const;

type CustomerFields = Omit<CustomerBody, 'locationId'>;

export interface CustomerFilter {
  /** The locations whose customers the person may read, narrowed by the request's filter. */
  scope: LocationScope;
  q?: string | undefined;
  /** Where the person may read each contact field, and so may search by it. */
  emailScope: LocationScope;
  phoneScope: LocationScope;
  page: number;
  pageSize: number;
}

const sameScope = (a: LocationScope, b: LocationScope) => (a === 'all' ? b === 'all' : b !== 'all' && a.length === b.length && a.every((id, i) => id === b[i]));

/** Customers a scope sorts by name in memory; past it, walking the name index finds a page sooner. */
const SORT_MAX = 2_000;

/** In the scope; `walk` keeps the location index out of it, so SQLite walks the names in order instead. */
function inScope(eb: ExpressionBuilder<Database, 'customers'>, scope: LocationScope, walk = false): Expression<SqlBool> {
  if (scope === 'all') return eb.lit(true);
  return walk ? eb(sql<number>`+${sql.ref('customers.locationId')}`, 'in', scope) : eb('customers.locationId', 'in', scope);
}

/** The name, or the e-mail and phone where the person reads them, contain `q` in any case (LIKE). */
function textMatches(eb: ExpressionBuilder<Database, 'customers'>, filter: CustomerFilter, q: string): Expression<SqlBool> {
  const terms: Expression<SqlBool>[] = [contains('customers.name', q)];
  if (filter.emailScope === 'all' || filter.emailScope.length > 0) terms.push(eb.and([contains('customers.email', q), inScope(eb, filter.emailScope)]));
  if (filter.phoneScope === 'all' || filter.phoneScope.length > 0) terms.push(eb.and([contains('customers.phone', q), inScope(eb, filter.phoneScope)]));
  return eb.or(terms);
}

/** The customers of the scope; `walk` keeps the location index out of it (see inScope). */
const inScopeOf = (db: Db, scope: LocationScope, walk: boolean) => db.selectFrom('customers').where((eb) => inScope(eb, scope, walk));

/**
 * Customers of the filter and how many there are. Text of 3 or more characters walks the full-text
 * index newest first, once: of the candidates whose name, or e-mail and phone where the person reads
 * them, contain it, the first SEARCH_CAP + 1 are the list (the newest SEARCH_CAP) and its count (one
 * more tells there are more). Shorter text is matched row by row.
 */
async function matchingCustomers(db: Db, filter: CustomerFilter): Promise<{ matching: (walk: boolean) => ReturnType<typeof inScopeOf>; count: Count }> {
  const { q, scope } = filter;
  if (!q || !isIndexable(q)) {
    const matching = (walk: boolean) => (q ? inScopeOf(db, scope, walk).where((eb) => textMatches(eb, filter, q)) : inScopeOf(db, scope, walk));
    return { matching, count: await cappedCount(db, matching(false).select('id'), countCapFor(q)) };
  }
  // The index answers for a field the person reads wherever they read customers; one they read
  // at some of those places only is looked for there, each candidate checked again with LIKE.
  const fields = [['email', filter.emailScope], ['phone', filter.phoneScope]] as const;
  const partly = fields.some(([, at]) => at !== 'all' && at.length > 0 && !sameScope(at, scope));
  const columns = ['name', ...fields.filter(([, at]) => at === 'all' || at.length > 0).map(([name]) => name)];
  const candidates = (shops: LocationScope) => {
    const inShops = inScopeOf(db, shops, false);
    return partly ? inShops.where((eb) => textMatches(eb, filter, q)) : inShops;
  };
  const match = `{${columns.join(' ')}} : ${phrase(q)}`;
  // A few shops: each one's range of the per-shop index (see search.ts).
  const ofShop = (locationId: number) =>
    candidates([locationId])
      .innerJoin(sql<{ rowid: number }>`shop_customer_search`.as('s'), (join) => join.on(sql<SqlBool>`customers.id = ${shopRowId(locationId)}`))
      .where(sql<SqlBool>`s.shop_customer_search match ${match} and ${inShopRange(locationId)}`)
      .select('customers.id')
      .orderBy(sql`s.rowid`, 'desc')
      .limit(SEARCH_CAP + 1)
      .execute();
  const newest = readsShopRanges(scope)
    ? await newestOfShops(scope, ofShop, (row) => row.id, SEARCH_CAP + 1)
    : await candidates(scope)
        .innerJoin(sql<{ rowid: number }>`customer_search`.as('s'), 's.rowid', 'customers.id')
        .where(sql<SqlBool>`s.customer_search match ${inPlaces(match, scope)}`)
        .select('customers.id')
        .orderBy(newestFirst(scope), 'desc')
        .limit(SEARCH_CAP + 1)
        .execute();
  const { kept, count } = cappedMatches(newest);
  const ids = kept.map((row) => row.id);
  return { matching: () => db.selectFrom('customers').where((eb) => (ids.length === 0 ? eb.lit(false) : eb('id', 'in', ids))), count };
}

/** Customers by name, a page at a time; a text search lists its newest SEARCH_CAP matches. */
export async function listCustomers(db: Db, filter: CustomerFilter): Promise<Page<CustomerView>> {
  const { page, pageSize, scope } = filter;
  if (scope !== 'all' && scope.length === 0) return { items: [], total: 0, totalCapped: false, page, pageSize };
  const { matching, count } = await matchingCustomers(db, filter);
  // One shop reads its names in order from its own index; several shops' names are merged by a sort
  // or a walk. A text search's few matches are sorted whatever the scope.
  const walkNames = scope !== 'all' && scope.length > 1 && (count.totalCapped || count.total > SORT_MAX);
  const items = await matching(walkNames)
    .select(CUSTOMER_COLUMNS)
    .orderBy('name')
    .orderBy('id')
    .limit(pageSize)
    .offset(offsetOf(page, pageSize))
    .execute();
  return { items, ...count, page, pageSize };
}

export function findCustomer(db: Db, id: number): Promise<CustomerView | undefined> {
  return db.selectFrom('customers').select(CUSTOMER_COLUMNS).where('id', '=', id).executeTakeFirst();
}

export async function insertCustomer(db: Db, body: CustomerBody, createdAt: string): Promise<number> {
  const row = await db.insertInto('customers').values({ ...body, createdAt }).returning('id').executeTakeFirstOrThrow();
  return row.id;
}

/** Writes an edit made against `version`; false when the customer has changed since. */
export async function updateCustomer(db: Db, id: number, version: number, fields: CustomerFields): Promise<boolean> {
  const result = await db
    .updateTable('customers')
    .set((eb) => ({ ...fields, version: eb('version', '+', 1) }))
    .where('id', '=', id)
    .where('version', '=', version)
    .executeTakeFirst();
  return result.numUpdatedRows > 0n;
}
