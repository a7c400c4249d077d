import type { Db } from '@busbar/db';
import { sql } from 'kysely';

const SIX_HOURS_MS = 6 * 3_600_000;

/**
 * Keeps SQLite's query planner informed: `PRAGMA optimize` gathers statistics (ANALYZE) for
 * tables whose size changed enough to matter, at start-up (0x10002 also covers tables never
 * analysed) and every few hours after, so the list queries keep choosing their indexes.
 */
export async function keepPlannerStatistics(db: Db): Promise<void> {
  await sql`pragma optimize = 0x10002`.execute(db);
  setInterval(() => void sql`pragma optimize`.execute(db), SIX_HOURS_MS).unref();
}
