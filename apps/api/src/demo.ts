import { DEMO_PASSWORD, seedDemoNetwork, type Db } from '@busbar/db';
import { hashPassword } from './auth/password.ts';
import { closeDemoMonths } from './demo-closes.ts';
import { addDemoEvidence } from './demo-evidence.ts';

/**
 * Fills an empty database with the demo network and its history, the evidence files of its claims
 * under `dataDir` and its months before last closed, telling `filling` first; a database with
 * people in it is left alone.
 */
export async function ensureDemoData(db: Db, scryptLogN: number, now: Date, dataDir: string, filling: () => void = () => {}): Promise<boolean> {
  const anyone = await db.selectFrom('users').select('id').limit(1).executeTakeFirst();
  if (anyone) return false;
  filling();
  await seedDemoNetwork(db, { passwordHash: await hashPassword(DEMO_PASSWORD, scryptLogN), now, history: true });
  await addDemoEvidence(db, dataDir);
  await closeDemoMonths(db, now);
  return true;
}
