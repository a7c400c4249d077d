import { sql, type Kysely } from 'kysely';
import { up as createBuildSearch } from './005-create-build-search.ts';
import { up as createCustomerSearch } from './009-create-customer-search.ts';

/**
 * The full-text indexes of builds and customers also index each row's location as a `place`
 * marker (`@<location id>@`), so a search in a lead's or a region's locations is one index lookup
 * that walks only their rows, newest first, instead of every match in the network. The `@`s keep
 * one location's marker from matching inside another's (`@12@` is not in `@123@`). Builds also
 * index their status as a `state` marker (`#booked#`), so a search for a common name among the
 * few booked builds walks only those.
 *
 * Both indexes keep no copy of the text: their content is a view. Triggers keep them current the
 * way 005 describes: remove a row as the view still shows it, then add it as it shows it after.
 */
export interface SearchIndex {
  table: string;
  view: string;
  columns: string;
  source: string;
  /** [name, timing and event, which rows of the view change] */
  triggers: [string, string, string][];
}

export const BUILDS: SearchIndex = {
  table: 'build_search',
  view: 'build_search_source',
  columns: 'number, customer, vehicle, serials, place, state',
  source: `select b.id, b.number, c.name as customer, v.year || ' ' || v.make || ' ' || v.model as vehicle,
    coalesce((select group_concat(i.serial_number, ' ') from build_items i where i.build_id = b.id and i.serial_number is not null), '') as serials,
    '@' || b.location_id || '@' as place, '#' || b.status || '#' as state
  from builds b join customers c on c.id = b.customer_id join vehicles v on v.id = b.vehicle_id`,
  triggers: [
    ['build_search_build_insert', 'after insert on builds', '+id = new.id'],
    ['build_search_build_before_update', 'before update of number, customer_id, vehicle_id, location_id, status on builds', '-id = old.id'],
    ['build_search_build_after_update', 'after update of number, customer_id, vehicle_id, location_id, status on builds', '+id = new.id'],
    ['build_search_build_delete', 'before delete on builds', '-id = old.id'],
    ['build_search_item_before_insert', 'before insert on build_items when new.serial_number is not null', '-id = new.build_id'],
    ['build_search_item_after_insert', 'after insert on build_items when new.serial_number is not null', '+id = new.build_id'],
    ['build_search_item_before_update', 'before update of serial_number, build_id on build_items', '-id in (old.build_id, new.build_id)'],
    ['build_search_item_after_update', 'after update of serial_number, build_id on build_items', '+id in (old.build_id, new.build_id)'],
    ['build_search_item_before_delete', 'before delete on build_items when old.serial_number is not null', '-id = old.build_id'],
    ['build_search_item_after_delete', 'after delete on build_items when old.serial_number is not null', '+id = old.build_id'],
    ['build_search_customer_before_update', 'before update of name on customers', '-id in (select id from builds where customer_id = old.id)'],
    ['build_search_customer_after_update', 'after update of name on customers', '+id in (select id from builds where customer_id = new.id)'],
    ['build_search_vehicle_before_update', 'before update of year, make, model on vehicles', '-id in (select id from builds where vehicle_id = old.id)'],
    ['build_search_vehicle_after_update', 'after update of year, make, model on vehicles', '+id in (select id from builds where vehicle_id = new.id)'],
  ],
};

export const CUSTOMERS: SearchIndex = {
  table: 'customer_search',
  view: 'customer_search_source',
  columns: 'name, email, phone, place',
  source: `select id, name, email, phone, '@' || location_id || '@' as place from customers`,
  triggers: [
    ['customer_search_insert', 'after insert on customers', '+id = new.id'],
    ['customer_search_before_update', 'before update of name, email, phone, location_id on customers', '-id = old.id'],
    ['customer_search_after_update', 'after update of name, email, phone, location_id on customers', '+id = new.id'],
    ['customer_search_delete', 'before delete on customers', '-id = old.id'],
  ],
};

/** The statement a trigger runs: `+where` adds the view's rows, `-where` removes them from the index. */
function triggerBody({ table, view, columns }: SearchIndex, change: string): string {
  const where = change.slice(1);
  if (change.startsWith('+')) return `insert into ${table} (rowid, ${columns}) select id, ${columns} from ${view} where ${where};`;
  return `insert into ${table} (${table}, rowid, ${columns}) select 'delete', id, ${columns} from ${view} where ${where};`;
}

export async function create(db: Kysely<any>, index: SearchIndex): Promise<void> {
  await sql.raw(`create view ${index.view} as ${index.source}`).execute(db);
  await sql
    .raw(`create virtual table ${index.table} using fts5(${index.columns}, content = '${index.view}', content_rowid = 'id', tokenize = 'trigram')`)
    .execute(db);
  for (const [name, when, change] of index.triggers) await sql.raw(`create trigger ${name} ${when} begin ${triggerBody(index, change)} end`).execute(db);
  await sql.raw(`insert into ${index.table} (${index.table}) values ('rebuild')`).execute(db);
}

/** Drops an index with its triggers (whatever their names) and its view, if it has one. */
export async function drop(db: Kysely<any>, table: string, view?: string): Promise<void> {
  const triggers = await sql<{ name: string }>`select name from sqlite_master where type = 'trigger' and name like ${`${table}_%`}`.execute(db);
  for (const { name } of triggers.rows) await sql.raw(`drop trigger ${name}`).execute(db);
  await sql.raw(`drop table ${table}`).execute(db);
  if (view) await sql.raw(`drop view ${view}`).execute(db);
}

export async function up(db: Kysely<any>): Promise<void> {
  await drop(db, BUILDS.table, BUILDS.view);
  await drop(db, CUSTOMERS.table);
  await create(db, BUILDS);
  await create(db, CUSTOMERS);
}

export async function down(db: Kysely<any>): Promise<void> {
  await drop(db, BUILDS.table, BUILDS.view);
  await drop(db, CUSTOMERS.table, CUSTOMERS.view);
  await createBuildSearch(db);
  await createCustomerSearch(db);
}
