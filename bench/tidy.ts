import { join } from 'node:path';
import { openDatabase } from '@busbar/db';

/** The e-mail addresses of the customers the bench writes: the import's, the lead's meanwhile and the load's. */
const WRITTEN = ['imported.%@example.test', 'meanwhile.%@example.test', 'load.%@example.test'];

/**
 * Takes what a run wrote out of the network again (the imported builds, and the customers and
 * vehicles the bench added), through the triggers, so the roll-ups and search stay whole and the
 * next run times the same network: before, each run left 2,000 builds delivered on one day of one
 * shop, and a region's month close summed all of them. The audit log keeps its rows.
 */
export async function forgetBenchWrites(dir: string): Promise<{ builds: number; customers: number }> {
  const db = openDatabase(join(dir, 'busbar.sqlite'));
  try {
    return await db.transaction().execute(async (trx) => {
      const customers = trx.selectFrom('customers').select('id').where((eb) => eb.or(WRITTEN.map((pattern) => eb('email', 'like', pattern))));
      const builds = await trx.deleteFrom('builds').where('customerId', 'in', customers).executeTakeFirst();
      await trx.deleteFrom('vehicles').where('customerId', 'in', customers).execute();
      const removed = await trx.deleteFrom('customers').where('id', 'in', customers).executeTakeFirst();
      return { builds: Number(builds.numDeletedRows), customers: Number(removed.numDeletedRows) };
    });
  } finally {
    await db.destroy();
  }
}
