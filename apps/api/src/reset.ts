import { rmSync } from 'node:fs';
import { migrateToLatest, openDatabase } from '@busbar/db';
import { loadConfig } from './config.ts';
import { ensureDemoData } from './demo.ts';

/** `pnpm db:reset`: deletes the database file and rebuilds it with the demo network. */
const config = loadConfig();
for (const suffix of ['', '-wal', '-shm']) rmSync(config.databaseFile + suffix, { force: true });
const db = openDatabase(config.databaseFile);
await migrateToLatest(db);
await ensureDemoData(db, config.scryptLogN, new Date());
await db.destroy();
console.log(`Rebuilt ${config.databaseFile} with the demo network.`);
