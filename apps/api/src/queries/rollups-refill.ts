import { FLAG_CHANGED_FINAL_MONTHS, REFILL_BUILD_COUNTS, REFILL_MONTH_CLOSE_SUMS, REFILL_ROLLUPS, type Db } from '@busbar/db';
import { sql } from 'kysely';

/**
 * Empties the roll-up tables, the month close sums and the build counts and fills them again
 * from builds, their lines and claims, in one transaction; then flags again only the final months
 * whose roll-up now differs from what was carried (the refill touched every month's row, and so
 * flagged every final month).
 */
export async function refillRollups(db: Db): Promise<void> {
  await db.transaction().execute(async (trx) => {
    for (const statement of `${REFILL_ROLLUPS}\n${REFILL_MONTH_CLOSE_SUMS}\n${REFILL_BUILD_COUNTS}`.split(';').filter((s) => s.trim())) await sql.raw(statement).execute(trx);
    await sql.raw(FLAG_CHANGED_FINAL_MONTHS).execute(trx);
  });
}
