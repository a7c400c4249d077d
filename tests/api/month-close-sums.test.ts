import { REFILL_MONTH_CLOSE_SUMS, type Db } from '@busbar/db';
import fc from 'fast-check';
import { sql } from 'kysely';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { refillRollups } from '../../apps/api/src/queries/rollups-refill.ts';
import { startHarness, type Harness } from '../support/api-harness.ts';
import { anyChange, apply, smallNetwork } from '../support/kept-changes.ts';
import { afterRefill, rolledBack } from '../support/kept-tables.ts';

let h: Harness;
beforeAll(async () => {
  h = await startHarness();
  await smallNetwork(h.db);
});
afterAll(() => h.close());

/** The kept month close sums (migration 056) without their emptied rows, in key order. */
async function keptSums(db: Db) {
  const rows = await sql<Record<string, unknown>>`select * from month_close_sums order by month, location_id`.execute(db);
  return rows.rows.filter((row) => Object.entries(row).some(([column, value]) => !['month', 'locationId'].includes(column) && value !== 0));
}

/**
 * The same summed straight from builds and claims the way the close summed them before the sums
 * were kept: delivered builds and logged claims between the month's first and last day.
 */
async function summedByDays(db: Db, month: string) {
  const { rows } = await sql<Record<string, number>>`
    select l.id as location_id, b.delivered, b.parts, b.labor, b.revenue, b.cost, c.claims, c.requested, c.received, c.outstanding
    from locations l
    left join (select location_id, count(*) as delivered, sum(parts_price_cents) as parts, sum(labor_cents) as labor, sum(total_cents) as revenue, sum(parts_cost_cents) as cost
      from builds where status = 'delivered' and delivered_on between ${`${month}-01`} and ${`${month}-31`} group by location_id) b on b.location_id = l.id
    left join (select location_id, count(*) as claims, sum(credit_requested_cents) as requested, sum(coalesce(credit_received_cents, 0)) as received,
        sum(case when status <> 'denied' and credit_received_cents is null then credit_requested_cents else 0 end) as outstanding
      from warranty_claims where logged_on between ${`${month}-01`} and ${`${month}-31`} group by location_id) c on c.location_id = l.id
    where b.delivered is not null or c.claims is not null order by l.id`.execute(db);
  return rows.map((r) => [r.locationId, r.delivered ?? 0, r.parts ?? 0, r.labor ?? 0, r.revenue ?? 0, r.cost ?? 0, r.claims ?? 0, r.requested ?? 0, r.received ?? 0, r.outstanding ?? 0]);
}

async function keptOf(db: Db, month: string) {
  const rows = (await keptSums(db)).filter((r) => r.month === month) as Record<string, number>[];
  return rows.map((r) => [
    r.locationId, r.buildsDelivered, r.partsRevenueCents, r.laborRevenueCents, r.revenueCents, r.partsCostCents,
    r.claimsLogged, r.creditRequestedCents, r.creditReceivedCents, r.creditOutstandingCents,
  ]);
}

describe('the month close sums follow every change', () => {
  it('match a refill from scratch, and the builds and claims of each month summed by its days, after any mix of changes', async () => {
    const change = await anyChange(h.db);
    const before = await keptSums(h.db);
    expect(before).toEqual(await afterRefill(h.db, REFILL_MONTH_CLOSE_SUMS, keptSums));
    expect(new Set(before.map((r) => r.month))).toEqual(new Set(['2025-12', '2026-01']));
    await fc.assert(
      fc.asyncProperty(fc.array(change, { minLength: 1, maxLength: 15 }), async (changes) => {
        await rolledBack(h.db, async () => {
          for (const c of changes) await apply(h.db, c);
          const kept = await keptSums(h.db);
          expect(kept).toEqual(await afterRefill(h.db, REFILL_MONTH_CLOSE_SUMS, keptSums));
          for (const month of new Set(kept.map((r) => String(r.month)))) expect(await keptOf(h.db, month)).toEqual(await summedByDays(h.db, month));
        });
      }),
      { seed: 10_056, numRuns: 120 },
    );
  }, 60_000);

  it('count a denied claim’s credit as asked but not outstanding, and take it out when the claim goes', async () => {
    const claim = await h.db.selectFrom('warrantyClaims').select(['id', 'locationId', 'loggedOn', 'creditRequestedCents']).where('creditRequestedCents', '>', 0).executeTakeFirstOrThrow();
    const month = claim.loggedOn!.slice(0, 7);
    const row = () => h.db.selectFrom('monthCloseSums').selectAll().where('month', '=', month).where('locationId', '=', claim.locationId).executeTakeFirstOrThrow();
    const before = await row();
    await rolledBack(h.db, async () => {
      await h.db.updateTable('warrantyClaims').set({ status: 'denied' }).where('id', '=', claim.id).execute();
      expect(await row()).toMatchObject({
        claimsLogged: before.claimsLogged,
        creditRequestedCents: before.creditRequestedCents,
        creditOutstandingCents: before.creditOutstandingCents - claim.creditRequestedCents,
      });
      await h.db.deleteFrom('warrantyClaims').where('id', '=', claim.id).execute();
      expect(await row()).toMatchObject({ claimsLogged: before.claimsLogged - 1, creditRequestedCents: before.creditRequestedCents - claim.creditRequestedCents });
    });
  });

  it('are rebuilt by the refill command after they were changed behind the triggers', async () => {
    const kept = await keptSums(h.db);
    await sql`delete from month_close_sums where month = '2026-01'`.execute(h.db);
    await sql`update month_close_sums set revenue_cents = revenue_cents + 1`.execute(h.db);
    expect(await keptSums(h.db)).not.toEqual(kept);
    await refillRollups(h.db);
    expect(await keptSums(h.db)).toEqual(kept);
  });
});
