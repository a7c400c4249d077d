import { sql, type Kysely } from 'kysely';

/**
 * Text search over builds: number, customer name, vehicle and serial numbers, in an FTS5 index
 * with the trigram tokenizer (any 3+ characters of a word, in any case). The index keeps no copy
 * of the text: its content is the view `build_search_source`, so `insert into
 * build_search(build_search) values ('rebuild')` refills it from the tables after a bulk load.
 *
 * Triggers keep it current. FTS5 forgets a row only when told the text it indexed, so every
 * change first removes the row as the view still shows it (a BEFORE trigger) and then adds it as
 * the view shows it afterwards (an AFTER trigger). Only changes to searched columns fire them.
 */
const SOURCE = sql`create view build_search_source as
  select b.id, b.number, c.name as customer, v.year || ' ' || v.make || ' ' || v.model as vehicle,
    coalesce((select group_concat(i.serial_number, ' ') from build_items i where i.build_id = b.id and i.serial_number is not null), '') as serials
  from builds b join customers c on c.id = b.customer_id join vehicles v on v.id = b.vehicle_id`;

const COLUMNS = 'number, customer, vehicle, serials';
const forget = (where: string) =>
  `insert into build_search (build_search, rowid, ${COLUMNS}) select 'delete', id, ${COLUMNS} from build_search_source where ${where};`;
const remember = (where: string) => `insert into build_search (rowid, ${COLUMNS}) select id, ${COLUMNS} from build_search_source where ${where};`;

/** [name, timing and event, body]: each pair of BEFORE/AFTER triggers brackets one kind of change. */
const TRIGGERS: [string, string, string][] = [
  ['build_search_build_insert', 'after insert on builds', remember('id = new.id')],
  ['build_search_build_before_update', 'before update of number, customer_id, vehicle_id on builds', forget('id = old.id')],
  ['build_search_build_after_update', 'after update of number, customer_id, vehicle_id on builds', remember('id = new.id')],
  ['build_search_build_delete', 'before delete on builds', forget('id = old.id')],
  ['build_search_item_before_insert', 'before insert on build_items when new.serial_number is not null', forget('id = new.build_id')],
  ['build_search_item_after_insert', 'after insert on build_items when new.serial_number is not null', remember('id = new.build_id')],
  ['build_search_item_before_update', 'before update of serial_number, build_id on build_items', forget('id in (old.build_id, new.build_id)')],
  ['build_search_item_after_update', 'after update of serial_number, build_id on build_items', remember('id in (old.build_id, new.build_id)')],
  ['build_search_item_before_delete', 'before delete on build_items when old.serial_number is not null', forget('id = old.build_id')],
  ['build_search_item_after_delete', 'after delete on build_items when old.serial_number is not null', remember('id = old.build_id')],
  ['build_search_customer_before_update', 'before update of name on customers', forget('id in (select id from builds where customer_id = old.id)')],
  ['build_search_customer_after_update', 'after update of name on customers', remember('id in (select id from builds where customer_id = new.id)')],
  ['build_search_vehicle_before_update', 'before update of year, make, model on vehicles', forget('id in (select id from builds where vehicle_id = old.id)')],
  ['build_search_vehicle_after_update', 'after update of year, make, model on vehicles', remember('id in (select id from builds where vehicle_id = new.id)')],
];

export async function up(db: Kysely<any>): Promise<void> {
  await SOURCE.execute(db);
  await sql`create virtual table build_search using fts5(
    number, customer, vehicle, serials, content = 'build_search_source', content_rowid = 'id', tokenize = 'trigram'
  )`.execute(db);
  for (const [name, when, body] of TRIGGERS) await sql.raw(`create trigger ${name} ${when} begin ${body} end`).execute(db);
  await sql`insert into build_search (build_search) values ('rebuild')`.execute(db);
}

export async function down(db: Kysely<any>): Promise<void> {
  for (const [name] of TRIGGERS) await sql.raw(`drop trigger ${name}`).execute(db);
  await sql`drop table build_search`.execute(db);
  await sql`drop view build_search_source`.execute(db);
}
