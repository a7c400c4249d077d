import { sql, type Kysely } from 'kysely';

/**
 * The roll-ups summed per region and over the whole network (migration 021 keeps them per
 * location): the network's trend of a year read 25 periods of every shop (5,000 rows on 200 shops,
 * 8 ms) where it now reads 25 rows. Triggers add each change of a location's row to its region and
 * to the network, and a location moved to another region takes its rows along.
 *
 * The columns are rollup_figures' own as this migration runs: a later migration that adds a
 * category's column there adds it here too and makes these triggers again.
 */
const KEY = 'grain, period';
const SUMS = [
  { table: 'rollup_network', key: KEY, region: false },
  { table: 'rollup_region', key: `${KEY}, region_id`, region: true },
];
const regionOf = (location: string) => `(select region_id from locations where id = ${location})`;

async function figureColumns(db: Kysely<any>): Promise<string[]> {
  const { rows } = await sql<{ name: string }>`select name from pragma_table_info('rollup_figures')`.execute(db);
  return rows.map((r) => r.name).filter((name) => !['grain', 'period', 'location_id'].includes(name));
}

function triggers(figures: string[]): [name: string, when: string, body: string][] {
  const add = (key: string) => `on conflict (${key}) do update set ${figures.map((f) => `${f} = ${f} + excluded.${f}`).join(', ')};`;
  const toSums = ({ table, key, region }: (typeof SUMS)[number], row: 'new' | 'old', values: string) =>
    `insert into ${table} (${key}, ${figures.join(', ')}) values (${row}.grain, ${row}.period, ${region ? `${regionOf(`${row}.location_id`)}, ` : ''}${values}) ${add(key)}`;
  const moved = (region: string, sign: 1 | -1) => `insert into rollup_region (${KEY}, region_id, ${figures.join(', ')})
    select grain, period, ${region}, ${figures.map((f) => `${sign} * ${f}`).join(', ')} from rollup_figures where location_id = new.id ${add(`${KEY}, region_id`)}`;
  return [
    ...SUMS.flatMap((sums): [string, string, string][] => [
      [`${sums.table}_insert`, 'after insert on rollup_figures', toSums(sums, 'new', figures.map((f) => `new.${f}`).join(', '))],
      [`${sums.table}_update`, 'after update on rollup_figures', toSums(sums, 'new', figures.map((f) => `new.${f} - old.${f}`).join(', '))],
      [`${sums.table}_delete`, 'after delete on rollup_figures', toSums(sums, 'old', figures.map((f) => `-old.${f}`).join(', '))],
    ]),
    ['rollup_region_location_move', 'after update of region_id on locations when old.region_id is not new.region_id', `${moved('old.region_id', -1)}\n${moved('new.region_id', 1)}`],
  ];
}

export async function up(db: Kysely<any>): Promise<void> {
  const figures = await figureColumns(db);
  const columns = figures.map((f) => `${f} integer not null`).join(', ');
  await sql.raw(`create table rollup_network (grain text not null, period text not null, ${columns}, primary key (${KEY})) without rowid`).execute(db);
  await sql.raw(`create table rollup_region (grain text not null, period text not null, region_id integer not null, ${columns}, primary key (${KEY}, region_id)) without rowid`).execute(db);
  for (const [name, when, body] of triggers(figures)) await sql.raw(`create trigger ${name} ${when} begin ${body} end`).execute(db);
  const sums = figures.map((f) => `sum(f.${f})`).join(', ');
  await sql.raw(`insert into rollup_network (${KEY}, ${figures.join(', ')}) select f.grain, f.period, ${sums} from rollup_figures f group by f.grain, f.period`).execute(db);
  await sql
    .raw(`insert into rollup_region (${KEY}, region_id, ${figures.join(', ')}) select f.grain, f.period, l.region_id, ${sums}
      from rollup_figures f join locations l on l.id = f.location_id group by f.grain, f.period, l.region_id`)
    .execute(db);
}

export async function down(db: Kysely<any>): Promise<void> {
  for (const [name] of triggers(await figureColumns(db))) await sql.raw(`drop trigger ${name}`).execute(db);
  await sql`drop table rollup_region`.execute(db);
  await sql`drop table rollup_network`.execute(db);
}
