import { sql, type Kysely } from 'kysely';
import { unitSource, UTC_INSTALL_DAY } from './019-create-unit-exposure.ts';
import { REFILL_UNIT_EXPOSURE } from './046-create-workmanship-counts.ts';

/**
 * A unit is installed on the day its build was delivered at its shop (`builds.delivered_on`, kept
 * in the shop's zone since migration 021), the kind of day a claim's failure day is. It was the UTC
 * date of the delivery: a day late for a delivery in an American shop's evening, which gave a unit
 * failing on its delivery day an age of −1 day and put a month's last evening in the next month. A
 * line added after delivery (a replacement, a correction) still starts on the UTC date it was added
 * if that is later: no shop's day is kept for lines. The build's triggers (019) now also follow a
 * change of that day alone, and every reliability table is filled again (minutes on 200 shops).
 */
const SHOP_INSTALL_DAY = `case when i.created_at > b.delivered_at
    then max(coalesce(b.delivered_on, date(b.delivered_at)), substr(i.created_at, 1, 10))
    else coalesce(b.delivered_on, date(b.delivered_at)) end`;

const BUILD_TRIGGERS = ['unit_exposure_build_before_update', 'unit_exposure_build_after_update'];
const [WATCHED, WATCHED_WITH_DAY] = ['update of status, delivered_at, location_id', 'update of status, delivered_at, delivered_on, location_id'];

async function installedOn(db: Kysely<any>, day: string, [from, to]: [string, string]): Promise<void> {
  for (const name of BUILD_TRIGGERS) {
    const { rows } = await sql<{ sql: string }>`select sql from sqlite_master where type = 'trigger' and name = ${name}`.execute(db);
    if (!rows[0]?.sql.includes(from)) throw new Error(`The trigger ${name} does not watch ${from}`);
    await sql.raw(`drop trigger ${name}`).execute(db);
    await sql.raw(rows[0].sql.replace(from, to)).execute(db);
  }
  await sql`drop view installed_unit_source`.execute(db);
  await sql.raw(`create view installed_unit_source as ${unitSource(day)}`).execute(db);
  for (const statement of REFILL_UNIT_EXPOSURE.split(';').filter((s) => s.trim())) await sql.raw(statement).execute(db);
}

export const up = (db: Kysely<any>) => installedOn(db, SHOP_INSTALL_DAY, [WATCHED, WATCHED_WITH_DAY]);
export const down = (db: Kysely<any>) => installedOn(db, UTC_INSTALL_DAY, [WATCHED_WITH_DAY, WATCHED]);
