import { sql, type Kysely } from 'kysely';
import { FIGURES, REFILL_ROLLUPS as REFILL_021 } from './021-create-rollups.ts';

/**
 * The roll-ups summed per region and over the whole network (migration 021 keeps them per
 * location): the network's trend of a year read 25 periods of every shop (5,000 rows on 200 shops,
 * 8 ms) where it now reads 25 rows. Triggers add each change of a location's row to its region and
 * to the network, and a location moved to another region takes its rows along.
 *
 * A later migration that adds a category's column to `rollup_figures` adds it here too and makes
 * these triggers again.
 */
const KEY = 'grain, period';
const SUMS = [
  { table: 'rollup_network', key: KEY, region: false },
  { table: 'rollup_region', key: `${KEY}, region_id`, region: true },
];
const regionOf = (location: string) => `(select region_id from locations where id = ${location})`;
const add = (key: string) => `on conflict (${key}) do update set ${FIGURES.map((f) => `${f} = ${f} + excluded.${f}`).join(', ')};`;

const toSums = ({ table, key, region }: (typeof SUMS)[number], row: 'new' | 'old', values: string) =>
  `insert into ${table} (${key}, ${FIGURES.join(', ')}) values (${row}.grain, ${row}.period, ${region ? `${regionOf(`${row}.location_id`)}, ` : ''}${values}) ${add(key)}`;
const moved = (region: string, sign: 1 | -1) => `insert into rollup_region (${KEY}, region_id, ${FIGURES.join(', ')})
  select grain, period, ${region}, ${FIGURES.map((f) => `${sign} * ${f}`).join(', ')} from rollup_figures where location_id = new.id ${add(`${KEY}, region_id`)}`;

const TRIGGERS: [name: string, when: string, body: string][] = [
  ...SUMS.flatMap((sums): [string, string, string][] => [
    [`${sums.table}_insert`, 'after insert on rollup_figures', toSums(sums, 'new', FIGURES.map((f) => `new.${f}`).join(', '))],
    [`${sums.table}_update`, 'after update on rollup_figures', toSums(sums, 'new', FIGURES.map((f) => `new.${f} - old.${f}`).join(', '))],
    [`${sums.table}_delete`, 'after delete on rollup_figures', toSums(sums, 'old', FIGURES.map((f) => `-old.${f}`).join(', '))],
  ]),
  ['rollup_region_location_move', 'after update of region_id on locations when old.region_id is not new.region_id', `${moved('old.region_id', -1)}\n${moved('new.region_id', 1)}`],
];

const summed = FIGURES.map((f) => `sum(f.${f})`).join(', ');
/** Both tables emptied and summed again from `rollup_figures` as it stands. */
const FILL = `delete from rollup_network;
delete from rollup_region;
insert into rollup_network (${KEY}, ${FIGURES.join(', ')}) select f.grain, f.period, ${summed} from rollup_figures f group by f.grain, f.period;
insert into rollup_region (${KEY}, region_id, ${FIGURES.join(', ')}) select f.grain, f.period, l.region_id, ${summed}
  from rollup_figures f join locations l on l.id = f.location_id group by f.grain, f.period, l.region_id;`;

/** Empties and refills every roll-up table from builds, their lines and claims (after a bulk load that ran without triggers). */
export const REFILL_ROLLUPS = `${REFILL_021}\n${FILL}`;

export async function up(db: Kysely<any>): Promise<void> {
  const columns = FIGURES.map((f) => `${f} integer not null`).join(', ');
  await sql.raw(`create table rollup_network (grain text not null, period text not null, ${columns}, primary key (${KEY})) without rowid`).execute(db);
  await sql.raw(`create table rollup_region (grain text not null, period text not null, region_id integer not null, ${columns}, primary key (${KEY}, region_id)) without rowid`).execute(db);
  for (const [name, when, body] of TRIGGERS) await sql.raw(`create trigger ${name} ${when} begin ${body} end`).execute(db);
  for (const statement of FILL.split(';').filter((s) => s.trim())) await sql.raw(statement).execute(db);
}

export async function down(db: Kysely<any>): Promise<void> {
  for (const [name] of TRIGGERS) await sql.raw(`drop trigger ${name}`).execute(db);
  await sql`drop table rollup_region`.execute(db);
  await sql`drop table rollup_network`.execute(db);
}
