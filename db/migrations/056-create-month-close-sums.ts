import { sql, type Kysely } from 'kysely';

/**
 * What a month's close adds up, kept per month and location: the delivered builds by their local
 * delivery day and the claims by their local logging day. The close summed every shop's builds
 * and claims of the month at each request (14,000 builds and 2,000 claims on 200 shops, 3–4 ms
 * through the covering indexes of migrations 045 and 047), where it now reads a row per shop; those
 * indexes served nothing else and go. Triggers add each row's part after a change and take out
 * what it was before.
 */
/** Where each figure comes from: the rows that count, their month, and what each adds. */
const SOURCES = {
  build: {
    when: (row: string) => `${row}.status = 'delivered' and ${row}.delivered_on is not null`,
    month: (row: string) => `substr(${row}.delivered_on, 1, 7)`,
    figures: (row: string) => ({
      builds_delivered: '1',
      parts_revenue_cents: `${row}.parts_price_cents`,
      labor_revenue_cents: `${row}.labor_cents`,
      revenue_cents: `${row}.total_cents`,
      parts_cost_cents: `${row}.parts_cost_cents`,
    }),
    changes: 'status, delivered_on, location_id, parts_price_cents, labor_cents, total_cents, parts_cost_cents',
  },
  claim: {
    when: (row: string) => `${row}.logged_on is not null`,
    month: (row: string) => `substr(${row}.logged_on, 1, 7)`,
    figures: (row: string) => ({
      claims_logged: '1',
      credit_requested_cents: `${row}.credit_requested_cents`,
      credit_received_cents: `coalesce(${row}.credit_received_cents, 0)`,
      // Asked of the vendor, not denied and not (yet) received.
      credit_outstanding_cents: `case when ${row}.status <> 'denied' and ${row}.credit_received_cents is null then ${row}.credit_requested_cents else 0 end`,
    }),
    changes: 'status, logged_on, location_id, credit_requested_cents, credit_received_cents',
  },
};
type Source = (typeof SOURCES)[keyof typeof SOURCES];

/** The summed columns of `month_close_sums`. */
const FIGURES = [...Object.keys(SOURCES.build.figures('b')), ...Object.keys(SOURCES.claim.figures('c'))];
const KEY = 'month, location_id';
const ON_CONFLICT = (figures: string[]) => `on conflict (${KEY}) do update set ${figures.map((f) => `${f} = ${f} + excluded.${f}`).join(', ')};`;

/** Adds (sign 1) or takes out (sign −1) the part of the trigger's row (`new` or `old`) when it counts. */
function part(source: Source, row: 'new' | 'old', sign: 1 | -1): string {
  const figures = Object.entries(source.figures(row));
  return `insert into month_close_sums (${KEY}, ${figures.map(([f]) => f).join(', ')})
    select ${source.month(row)}, ${row}.location_id, ${figures.map(([, value]) => `${sign} * ${value}`).join(', ')} where ${source.when(row)}
    ${ON_CONFLICT(figures.map(([f]) => f))}`;
}

const triggersOf = (name: string, table: string, source: Source): [name: string, when: string, body: string][] => [
  [`month_close_sums_${name}_insert`, `after insert on ${table}`, part(source, 'new', 1)],
  [`month_close_sums_${name}_update`, `after update of ${source.changes} on ${table}`, `${part(source, 'old', -1)}\n${part(source, 'new', 1)}`],
  [`month_close_sums_${name}_delete`, `after delete on ${table}`, part(source, 'old', -1)],
];
const TRIGGERS = [...triggersOf('build', 'builds', SOURCES.build), ...triggersOf('claim', 'warranty_claims', SOURCES.claim)];

/** Each table's rows summed by month and location, added into the kept table. */
function summed(source: Source, table: string): string {
  const figures = Object.entries(source.figures('t'));
  return `insert into month_close_sums (${KEY}, ${figures.map(([f]) => f).join(', ')})
    select ${source.month('t')}, t.location_id, ${figures.map(([, value]) => `sum(${value})`).join(', ')} from ${table} t where ${source.when('t')}
    group by 1, 2 ${ON_CONFLICT(figures.map(([f]) => f))}`;
}

/** Empties the table and sums it again from builds and claims (after a bulk load that ran without triggers). */
export const REFILL_MONTH_CLOSE_SUMS = `delete from month_close_sums;
${summed(SOURCES.build, 'builds')}
${summed(SOURCES.claim, 'warranty_claims')}`;

export async function up(db: Kysely<any>): Promise<void> {
  await sql.raw(`create table month_close_sums (month text not null, location_id integer not null,
    ${FIGURES.map((f) => `${f} integer not null default 0`).join(', ')}, primary key (${KEY})) without rowid`).execute(db);
  for (const [name, when, body] of TRIGGERS) await sql.raw(`create trigger ${name} ${when} begin ${body} end`).execute(db);
  for (const statement of REFILL_MONTH_CLOSE_SUMS.split(';').filter((s) => s.trim())) await sql.raw(statement).execute(db);
  await sql`drop index builds_delivered_sums`.execute(db);
  await sql`drop index warranty_claims_logged_sums`.execute(db);
}

export async function down(db: Kysely<any>): Promise<void> {
  await sql`create index warranty_claims_logged_sums on warranty_claims (location_id, logged_on, status, credit_requested_cents, credit_received_cents)`.execute(db);
  await sql`create index builds_delivered_sums on builds (location_id, delivered_on, parts_price_cents, labor_cents, total_cents, parts_cost_cents)
    where status = 'delivered'`.execute(db);
  for (const [name] of TRIGGERS) await sql.raw(`drop trigger ${name}`).execute(db);
  await sql`drop table month_close_sums`.execute(db);
}
