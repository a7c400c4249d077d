import { sql, type Kysely } from 'kysely';
import { REFILL_UNIT_EXPOSURE as REFILL_036 } from './036-create-unit-exposure-regions.ts';

/**
 * The reliability cells summed per item and location over every install month (`unit_exposure_lifetime`),
 * so that the funnel of an item or a category reads one row per item and shop instead of every
 * month's cell of every shop (a category across 200 shops: 70,000 cells, now 1,400 rows). A trigger
 * adds each change of a cell. And an index of the claims by item, coverage, failure mode and shop, so
 * that the shares of failure modes and coverages are counted in its order instead of sorted.
 */
const COUNTS = ['units', 'installed_day_sum', 'failures', 'failed_installed_day_sum', 'failed_day_sum', 'warranty_failures'];
const KEY = 'catalog_item_id, location_id';

const toLifetime = (values: string) => `insert into unit_exposure_lifetime (${KEY}, ${COUNTS.join(', ')}) values (new.catalog_item_id, new.location_id, ${values})
  on conflict (${KEY}) do update set ${COUNTS.map((c) => `${c} = ${c} + excluded.${c}`).join(', ')};`;

const TRIGGERS: [name: string, when: string, body: string][] = [
  ['unit_exposure_lifetime_insert', 'after insert on unit_exposure', toLifetime(COUNTS.map((c) => `new.${c}`).join(', '))],
  ['unit_exposure_lifetime_update', 'after update on unit_exposure', toLifetime(COUNTS.map((c) => `new.${c} - old.${c}`).join(', '))],
];

/** Empties and refills every reliability table from its sources (after a bulk load that ran without triggers). */
export const REFILL_UNIT_EXPOSURE = `delete from unit_exposure_lifetime;\n${REFILL_036}`;

export async function up(db: Kysely<any>): Promise<void> {
  await sql.raw(`create table unit_exposure_lifetime (catalog_item_id integer not null, location_id integer not null,
    ${COUNTS.map((c) => `${c} integer not null`).join(', ')}, primary key (${KEY})) without rowid`).execute(db);
  for (const [name, when, body] of TRIGGERS) await sql.raw(`create trigger ${name} ${when} begin ${body} end`).execute(db);
  await sql.raw(`insert into unit_exposure_lifetime (${KEY}, ${COUNTS.join(', ')})
    select ${KEY}, ${COUNTS.map((c) => `sum(${c})`).join(', ')} from unit_exposure group by ${KEY}`).execute(db);
  await sql`create index unit_failures_kinds on unit_failures (catalog_item_id, coverage, failure_mode, location_id)`.execute(db);
}

export async function down(db: Kysely<any>): Promise<void> {
  await sql`drop index unit_failures_kinds`.execute(db);
  for (const [name] of TRIGGERS) await sql.raw(`drop trigger ${name}`).execute(db);
  await sql`drop table unit_exposure_lifetime`.execute(db);
}
