import type { Database, Db } from '@busbar/db';
import { sql, type Expression, type ExpressionBuilder, type SqlBool } from 'kysely';
import { SEARCH_CAP, type CustomerBody, type CustomerView, type Page } from '@busbar/shared';
import type { LocationScope } from '../access/locations.ts';
import { cappedCount, offsetOf } from './paging.ts';
import { contains, countCapFor, inPlaces, isIndexable, phrase } from './search.ts';

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

const inScope = (eb: ExpressionBuilder<Database, 'customers'>, scope: LocationScope): Expression<SqlBool> =>
  scope === 'all' ? eb.lit(true) : eb('locationId', 'in', scope);

const sameScope = (a: LocationScope, b: LocationScope) => (a === 'all' ? b === 'all' : b !== 'all' && a.length === b.length && a.every((id, i) => id === b[i]));

/**
 * The FTS5 query for customers whose name contains `text`, or e-mail or phone where the person
 * reads them, in the scope's locations (see search.ts).
 */
function customerTextQuery(text: string, filter: CustomerFilter): string {
  const terms = [`name : ${phrase(text)}`];
  for (const [column, scope] of [['email', filter.emailScope], ['phone', filter.phoneScope]] as const) {
    // Where the person reads the field wherever they read customers, the scope below narrows it already.
    const narrowed = sameScope(scope, filter.scope) ? 'all' : scope;
    if (scope === 'all' || scope.length > 0) terms.push(`(${inPlaces(`${column} : ${phrase(text)}`, narrowed)})`);
  }
  return inPlaces(terms.join(' OR '), filter.scope);
}

/** Customers of the filter; a search matches the name, or e-mail and phone where the person reads them (the newest `reach` of them). */
function matchingCustomers(db: Db, filter: CustomerFilter, reach: number) {
  const { q, scope } = filter;
  let query = db.selectFrom('customers');
  if (scope !== 'all') query = query.where('locationId', 'in', scope);
  if (q && isIndexable(q)) {
    return query.where('id', 'in', sql<number>`(select rowid from customer_search where customer_search match ${customerTextQuery(q, filter)} order by rowid desc limit ${reach})`);
  }
  if (!q) return query;
  return query.where((eb) => {
    const terms: Expression<SqlBool>[] = [contains('name', q)];
    if (filter.emailScope === 'all' || filter.emailScope.length > 0) terms.push(eb.and([contains('email', q), inScope(eb, filter.emailScope)]));
    if (filter.phoneScope === 'all' || filter.phoneScope.length > 0) terms.push(eb.and([contains('phone', q), inScope(eb, filter.phoneScope)]));
    return eb.or(terms);
  });
}

/** Customers by name, a page at a time; a text search lists its newest SEARCH_CAP matches. */
export async function listCustomers(db: Db, filter: CustomerFilter): Promise<Page<CustomerView>> {
  const { page, pageSize, q, scope } = filter;
  if (scope !== 'all' && scope.length === 0) return { items: [], total: 0, totalCapped: false, page, pageSize };
  const [items, count] = await Promise.all([
    matchingCustomers(db, filter, SEARCH_CAP).select(CUSTOMER_COLUMNS).orderBy('name').orderBy('id').limit(pageSize).offset(offsetOf(page, pageSize)).execute(),
    cappedCount(db, matchingCustomers(db, filter, SEARCH_CAP + 1).select('id'), countCapFor(q)),
  ]);
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
