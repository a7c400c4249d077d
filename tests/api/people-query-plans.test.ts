import { sql } from 'kysely';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { pageBuildLeads } from '../../apps/api/src/queries/assignments.ts';
import { pageUsers } from '../../apps/api/src/queries/users.ts';
import { demoIds, startHarness, type Harness } from '../support/api-harness.ts';
import { plansOf } from '../support/query-plans.ts';

/**
 * A shop's people among a network's thousands: the demo with 2,000 more people elsewhere, and
 * statistics gathered. A lead's lists find their shop's people through its role assignments,
 * never by asking each person of the network in name order.
 */
const ELSEWHERE = 2_000;
let h: Harness;
let den: number;

beforeAll(async () => {
  h = await startHarness();
  den = (await demoIds(h.db)).location('DEN');
  const at = '2026-01-01T00:00:00.000Z';
  await h.db
    .insertInto('users')
    .values(Array.from({ length: ELSEWHERE }, (_, i) => ({ email: `elsewhere${i}@example.test`, name: `Elsewhere ${i}`, status: 'active', passwordHash: null, createdAt: at })))
    .execute();
  await sql`analyze`.execute(h.db);
}, 60_000);
afterAll(() => h.close());

/** Statements that walk the people of the whole network. */
const peopleWalks = (plans: string[][]) => plans.flat().filter((line) => /^SCAN u\b/.test(line));

describe("a shop's people on a network of thousands", () => {
  it("lists the people who lead a shop's builds from its role assignments", async () => {
    const query = { page: 1, pageSize: 50 };
    const plans = await plansOf(h.db, (db) => pageBuildLeads(db, [den], query));
    expect(peopleWalks(plans), plans.flat().join('\n')).toEqual([]);
    const page = await pageBuildLeads(h.db, [den], query);
    expect(page.total).toBeGreaterThan(0);
    expect(page.items.some((p) => p.name.startsWith('Elsewhere'))).toBe(false);
  });

  it("lists a shop's staff from its role assignments", async () => {
    const filter = { status: 'all' as const, holding: { locationIds: [den], regionIds: [] }, page: 1, pageSize: 50 };
    const plans = await plansOf(h.db, (db) => pageUsers(db, filter));
    expect(peopleWalks(plans), plans.flat().join('\n')).toEqual([]);
    const page = await pageUsers(h.db, filter);
    expect(page.total).toBeGreaterThan(0);
    expect(page.rows.some((p) => p.name.startsWith('Elsewhere'))).toBe(false);
  });
});
