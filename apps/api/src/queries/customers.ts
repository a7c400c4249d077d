import type { Database, Db } from '@busbar/db';
import type { Expression, ExpressionBuilder, SqlBool } from 'kysely';
import type { CustomerBody, CustomerView, Page } from '@busbar/shared';
import type { LocationScope } from '../access/locations.ts';
import { cappedCount, offsetOf } from './paging.ts';
import { countCapFor, customerTextMatches } from './search.ts';

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

/** Customers by name; a search matches the name, or e-mail and phone where the person reads them. */
export async function listCustomers(db: Db, filter: CustomerFilter): Promise<Page<CustomerView>> {
  const { page, pageSize, q, scope } = filter;
  if (scope !== 'all' && scope.length === 0) return { items: [], total: 0, totalCapped: false, page, pageSize };
  let query = db.selectFrom('customers');
  if (scope !== 'all') query = query.where('locationId', 'in', scope);
  if (q) {
    query = query.where((eb) => {
      const terms: Expression<SqlBool>[] = [customerTextMatches('id', 'name', q)];
      if (filter.emailScope === 'all' || filter.emailScope.length > 0) terms.push(eb.and([customerTextMatches('id', 'email', q), inScope(eb, filter.emailScope)]));
      if (filter.phoneScope === 'all' || filter.phoneScope.length > 0) terms.push(eb.and([customerTextMatches('id', 'phone', q), inScope(eb, filter.phoneScope)]));
      return eb.or(terms);
    });
  }
  const [items, count] = await Promise.all([
    query.select(CUSTOMER_COLUMNS).orderBy('name').orderBy('id').limit(pageSize).offset(offsetOf(page, pageSize)).execute(),
    cappedCount(db, query.select('id'), countCapFor(q)),
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
