import { REFILL_ROLLUPS, type Db } from '@busbar/db';
import { sql } from 'kysely';

/** Empties the roll-up tables and fills them again from builds, their lines and claims, in one transaction. */
export async function refillRollups(db: Db): Promise<void> {
  await db.transaction().execute(async (trx) => {
    for (const statement of REFILL_ROLLUPS.split(';').filter((s) => s.trim())) await sql.raw(statement).execute(trx);
  });
}
