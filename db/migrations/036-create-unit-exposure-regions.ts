import { sql, type Kysely } from 'kysely';
import { REFILL_UNIT_EXPOSURE as REFILL_019 } from './019-create-unit-exposure.ts';

/**
 * The reliability cells and margin bands summed per region (migration 019 keeps them per location
 * and for the whole network): a regional manager's figures read a few thousand rows instead of
 * every cell of every shop in the region. Triggers add each change of a cell to its location's
 * region, and a location moved to another region takes its cells along.
 */
const COUNTS = ['units', 'installed_day_sum', 'failures', 'failed_installed_day_sum', 'failed_day_sum', 'warranty_failures'];
const add = (key: string) => `on conflict (${key}) do update set ${COUNTS.map((c) => `${c} = ${c} + excluded.${c}`).join(', ')}`;

interface RegionSums {
  table: string;
  /** The per-location table it sums. */
  from: string;
  /** Its key, with `region_id` where the per-location table has `location_id`. */
  key: string;
}
const SUMS: RegionSums[] = [
  { table: 'unit_exposure_region', from: 'unit_exposure', key: 'catalog_item_id, region_id, installed_month' },
  { table: 'unit_exposure_bands_region', from: 'unit_exposure_bands', key: 'catalog_item_id, region_id, measure, band, installed_month' },
];

const regionOf = (location: string) => `(select region_id from locations where id = ${location})`;
const otherKeys = ({ key }: RegionSums) => key.split(', ').filter((c) => c !== 'region_id');

/** Adds one changed cell (`values` its counts) to its location's region. */
const cellToRegion = (sums: RegionSums, values: string) => `insert into ${sums.table} (${sums.key}, ${COUNTS.join(', ')})
  values (${sums.key.split(', ').map((c) => (c === 'region_id' ? regionOf('new.location_id') : `new.${c}`)).join(', ')}, ${values}) ${add(sums.key)};`;

/** Every cell of a location added to a region with `sign` (its old region −1, its new one +1). */
const locationToRegion = (sums: RegionSums, region: string, sign: 1 | -1) => `insert into ${sums.table} (${sums.key}, ${COUNTS.join(', ')})
  select ${sums.key.split(', ').map((c) => (c === 'region_id' ? region : c)).join(', ')}, ${COUNTS.map((c) => `${sign} * ${c}`).join(', ')}
  from ${sums.from} where location_id = new.id ${add(sums.key)};`;

const TRIGGERS: [name: string, when: string, body: string][] = [
  ...SUMS.flatMap((sums): [string, string, string][] => [
    [`${sums.table}_insert`, `after insert on ${sums.from}`, cellToRegion(sums, COUNTS.map((c) => `new.${c}`).join(', '))],
    [`${sums.table}_update`, `after update on ${sums.from}`, cellToRegion(sums, COUNTS.map((c) => `new.${c} - old.${c}`).join(', '))],
  ]),
  [
    'unit_exposure_region_location_move',
    'after update of region_id on locations when old.region_id is not new.region_id',
    SUMS.map((sums) => locationToRegion(sums, 'old.region_id', -1) + '\n' + locationToRegion(sums, 'new.region_id', 1)).join('\n'),
  ],
];

/** The region sums from the per-location tables as they stand. */
const FILL = SUMS.map(
  (sums) => `insert into ${sums.table} (${sums.key}, ${COUNTS.join(', ')})
  select ${sums.key.split(', ').map((c) => (c === 'region_id' ? 'l.region_id' : `x.${c}`)).join(', ')}, ${COUNTS.map((c) => `sum(x.${c})`).join(', ')}
  from ${sums.from} x join locations l on l.id = x.location_id group by ${['l.region_id', ...otherKeys(sums).map((c) => `x.${c}`)].join(', ')};`,
).join('\n');

/** Empties and refills every reliability table from its sources (after a bulk load that ran without triggers). */
export const REFILL_UNIT_EXPOSURE = SUMS.map((sums) => `delete from ${sums.table};`).join('\n') + '\n' + REFILL_019;

const countColumns = COUNTS.map((c) => `${c} integer not null`).join(', ');

export async function up(db: Kysely<any>): Promise<void> {
  for (const { table, key } of SUMS) {
    const keyColumns = key.split(', ').map((c) => `${c} ${c === 'installed_month' ? 'text' : 'integer'} not null`).join(', ');
    // Region second, as the cells have location second: each item's rows of a region are one seek.
    await sql.raw(`create table ${table} (${keyColumns}, ${countColumns}, primary key (${key})) without rowid`).execute(db);
  }
  for (const [name, when, body] of TRIGGERS) await sql.raw(`create trigger ${name} ${when} begin ${body} end`).execute(db);
  for (const statement of FILL.split(';').filter((s) => s.trim())) await sql.raw(statement).execute(db);
}

export async function down(db: Kysely<any>): Promise<void> {
  for (const [name] of TRIGGERS) await sql.raw(`drop trigger ${name}`).execute(db);
  for (const { table } of SUMS) await sql.raw(`drop table ${table}`).execute(db);
}
