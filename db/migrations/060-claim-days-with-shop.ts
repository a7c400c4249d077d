import { sql, type Kysely } from 'kysely';

/**
 * Each shop's index of its claims' failure days and of their logging days (migrations 016 and 059)
 * also holds the queue's order, so a region's claims of a span of days are found and sorted from
 * those indexes alone: on 200 shops a regional manager's month of failures read the network's
 * month in the span's index and each claim's row for its shop (2,600 rows, 1.4 ms); now it seeks
 * the region's shops and sorts their 1,100 entries (0.25 ms).
 */
const INDEXES: [name: string, up: string, down: string][] = [
  ['warranty_claims_location_failed', '(location_id, failed_on, (due_on is null), due_on)', '(location_id, failed_on)'],
  [
    'warranty_claims_logged_sums',
    '(location_id, logged_on, status, credit_requested_cents, credit_received_cents, (due_on is null), due_on)',
    '(location_id, logged_on, status, credit_requested_cents, credit_received_cents)',
  ],
];

async function replaceWith(db: Kysely<any>, which: 1 | 2): Promise<void> {
  for (const index of INDEXES) {
    await sql`drop index ${sql.id(index[0])}`.execute(db);
    await sql`create index ${sql.id(index[0])} on warranty_claims ${sql.raw(index[which])}`.execute(db);
  }
}

export const up = (db: Kysely<any>) => replaceWith(db, 1);
export const down = (db: Kysely<any>) => replaceWith(db, 2);
