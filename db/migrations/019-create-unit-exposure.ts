import { sql, type Kysely } from 'kysely';

/**
 * Reliability counts kept current: `unit_exposure` holds, per catalog item, location and install
 * month, the units installed, the sum of their install days, and the failures among them with the
 * sums of their install and failure days. From those the time in service of every unit (from
 * install until failure, or until today) is exact for any day:
 * Σ(failed day − install day) over failures + Σ(today − install day) over the rest.
 * `unit_exposure_bands` holds the same for units on planned builds, per design-margin measure and
 * band; `unit_exposure_network` and `unit_exposure_bands_network` both summed over every location.
 *
 * A unit is a line of a delivered build, counted by its quantity, installed the later of the day
 * the build was delivered and the day the line was added (a replacement or a correction after
 * delivery starts its life on its own day). Days are UTC calendar days of those times (since 052,
 * the delivery's day at its shop). A failure is a warranty claim on the unit. `plan_margins` holds
 * the bands of a build's power plan (1 is the most margin, 4 past the limit; 0 no plan), filled by
 * the API whenever a build's plan changes.
 *
 * Triggers keep the tables current the way the search indexes are (migration 015): before a change,
 * take the rows concerned out as the source views show them; after it, put them back.
 * `unit_failures` keeps each claim with its unit's days.
 */
const DAY = (date: string) => `cast(julianday(${date}) - 2440587.5 as integer)`;

/** The installed units, each on the day `installedOn` gives (an expression over line `i` and build `b`). */
export const unitSource = (installedOn: string) => `select i.id as build_item_id, i.build_id, i.catalog_item_id, b.location_id, i.quantity,
    ${installedOn} as installed_on,
    coalesce(m.drop_band, 0) as drop_band, coalesce(m.load_band, 0) as load_band, coalesce(m.discharge_band, 0) as discharge_band
  from build_items i join builds b on b.id = i.build_id left join plan_margins m on m.build_id = b.id
  where b.status = 'delivered' and b.delivered_at is not null`;
/** The UTC date of the delivery, or of the line's adding if later (migration 052 takes the shop's day of the delivery). */
export const UTC_INSTALL_DAY = 'max(date(b.delivered_at), substr(i.created_at, 1, 10))';

const FAILURE_SOURCE = `select c.id as claim_id, u.build_item_id, u.build_id, u.catalog_item_id, u.location_id, u.installed_on,
    u.drop_band, u.load_band, u.discharge_band, c.failed_on, 1 - c.out_of_warranty as in_warranty, c.failure_mode, c.coverage
  from warranty_claims c join installed_unit_source u on u.build_item_id = c.build_item_id`;

const CELL_KEY = 'catalog_item_id, location_id, installed_month';
// Location second: a shop's or a region's margins of an item read their own rows; the network's come from their own sums.
const BAND_KEY = 'catalog_item_id, location_id, measure, band, installed_month';
const COUNTS = ['units', 'installed_day_sum', 'failures', 'failed_installed_day_sum', 'failed_day_sum', 'warranty_failures'];
const add = (key: string) => `on conflict (${key}) do update set ${COUNTS.map((c) => `${c} = ${c} + excluded.${c}`).join(', ')};`;

/** The counts a source row adds (sign 1) or takes out (sign −1): installed units, or failures. */
const counts = (sign: 1 | -1, kind: 'units' | 'failures') =>
  kind === 'units'
    ? `${sign} * sum(quantity), ${sign} * sum(quantity * ${DAY('installed_on')}), 0, 0, 0, 0`
    : `0, 0, ${sign} * count(*), ${sign} * sum(${DAY('installed_on')}), ${sign} * sum(${DAY('failed_on')}), ${sign} * sum(in_warranty)`;
const SOURCE = { units: 'installed_unit_source', failures: 'failed_unit_source' };

/** Into the cells: per item, location and install month. */
const toCells = (sign: 1 | -1, kind: 'units' | 'failures', where: string) => `insert into unit_exposure (${CELL_KEY}, ${COUNTS.join(', ')})
  select catalog_item_id, location_id, substr(installed_on, 1, 7), ${counts(sign, kind)}
  from ${SOURCE[kind]} where ${where} group by 1, 2, 3 ${add(CELL_KEY)}`;

/** Into the margin bands of planned builds: one row per measure (1 drop, 2 load, 3 discharge) and its band. */
const toBands = (sign: 1 | -1, kind: 'units' | 'failures', where: string) => `insert into unit_exposure_bands (${BAND_KEY}, ${COUNTS.join(', ')})
  select catalog_item_id, location_id, m.measure, case m.measure when 1 then drop_band when 2 then load_band else discharge_band end,
    substr(installed_on, 1, 7), ${counts(sign, kind)}
  from ${SOURCE[kind]} cross join (select 1 as measure union all select 2 union all select 3) as m
  where (${where}) and drop_band > 0 group by 1, 2, 3, 4, 5 ${add(BAND_KEY)}`;

/** Adds (sign 1) or takes out (sign −1) what the source rows `where` picks carry: units, failures, both, or only their bands. */
function change(sign: 1 | -1, where: string, what: 'units' | 'failures' | 'both' | 'bands'): string {
  const units = [toCells(sign, 'units', where), toBands(sign, 'units', where)];
  const failures = [toCells(sign, 'failures', where), toBands(sign, 'failures', where), sign === 1 ? addFailures(where) : `delete from unit_failures where ${where};`];
  if (what === 'bands') return [toBands(sign, 'units', where), toBands(sign, 'failures', where)].join('\n');
  return [...(what === 'failures' ? [] : units), ...(what === 'units' ? [] : failures)].join('\n');
}

/** Each failure with its unit's install day, for survival curves and claim shares without visiting builds. */
// Or replace: an update of a claim's day and its mode at once runs both kinds of its triggers, in no set order.
const addFailures = (where: string) => `insert or replace into unit_failures (claim_id, build_item_id, build_id, catalog_item_id, location_id, installed_day, failed_day, failure_mode, coverage)
  select claim_id, build_item_id, build_id, catalog_item_id, location_id, ${DAY('installed_on')}, ${DAY('failed_on')}, failure_mode, coverage
  from failed_unit_source where ${where};`;

/** Only lines of delivered builds count: the others' triggers skip their statements. */
const delivered = (buildId: string) => `exists (select 1 from builds b where b.id = ${buildId} and b.status = 'delivered')`;

/** [name, timing and event, sign, which source rows, what they carry] */
const TRIGGERS: [string, string, 1 | -1, string, 'units' | 'failures' | 'both' | 'bands'][] = [
  ['unit_exposure_item_insert', `after insert on build_items when ${delivered('new.build_id')}`, 1, 'build_item_id = new.id', 'units'],
  ['unit_exposure_item_before_update', `before update of quantity, catalog_item_id, build_id, created_at on build_items when ${delivered('old.build_id')}`, -1, 'build_item_id = old.id', 'both'],
  ['unit_exposure_item_after_update', `after update of quantity, catalog_item_id, build_id, created_at on build_items when ${delivered('new.build_id')}`, 1, 'build_item_id = new.id', 'both'],
  ['unit_exposure_item_delete', `before delete on build_items when ${delivered('old.build_id')}`, -1, 'build_item_id = old.id', 'both'],
  ['unit_exposure_build_before_update', "before update of status, delivered_at, location_id on builds when old.status = 'delivered'", -1, 'build_id = old.id', 'both'],
  ['unit_exposure_build_after_update', "after update of status, delivered_at, location_id on builds when new.status = 'delivered'", 1, 'build_id = new.id', 'both'],
  ['unit_exposure_margin_before_insert', 'before insert on plan_margins', -1, 'build_id = new.build_id', 'bands'],
  ['unit_exposure_margin_after_insert', 'after insert on plan_margins', 1, 'build_id = new.build_id', 'bands'],
  ['unit_exposure_margin_before_update', 'before update on plan_margins', -1, 'build_id = old.build_id', 'bands'],
  ['unit_exposure_margin_after_update', 'after update on plan_margins', 1, 'build_id = new.build_id', 'bands'],
  ['unit_exposure_margin_before_delete', 'before delete on plan_margins', -1, 'build_id = old.build_id', 'bands'],
  ['unit_exposure_margin_after_delete', 'after delete on plan_margins', 1, 'build_id = old.build_id', 'bands'],
  ['unit_exposure_claim_insert', 'after insert on warranty_claims', 1, 'claim_id = new.id', 'failures'],
  ['unit_exposure_claim_before_update', 'before update of build_item_id, failed_on, out_of_warranty on warranty_claims', -1, 'claim_id = old.id', 'failures'],
  ['unit_exposure_claim_after_update', 'after update of build_item_id, failed_on, out_of_warranty on warranty_claims', 1, 'claim_id = new.id', 'failures'],
  ['unit_exposure_claim_delete', 'before delete on warranty_claims', -1, 'claim_id = old.id', 'failures'],
];

/** A claim's mode and coverage change only its row of `unit_failures`. */
const FAILURE_TRIGGERS: [string, string, string][] = [
  ['unit_failures_claim_update', 'after update of failure_mode, coverage on warranty_claims', addFailures('claim_id = new.id')],
];

/**
 * The cells and the bands summed over every location (per item and install month, and per item,
 * measure, band and month: a few thousand rows), for the whole network's figures, kept by triggers
 * that add each change of a cell.
 */
const NETWORK_SUMS: [table: string, from: string, key: string][] = [
  ['unit_exposure_network', 'unit_exposure', 'catalog_item_id, installed_month'],
  ['unit_exposure_bands_network', 'unit_exposure_bands', 'catalog_item_id, measure, band, installed_month'],
];
const toNetwork = ([table, , key]: [string, string, string], values: string) => `insert into ${table} (${key}, ${COUNTS.join(', ')})
  values (${key.split(', ').map((c) => `new.${c}`).join(', ')}, ${values}) ${add(key)}`;
const NETWORK_TRIGGERS: [string, string, string, [string, string, string]][] = NETWORK_SUMS.flatMap((sums) => [
  [`${sums[0]}_insert`, `after insert on ${sums[1]}`, COUNTS.map((c) => `new.${c}`).join(', '), sums] as [string, string, string, [string, string, string]],
  [`${sums[0]}_update`, `after update on ${sums[1]}`, COUNTS.map((c) => `new.${c} - old.${c}`).join(', '), sums] as [string, string, string, [string, string, string]],
]);

/** Empties and refills the tables from their sources, after a bulk load that ran without triggers. */
export const REFILL_UNIT_EXPOSURE = ['unit_failures', 'unit_exposure_bands_network', 'unit_exposure_network', 'unit_exposure_bands', 'unit_exposure']
  .map((table) => `delete from ${table};`)
  .concat(change(1, 'true', 'both'))
  .join('\n');

const countColumns = COUNTS.map((c) => `${c} integer not null`).join(', ');

export async function up(db: Kysely<any>): Promise<void> {
  await sql`create table plan_margins (
    build_id integer primary key references builds (id) on delete cascade,
    drop_band integer not null check (drop_band between 1 and 4),
    load_band integer not null check (load_band between 1 and 4),
    discharge_band integer not null check (discharge_band between 1 and 4)
  )`.execute(db);
  await sql.raw(`create table unit_exposure (catalog_item_id integer not null, location_id integer not null, installed_month text not null,
    ${countColumns}, primary key (${CELL_KEY})) without rowid`).execute(db);
  // A lead's or a region's locations read their cells through this index alone.
  await sql.raw(`create index unit_exposure_location on unit_exposure (location_id, catalog_item_id, installed_month, ${COUNTS.join(', ')})`).execute(db);
  await sql.raw(`create table unit_exposure_bands (catalog_item_id integer not null, measure integer not null, band integer not null,
    location_id integer not null, installed_month text not null, ${countColumns}, primary key (${BAND_KEY})) without rowid`).execute(db);
  for (const [table, , key] of NETWORK_SUMS) {
    const keyColumns = key.split(', ').map((c) => `${c} ${c === 'installed_month' ? 'text' : 'integer'} not null`).join(', ');
    await sql.raw(`create table ${table} (${keyColumns}, ${countColumns}, primary key (${key})) without rowid`).execute(db);
  }
  await sql`create table unit_failures (
    claim_id integer primary key, build_item_id integer not null, build_id integer not null, catalog_item_id integer not null,
    location_id integer not null, installed_day integer not null, failed_day integer not null, failure_mode text not null, coverage text not null
  )`.execute(db);
  await sql`create index unit_failures_item on unit_failures (catalog_item_id, installed_day, location_id, failed_day, failure_mode, coverage)`.execute(db);
  await sql`create index unit_failures_build on unit_failures (build_id)`.execute(db);
  await sql`create index unit_failures_build_item on unit_failures (build_item_id)`.execute(db);
  for (const [name, when, values, sums] of NETWORK_TRIGGERS) await sql.raw(`create trigger ${name} ${when} begin ${toNetwork(sums, values)} end`).execute(db);
  await sql.raw(`create view installed_unit_source as ${unitSource(UTC_INSTALL_DAY)}`).execute(db);
  await sql.raw(`create view failed_unit_source as ${FAILURE_SOURCE}`).execute(db);
  for (const [name, when, sign, where, what] of TRIGGERS) await sql.raw(`create trigger ${name} ${when} begin ${change(sign, where, what)} end`).execute(db);
  for (const [name, when, body] of FAILURE_TRIGGERS) await sql.raw(`create trigger ${name} ${when} begin ${body} end`).execute(db);
  for (const statement of REFILL_UNIT_EXPOSURE.split(';').filter((s) => s.trim())) await sql.raw(statement).execute(db);
}

export async function down(db: Kysely<any>): Promise<void> {
  for (const [name] of [...TRIGGERS, ...NETWORK_TRIGGERS, ...FAILURE_TRIGGERS]) await sql.raw(`drop trigger ${name}`).execute(db);
  await sql`drop view failed_unit_source`.execute(db);
  await sql`drop view installed_unit_source`.execute(db);
  await sql`drop table unit_failures`.execute(db);
  for (const [table] of NETWORK_SUMS) await sql.raw(`drop table ${table}`).execute(db);
  await sql`drop table unit_exposure_bands`.execute(db);
  await sql`drop table unit_exposure`.execute(db);
  await sql`drop table plan_margins`.execute(db);
}
