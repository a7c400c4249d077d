import { sql, type Kysely } from 'kysely';
import { REFILL_UNIT_EXPOSURE as REFILL_043 } from './043-create-unit-failure-sums.ts';

/**
 * Claims under a shop's own workmanship warranty counted per item and location: the funnel of a
 * category over every install month read each item's workmanship failures and grouped them by shop
 * (2 ms for house batteries on 200 shops), where it now reads a row per item and shop. Triggers on
 * `unit_failures` keep it as migration 043's keep theirs (a replaced row taken out before the insert).
 */
const IS_WORKMANSHIP = (row: string) => `${row}.coverage = 'workmanship'`;
const add = (row: string, sign: 1 | -1) => `insert into unit_failure_workmanship (catalog_item_id, location_id, failures)
  select ${row}.catalog_item_id, ${row}.location_id, ${sign}`;
const ON_CONFLICT = 'on conflict (catalog_item_id, location_id) do update set failures = failures + excluded.failures;';
const dropZero = (row: string) => `delete from unit_failure_workmanship where failures = 0 and catalog_item_id = ${row}.catalog_item_id and location_id = ${row}.location_id;`;
const OLD_ROW = `from unit_failures u where u.claim_id = new.claim_id and ${IS_WORKMANSHIP('u')}`;

const TRIGGERS: [name: string, when: string, body: string][] = [
  ['unit_failure_workmanship_replace', 'before insert on unit_failures', `${add('u', -1)} ${OLD_ROW} ${ON_CONFLICT}
    delete from unit_failure_workmanship where failures = 0 and (catalog_item_id, location_id) in (select u.catalog_item_id, u.location_id ${OLD_ROW});`],
  ['unit_failure_workmanship_insert', `after insert on unit_failures when ${IS_WORKMANSHIP('new')}`, `${add('new', 1)} where true ${ON_CONFLICT}`],
  ['unit_failure_workmanship_delete', `after delete on unit_failures when ${IS_WORKMANSHIP('old')}`, `${add('old', -1)} where true ${ON_CONFLICT}\n${dropZero('old')}`],
];

/** The table emptied and counted again from `unit_failures` as it stands. */
const FILL = `delete from unit_failure_workmanship;
insert into unit_failure_workmanship (catalog_item_id, location_id, failures)
  select catalog_item_id, location_id, count(*) from unit_failures u where ${IS_WORKMANSHIP('u')} group by catalog_item_id, location_id;`;

/** Empties and refills every reliability table from its sources (after a bulk load that ran without triggers). */
export const REFILL_UNIT_EXPOSURE = `${REFILL_043}\n${FILL}`;

export async function up(db: Kysely<any>): Promise<void> {
  await sql`create table unit_failure_workmanship (catalog_item_id integer not null, location_id integer not null, failures integer not null,
    primary key (catalog_item_id, location_id)) without rowid`.execute(db);
  for (const [name, when, body] of TRIGGERS) await sql.raw(`create trigger ${name} ${when} begin ${body} end`).execute(db);
  for (const statement of FILL.split(';').filter((s) => s.trim())) await sql.raw(statement).execute(db);
}

export async function down(db: Kysely<any>): Promise<void> {
  for (const [name] of TRIGGERS) await sql.raw(`drop trigger ${name}`).execute(db);
  await sql`drop table unit_failure_workmanship`.execute(db);
}
