import { sql } from 'kysely';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { inQuietHour, mergeSearchIndexes } from '../../apps/api/src/queries/search-upkeep.ts';
import { startHarness, type Agent, type Harness } from '../support/api-harness.ts';
import { SIGN_INS } from '../support/staff-fixtures.ts';

/** The full-text indexes kept merged: the build and customer searches, network-wide and per shop. */
const INDEXES = ['build_search', 'customer_search', 'shop_build_search', 'shop_customer_search'];

let h: Harness;
let owner: Agent;
beforeAll(async () => {
  h = await startHarness({}, true, { history: true });
  owner = await h.signedIn(SIGN_INS.owner);
});
afterAll(() => h.close());

const segments = async (table: string) => Number((await sql<{ n: number }>`select count(distinct segid) as n from ${sql.table(`${table}_idx`)}`.execute(h.db)).rows[0]!.n);
const found = async (path: string) => ((await owner.get(path)).body.items as { id: number }[]).map((row) => row.id).sort((a, b) => a - b);

describe('the search indexes, merged overnight', () => {
  it('are each merged back into one segment, in steps, and find what they found before', async () => {
    // Each save commits a segment to every index it touches: a few customers renamed one at a time.
    const customers = await h.db.selectFrom('customers').select(['id', 'name']).orderBy('id').limit(9).execute();
    for (const [i, c] of customers.entries()) await h.db.updateTable('customers').set({ name: `${c.name} Quillfeather${i}` }).where('id', '=', c.id).execute();
    for (const table of INDEXES) expect(await segments(table), table).toBeGreaterThan(1);
    const before = { builds: await found('/api/builds?q=Quillfeather&pageSize=100'), customers: await found('/api/customers?q=Quillfeather&pageSize=100') };
    expect(before.customers).toHaveLength(9);

    expect(await mergeSearchIndexes(h.db, 0)).toBeGreaterThanOrEqual(INDEXES.length);
    for (const table of INDEXES) {
      expect(await segments(table), table).toBe(1);
      // FTS5's own check of the index against its content.
      await sql`insert into ${sql.table(table)} (${sql.ref(table)}) values ('integrity-check')`.execute(h.db);
    }
    expect({ builds: await found('/api/builds?q=Quillfeather&pageSize=100'), customers: await found('/api/customers?q=Quillfeather&pageSize=100') }).toEqual(before);
    // Nothing left to merge.
    expect(await mergeSearchIndexes(h.db, 0)).toBe(0);
  });

  it('run in the small hours of the continental US only', () => {
    expect(inQuietHour(new Date('2026-12-05T09:00:00Z'))).toBe(true);
    expect(inQuietHour(new Date('2026-12-05T09:59:59Z'))).toBe(true);
    expect(inQuietHour(new Date('2026-12-05T08:59:59Z'))).toBe(false);
    expect(inQuietHour(new Date('2026-12-05T17:00:00Z'))).toBe(false);
  });
});
