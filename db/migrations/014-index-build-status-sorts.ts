import { sql, type Kysely } from 'kysely';

/**
 * A status filter with a sort other than the last change: without these, SQLite found a status's
 * rows by `builds_status_updated` and sorted all of them (2.7 s for the delivered builds of 200
 * shops by total); with them it reads the first page straight from the index.
 */
const INDEXES: [name: string, columns: string][] = [
  ['builds_status_total', 'status, total_cents'],
  ['builds_status_booked', 'status, booked_for'],
  ['builds_status_number', 'status, number'],
];

export async function up(db: Kysely<any>): Promise<void> {
  for (const [name, columns] of INDEXES) await sql`create index ${sql.id(name)} on builds (${sql.raw(columns)})`.execute(db);
}

export async function down(db: Kysely<any>): Promise<void> {
  for (const [name] of INDEXES) await sql`drop index ${sql.id(name)}`.execute(db);
}
