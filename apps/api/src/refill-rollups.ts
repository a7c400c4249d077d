import { migrateToLatest, openDatabase } from '@busbar/db';
import { loadConfig } from './config.ts';
import { refillRollups } from './queries/rollups-refill.ts';

/**
 * `npx tsx apps/api/src/refill-rollups.ts`: rebuilds the roll-up tables, the month close sums and
 * the build counts of the database in BUSBAR_DATA_DIR from its builds and claims (triggers keep
 * them current; this is for tables that were loaded or changed without them).
 */
const config = loadConfig();
const db = openDatabase(config.databaseFile);
await migrateToLatest(db);
const started = Date.now();
await refillRollups(db);
await db.destroy();
console.log(`Refilled the roll-ups of ${config.databaseFile} in ${((Date.now() - started) / 1000).toFixed(1)} s.`);
