import { sql, type Kysely } from 'kysely';
import { REFILL_UNIT_EXPOSURE as REFILL_038 } from './038-create-unit-exposure-lifetime.ts';

/**
 * The failures of `unit_failures` counted per item and age in days, and per item, coverage and
 * failure mode, over the whole network and per region: a category's detail over every install month
 * read each of its failures (48,000 house batteries on 200 shops, 11 ms for the ages and 6 ms for
 * the shares), where it now reads 9,000 and a few dozen rows.
 *
 * Triggers on `unit_failures` add each failure and take it out again. That table's rows are only
 * inserted, replaced (`insert or replace`, migration 019) and deleted: a replaced row is taken out
 * before the insert, as SQLite fires no delete trigger for it while recursive triggers are off.
 * A location moved to another region takes its failures along. Counts that reach zero are deleted.
 */
interface FailureSums {
  table: string;
  /** The key columns, `failures` their count. */
  key: string[];
}
const SUMS: FailureSums[] = [
  { table: 'unit_failure_ages_network', key: ['catalog_item_id', 'age_days'] },
  { table: 'unit_failure_ages_region', key: ['catalog_item_id', 'region_id', 'age_days'] },
  { table: 'unit_failure_kinds_network', key: ['catalog_item_id', 'coverage', 'failure_mode'] },
  { table: 'unit_failure_kinds_region', key: ['catalog_item_id', 'region_id', 'coverage', 'failure_mode'] },
];
const TEXT_COLUMNS = ['coverage', 'failure_mode'];

/** A key column's value for the failure row `row` (`region` its location's region, when given). */
function valueOf(column: string, row: string, region?: string): string {
  if (column === 'region_id') return region ?? `(select region_id from locations where id = ${row}.location_id)`;
  if (column === 'age_days') return `${row}.failed_day - ${row}.installed_day`;
  return `${row}.${column}`;
}
const values = ({ key }: FailureSums, row: string, region?: string) => key.map((c) => valueOf(c, row, region)).join(', ');
const add = ({ table, key }: FailureSums) => `insert into ${table} (${key.join(', ')}, failures)`;
const onConflict = ({ key }: FailureSums) => `on conflict (${key.join(', ')}) do update set failures = failures + excluded.failures;`;
const dropZeros = ({ table }: FailureSums, where: string) => `delete from ${table} where failures = 0 and ${where};`;
const keyOf = ({ key }: FailureSums) => `(${key.join(', ')})`;

/** One failure row (`new` or `old`) added (1) or taken out (−1). */
const counted = (sums: FailureSums, row: 'new' | 'old', sign: 1 | -1) =>
  `${add(sums)} values (${values(sums, row)}, ${sign}) ${onConflict(sums)}\n${sign === -1 ? dropZeros(sums, `${keyOf(sums)} = (${values(sums, row)})`) : ''}`;

/** The row an `insert or replace` of `new` is about to replace, taken out. */
const replaced = (sums: FailureSums) => {
  const old = `from unit_failures u where u.claim_id = new.claim_id`;
  return `${add(sums)} select ${values(sums, 'u')}, -1 ${old} ${onConflict(sums)}\n${dropZeros(sums, `${keyOf(sums)} in (select ${values(sums, 'u')} ${old})`)}`;
};

/** A moved location's failures taken out of its old region (−1) or added to its new one (1). */
const moved = (sums: FailureSums, region: string, sign: 1 | -1) =>
  `${add(sums)} select ${values(sums, 'u', region)}, ${sign} * count(*) from unit_failures u where u.location_id = new.id group by ${values(sums, 'u', region)} ${onConflict(sums)}`;

const REGION_SUMS = SUMS.filter((s) => s.key.includes('region_id'));
const TRIGGERS: [name: string, when: string, body: string][] = [
  ...SUMS.flatMap((sums): [string, string, string][] => [
    [`${sums.table}_replace`, 'before insert on unit_failures', replaced(sums)],
    [`${sums.table}_insert`, 'after insert on unit_failures', counted(sums, 'new', 1)],
    [`${sums.table}_delete`, 'after delete on unit_failures', counted(sums, 'old', -1)],
  ]),
  [
    'unit_failure_sums_location_move',
    'after update of region_id on locations when old.region_id is not new.region_id',
    REGION_SUMS.map((sums) => `${moved(sums, 'old.region_id', -1)}\n${moved(sums, 'new.region_id', 1)}\n${dropZeros(sums, 'region_id = old.region_id')}`).join('\n'),
  ],
];

/** Every table emptied and counted again from `unit_failures` as it stands. */
const FILL = SUMS.map(
  (sums) => `delete from ${sums.table};
${add(sums)} select ${values(sums, 'u', 'l.region_id')}, count(*) from unit_failures u join locations l on l.id = u.location_id where true group by ${values(sums, 'u', 'l.region_id')};`,
).join('\n');

/** Empties and refills every reliability table from its sources (after a bulk load that ran without triggers). */
export const REFILL_UNIT_EXPOSURE = `${REFILL_038}\n${FILL}`;

export async function up(db: Kysely<any>): Promise<void> {
  for (const { table, key } of SUMS) {
    const columns = key.map((c) => `${c} ${TEXT_COLUMNS.includes(c) ? 'text' : 'integer'} not null`).join(', ');
    await sql.raw(`create table ${table} (${columns}, failures integer not null, primary key (${key.join(', ')})) without rowid`).execute(db);
  }
  for (const [name, when, body] of TRIGGERS) await sql.raw(`create trigger ${name} ${when} begin ${body} end`).execute(db);
  for (const statement of FILL.split(';').filter((s) => s.trim())) await sql.raw(statement).execute(db);
}

export async function down(db: Kysely<any>): Promise<void> {
  for (const [name] of TRIGGERS) await sql.raw(`drop trigger ${name}`).execute(db);
  for (const { table } of SUMS) await sql.raw(`drop table ${table}`).execute(db);
}
