import { rmSync } from 'node:fs';
import { parseArgs } from 'node:util';
import { DEMO_PASSWORD, seedNetwork } from '@busbar/db';
import { z } from 'zod';
import { closeGeneratedMonths } from './demo-closes.ts';
import { progressBar } from './progress.ts';
import { hashPassword } from './auth/password.ts';
import { loadConfig } from './config.ts';

/**
 * `pnpm demo:network --locations 200 --years 5`: replaces the database in BUSBAR_DATA_DIR with a
 * generated network of that size and history (the demo's sign-ins included, and the months before
 * last closed as the accountant would have), for measuring Busbar at scale.
 */
const { values } = parseArgs({ args: process.argv.slice(2).filter((a) => a !== '--'), options: { locations: { type: 'string', default: '200' }, years: { type: 'string', default: '5' } } });
const size = z.object({ locations: z.coerce.number().int().min(1).max(1000), years: z.coerce.number().min(0.1).max(10) }).parse(values);
const config = loadConfig();
for (const suffix of ['', '-wal', '-shm']) rmSync(config.databaseFile + suffix, { force: true });
const started = Date.now();
const now = new Date();
const bar = progressBar(`${size.locations} locations × ${size.years} years`, 1);
const counts = await seedNetwork({
  file: config.databaseFile,
  ...size,
  now,
  passwordHash: await hashPassword(DEMO_PASSWORD, config.scryptLogN),
  onProgress: ({ days, totalDays, builds, indexing }) => {
    if (indexing) bar.end(`${builds.toLocaleString('en-US')} builds; building indexes…`);
    else bar.update(days / totalDays, `day ${days} of ${totalDays}, ${builds.toLocaleString('en-US')} builds`);
  },
});
const closing = progressBar('closing months', 1);
const closes = await closeGeneratedMonths(config.databaseFile, now, (done, of) => closing.update(done / of, `${done.toLocaleString('en-US')} of ${of.toLocaleString('en-US')}`));
closing.end(`${closes.toLocaleString('en-US')} months final`);
const summary = [...Object.entries(counts), ['monthCloses', closes] as const].map(([table, n]) => `${n.toLocaleString('en-US')} ${table}`).join(', ');
console.log(`Filled ${config.databaseFile} in ${Math.round((Date.now() - started) / 1000)} s: ${summary}.`);
