import { rmSync } from 'node:fs';
import { join } from 'node:path';
import { migrateToLatest, openDatabase } from '@busbar/db';
import { loadConfig } from './config.ts';
import { ensureDemoData } from './demo.ts';

/** `pnpm db:reset`: deletes the database file and the evidence files of its claims, and rebuilds both with the demo network. */
const config = loadConfig();
for (const suffix of ['', '-wal', '-shm']) rmSync(config.databaseFile + suffix, { force: true });
rmSync(join(config.dataDir, 'evidence'), { recursive: true, force: true });
const db = openDatabase(config.databaseFile);
await migrateToLatest(db);
await ensureDemoData(db, config.scryptLogN, new Date(), config.dataDir);
await db.destroy();
console.log(`Rebuilt ${config.databaseFile} with the demo network.`);
