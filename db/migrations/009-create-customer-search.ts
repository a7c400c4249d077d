import { sql, type Kysely } from 'kysely';

/**
 * Customer search: name, e-mail and phone in an FTS5 trigram index whose content is the
 * customers table itself (a bulk load refills it with 'rebuild'); triggers keep it current.
 */
const COLUMNS = 'name, email, phone';
const TRIGGERS: [string, string, string][] = [
  ['customer_search_insert', 'after insert on customers', `insert into customer_search (rowid, ${COLUMNS}) values (new.id, new.name, new.email, new.phone);`],
  [
    'customer_search_delete',
    'after delete on customers',
    `insert into customer_search (customer_search, rowid, ${COLUMNS}) values ('delete', old.id, old.name, old.email, old.phone);`,
  ],
  [
    'customer_search_update',
    'after update of name, email, phone on customers',
    `insert into customer_search (customer_search, rowid, ${COLUMNS}) values ('delete', old.id, old.name, old.email, old.phone);
     insert into customer_search (rowid, ${COLUMNS}) values (new.id, new.name, new.email, new.phone);`,
  ],
];

export async function up(db: Kysely<any>): Promise<void> {
  await sql`create virtual table customer_search using fts5(name, email, phone, content = 'customers', content_rowid = 'id', tokenize = 'trigram')`.execute(db);
  for (const [name, when, body] of TRIGGERS) await sql.raw(`create trigger ${name} ${when} begin ${body} end`).execute(db);
  await sql`insert into customer_search (customer_search) values ('rebuild')`.execute(db);
}

export async function down(db: Kysely<any>): Promise<void> {
  for (const [name] of TRIGGERS) await sql.raw(`drop trigger ${name}`).execute(db);
  await sql`drop table customer_search`.execute(db);
}
