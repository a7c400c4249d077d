import { isoDay, localDay } from '@busbar/calc';
import { sql, type Kysely } from 'kysely';

/**
 * Roll-ups kept current: `rollup_figures` holds, per grain (day, week, month, quarter, year),
 * period and location, the sums the roll-up figures are made of, and the job mix: delivered builds
 * with a component of each category (one column a category, so a period of a location is one
 * row). Periods are cut in each location's own zone: the app stores the local day a build was
 * delivered (`builds.delivered_on`) and a claim was logged (`warranty_claims.logged_on`), since
 * SQLite knows no time zones; a row written without one (straight into the database) counts on its
 * UTC day. `booked_for` is already a local day.
 *
 * Period keys sort as text within a grain: day YYYY-MM-DD, week the YYYY-MM-DD of its Monday (ISO
 * weeks), month YYYY-MM, quarter YYYY-Qn, year YYYY.
 *
 * Triggers keep the table current the way migration 019 does: before a change, take the rows
 * concerned out as the source views show them; after it, put them back. The triggers and the
 * period arithmetic in them are SQLite's; the table and the queries reading it are plain SQL.
 */

/** The catalog's categories when this migration was written; a new category needs a migration adding its column. */
export const MIX_CATEGORIES = [
  'house_battery', 'starter_battery', 'dc_dc_charger', 'solar_panel', 'solar_controller', 'inverter', 'fuse_block',
  'switch_panel', 'battery_monitor', 'air_compressor', 'cable_terminals', 'tray_mount', 'other',
];
const MIX = MIX_CATEGORIES.map((c) => `mix_${c}`);
/** The summed columns of `rollup_figures`. */
export const FIGURES = ['builds_delivered', 'builds_booked', 'revenue_cents', 'parts_cost_cents', 'labor_centihours', 'claims_opened', 'warranty_cost_cents', 'credits_received_cents', ...MIX];
/** Every summed column, `values` given and the rest 0. */
const columns = (values: Record<string, string>) => FIGURES.map((f) => `${values[f] ?? '0'} as ${f}`).join(', ');

const BOOKED = `('booked', 'in_bay', 'quality_check', 'delivered')`;
const DELIVERED_DAY = `coalesce(b.delivered_on, substr(b.delivered_at, 1, 10))`;

/** Each build once on its delivery day (if delivered) and once on its booked day (if booked and not cancelled). */
const BUILD_SOURCE = `select b.id as build_id, b.location_id, ${DELIVERED_DAY} as day,
    ${columns({ builds_delivered: '1', revenue_cents: 'b.total_cents', parts_cost_cents: 'b.parts_cost_cents', labor_centihours: 'cast(round(b.labor_hours * 100) as integer)' })}
  from builds b where b.status = 'delivered' and b.delivered_at is not null
  union all
  select b.id, b.location_id, b.booked_for, ${columns({ builds_booked: '1' })}
  from builds b where b.status in ${BOOKED} and b.booked_for is not null`;

/**
 * Each delivered build's first line of each category (by line id), with 1 in that category's column:
 * a build counts once in each category it has a component of. Line by line, so a trigger's
 * condition on the build reaches the view's tables through their keys.
 */
const JOB_MIX_SOURCE = `select b.id as build_id, b.location_id, ${DELIVERED_DAY} as day,
    ${columns(Object.fromEntries(MIX_CATEGORIES.map((c) => [`mix_${c}`, `(ci.category = '${c}')`])))}
  from builds b join build_items i on i.build_id = b.id join catalog_items ci on ci.id = i.catalog_item_id
  where b.status = 'delivered' and b.delivered_at is not null
    and not exists (select 1 from build_items e join catalog_items ec on ec.id = e.catalog_item_id
      where e.build_id = i.build_id and e.id < i.id and ec.category = ci.category)`;

/**
 * Each claim on its logging day. Its warranty cost is its labor at its build's rate plus the credit
 * asked of the vendor and not (yet) received.
 */
const CLAIM_SOURCE = `select c.id as claim_id, c.build_id, c.location_id, coalesce(c.logged_on, substr(c.created_at, 1, 10)) as day,
    ${columns({
      claims_opened: '1',
      warranty_cost_cents: 'cast(round(c.labor_hours * b.labor_rate_cents) as integer) + max(c.credit_requested_cents - coalesce(c.credit_received_cents, 0), 0)',
      credits_received_cents: 'coalesce(c.credit_received_cents, 0)',
    })}
  from warranty_claims c join builds b on b.id = c.build_id`;

const GRAINS = `(select 'day' as grain union all select 'week' union all select 'month' union all select 'quarter' union all select 'year') g`;
const DAYS = `(select 'day' as grain) g`;
const LONGER = `(select 'week' as grain union all select 'month' union all select 'quarter' union all select 'year') g`;
const PERIOD = `case g.grain when 'day' then s.day
  when 'week' then date(s.day, '-' || ((cast(strftime('%w', s.day) as integer) + 6) % 7) || ' days')
  when 'month' then substr(s.day, 1, 7)
  when 'quarter' then substr(s.day, 1, 4) || '-Q' || ((cast(substr(s.day, 6, 2) as integer) + 2) / 3)
  else substr(s.day, 1, 4) end`;
const KEY = 'grain, period, location_id';

/** Adds (sign 1) or takes out (sign −1) the `source` rows `where` picks, in every grain of `grains`. */
const change = (sign: 1 | -1, source: string, where: string, grains = GRAINS) => `insert into rollup_figures (${KEY}, ${FIGURES.join(', ')})
  select g.grain, ${PERIOD}, s.location_id, ${FIGURES.map((f) => `${sign} * sum(s.${f})`).join(', ')}
  from ${source} s, ${grains} where ${where} group by 1, 2, 3
  on conflict (${KEY}) do update set ${FIGURES.map((f) => `${f} = ${f} + excluded.${f}`).join(', ')};`;

const ofBuild = (sign: 1 | -1, where: string) => `${change(sign, 'rollup_build_source', where)}\n${change(sign, 'rollup_job_mix_source', where)}`;
const mix = (sign: 1 | -1, where: string) => change(sign, 'rollup_job_mix_source', where);
const claim = (sign: 1 | -1, where: string) => change(sign, 'rollup_claim_source', where);
const ofItemsOf = (item: string) => `s.build_id in (select build_id from build_items where catalog_item_id = ${item}.id)`;

const BUILD_COLUMNS = 'status, delivered_at, delivered_on, booked_for, location_id, total_cents, parts_cost_cents, labor_hours';
const CLAIM_COLUMNS = 'build_id, location_id, logged_on, created_at, labor_hours, credit_requested_cents, credit_received_cents';

/** [name, timing and event, body] */
const TRIGGERS: [string, string, string][] = [
  ['rollup_build_insert', 'after insert on builds', ofBuild(1, 's.build_id = new.id')],
  ['rollup_build_before_update', `before update of ${BUILD_COLUMNS} on builds`, ofBuild(-1, 's.build_id = old.id')],
  ['rollup_build_after_update', `after update of ${BUILD_COLUMNS} on builds`, ofBuild(1, 's.build_id = new.id')],
  ['rollup_build_delete', 'before delete on builds', ofBuild(-1, 's.build_id = old.id')],
  ['rollup_rate_before_update', 'before update of labor_rate_cents on builds', claim(-1, 's.build_id = old.id')],
  ['rollup_rate_after_update', 'after update of labor_rate_cents on builds', claim(1, 's.build_id = new.id')],
  ['rollup_item_before_insert', 'before insert on build_items', mix(-1, 's.build_id = new.build_id')],
  ['rollup_item_after_insert', 'after insert on build_items', mix(1, 's.build_id = new.build_id')],
  ['rollup_item_before_update', 'before update of build_id, catalog_item_id on build_items', mix(-1, 's.build_id in (old.build_id, new.build_id)')],
  ['rollup_item_after_update', 'after update of build_id, catalog_item_id on build_items', mix(1, 's.build_id in (old.build_id, new.build_id)')],
  ['rollup_item_before_delete', 'before delete on build_items', mix(-1, 's.build_id = old.build_id')],
  ['rollup_item_after_delete', 'after delete on build_items', mix(1, 's.build_id = old.build_id')],
  ['rollup_category_before_update', 'before update of category on catalog_items', mix(-1, ofItemsOf('old'))],
  ['rollup_category_after_update', 'after update of category on catalog_items', mix(1, ofItemsOf('new'))],
  ['rollup_claim_insert', 'after insert on warranty_claims', claim(1, 's.claim_id = new.id')],
  ['rollup_claim_before_update', `before update of ${CLAIM_COLUMNS} on warranty_claims`, claim(-1, 's.claim_id = old.id')],
  ['rollup_claim_after_update', `after update of ${CLAIM_COLUMNS} on warranty_claims`, claim(1, 's.claim_id = new.id')],
  ['rollup_claim_delete', 'before delete on warranty_claims', claim(-1, 's.claim_id = old.id')],
];

/**
 * Empties and refills the table from its sources, after a bulk load that ran without triggers (and
 * to check the kept table): the days from the sources, the longer periods from the days.
 */
export const REFILL_ROLLUPS = `delete from rollup_figures;
${['rollup_build_source', 'rollup_job_mix_source', 'rollup_claim_source'].map((source) => change(1, source, 'true', DAYS)).join('\n')}
${change(1, `(select location_id, period as day, ${FIGURES.join(', ')} from rollup_figures where grain = 'day')`, 'true', LONGER)}`;

export async function up(db: Kysely<any>): Promise<void> {
  await sql`alter table builds add column delivered_on text`.execute(db);
  await sql`alter table warranty_claims add column logged_on text`.execute(db);
  await fillLocalDays(db);
  await sql`create table rollup_figures (
    grain text not null, period text not null, location_id integer not null,
    ${sql.raw(FIGURES.map((f) => `${f} integer not null`).join(', '))},
    primary key (${sql.raw(KEY)})
  ) without rowid`.execute(db);
  await sql.raw(`create view rollup_build_source as ${BUILD_SOURCE}`).execute(db);
  await sql.raw(`create view rollup_claim_source as ${CLAIM_SOURCE}`).execute(db);
  await sql.raw(`create view rollup_job_mix_source as ${JOB_MIX_SOURCE}`).execute(db);
  for (const [name, when, body] of TRIGGERS) await sql.raw(`create trigger ${name} ${when} begin ${body} end`).execute(db);
  for (const statement of REFILL_ROLLUPS.split(';').filter((s) => s.trim())) await sql.raw(statement).execute(db);
}

const CHUNK = 400;

/** Stores each delivered build's and each claim's local day, computed from its UTC time in its location's zone. */
async function fillLocalDays(db: Kysely<any>): Promise<void> {
  const targets = [
    { table: 'builds', at: 'delivered_at', day: 'delivered_on' },
    { table: 'warranty_claims', at: 'created_at', day: 'logged_on' },
  ];
  for (const { table, at, day } of targets) {
    await sql`create temp table local_days (id integer primary key, day text not null)`.execute(db);
    for (let after = 0; ; ) {
      const rows = await sql<{ id: number; at: string; zone: string }>`select t.id, t.${sql.raw(at)} as at, l.time_zone as zone
        from ${sql.raw(table)} t join locations l on l.id = t.location_id
        where t.id > ${after} and t.${sql.raw(at)} is not null order by t.id limit 20000`.execute(db);
      if (rows.rows.length === 0) break;
      after = rows.rows.at(-1)!.id;
      for (let i = 0; i < rows.rows.length; i += CHUNK) {
        const values = rows.rows.slice(i, i + CHUNK).map((r) => sql`(${r.id}, ${isoDay(localDay(r.zone, Date.parse(r.at)))})`);
        await sql`insert into local_days (id, day) values ${sql.join(values)}`.execute(db);
      }
    }
    await sql`update ${sql.raw(table)} set ${sql.raw(day)} = (select d.day from local_days d where d.id = ${sql.raw(table)}.id)
      where id in (select id from local_days)`.execute(db);
    await sql`drop table temp.local_days`.execute(db);
  }
}

export async function down(db: Kysely<any>): Promise<void> {
  for (const [name] of TRIGGERS) await sql.raw(`drop trigger ${name}`).execute(db);
  await sql`drop view rollup_job_mix_source`.execute(db);
  await sql`drop view rollup_claim_source`.execute(db);
  await sql`drop view rollup_build_source`.execute(db);
  await sql`drop table rollup_figures`.execute(db);
  await sql`alter table warranty_claims drop column logged_on`.execute(db);
  await sql`alter table builds drop column delivered_on`.execute(db);
}
