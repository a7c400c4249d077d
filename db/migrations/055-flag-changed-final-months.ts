import { sql, type Kysely } from 'kysely';

/**
 * Final months are read by month, and those changed since they were accounted for are flagged.
 * A close looked for changes by comparing every final month of its shops with the roll-ups (each
 * month's carried JSON read four times), and found a month's finals by reading them all: on 200
 * shops with five years closed (10,465 final months) the owner's month close took 23 ms, 13 of them
 * for the changes. Now a change to a month's roll-up (a build delivered, edited or taken back, a
 * claim logged or credited) flags that month's close at the shop as `changed`, if it is final; a
 * close reads only flagged months (through a partial index) and, having taken up their changes,
 * clears the shop's flags. Months already final are flagged here where they differ from their
 * roll-ups now.
 */
const TRIGGERS = [
  ['month_closes_changed_insert', 'after insert', 'new'],
  ['month_closes_changed_update', 'after update', 'new'],
  ['month_closes_changed_delete', 'after delete', 'old'],
] as const;

/** Flags each final month by whether its roll-up differs from what was carried: here, and after the roll-ups are refilled (which touches every month). */
export const FLAG_CHANGED_FINAL_MONTHS = `update month_closes set changed = exists (
    select 1 from (select 1) left join rollup_figures r on r.grain = 'month' and r.period = month_closes.month and r.location_id = month_closes.location_id
    where coalesce(r.builds_delivered, 0) <> json_extract(month_closes.carried, '$.buildsDelivered')
      or coalesce(r.revenue_cents, 0) <> json_extract(month_closes.carried, '$.revenueCents')
      or coalesce(r.parts_cost_cents, 0) <> json_extract(month_closes.carried, '$.partsCostCents')
      or coalesce(r.credits_received_cents, 0) <> json_extract(month_closes.carried, '$.creditReceivedCents'))`;

export async function up(db: Kysely<any>): Promise<void> {
  await sql`alter table month_closes add column changed integer not null default 0`.execute(db);
  await sql`create index month_closes_month on month_closes (month)`.execute(db);
  await sql`create index month_closes_changed on month_closes (location_id) where changed = 1`.execute(db);
  for (const [name, event, row] of TRIGGERS) {
    await sql
      .raw(
        `create trigger ${name} ${event} on rollup_figures when ${row}.grain = 'month' begin
          update month_closes set changed = 1 where location_id = ${row}.location_id and month = ${row}.period and changed = 0;
        end`,
      )
      .execute(db);
  }
  await sql.raw(FLAG_CHANGED_FINAL_MONTHS).execute(db);
}

export async function down(db: Kysely<any>): Promise<void> {
  for (const [name] of TRIGGERS) await sql.raw(`drop trigger ${name}`).execute(db);
  await sql`drop index month_closes_changed`.execute(db);
  await sql`drop index month_closes_month`.execute(db);
  await sql`alter table month_closes drop column changed`.execute(db);
}
