import type { ReliabilityDetail, ReliabilityList } from '@busbar/shared';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { BAD_BATCH, badBatchPrefixes } from '../../db/demo/claims-rates.ts';
import { startHarness, type Harness } from '../support/api-harness.ts';

// The demo's two stories (db/demo/claims-rates.ts): a batch of TDW-DC40 chargers that fails early,
// and Austin, whose installs come loose far more often. The screens must find both from the data alone.
let h: Harness;
beforeAll(async () => {
  h = await startHarness({}, true, { history: true });
}, 60_000);
afterAll(() => h.close());

describe('the demo stories, found by the reliability screens', () => {
  it("lists the bad batch's install quarter among the components to watch, and its failures are the batch's serials", async () => {
    const owner = await h.signedIn('owner@demo.busbar.test');
    const list = (await owner.get('/api/reliability').expect(200)).body as ReliabilityList;
    const batchRows = list.watch.filter((w) => w.label.startsWith(BAD_BATCH.sku) && w.from !== null);
    expect(batchRows.length).toBeGreaterThan(0);
    for (const row of batchRows) expect(row.ratioLower).toBeGreaterThan(1);

    // Behind the flagged quarter: most of the claims are on units of the batch's serial ranges.
    const row = batchRows[0]!;
    const prefixes = badBatchPrefixes('TW', h.clock.now.getTime());
    const claims = await h.db
      .selectFrom('warrantyClaims as w')
      .innerJoin('buildItems as i', 'i.id', 'w.buildItemId')
      .innerJoin('builds as b', 'b.id', 'w.buildId')
      .select('i.serialNumber')
      .where('i.sku', '=', BAD_BATCH.sku)
      .where('b.deliveredAt', '>=', `${row.from}-01`)
      .where('b.deliveredAt', '<=', `${row.to}-31T23:59:59.999Z`)
      .execute();
    const inBatch = claims.filter((c) => prefixes.some((p) => c.serialNumber?.startsWith(p))).length;
    expect(claims.length).toBe(row.failures);
    expect(inBatch / claims.length).toBeGreaterThan(0.5);
  });

  it("flags Austin's house batteries above the funnel's 99.8 % limit, with the network's largest workmanship share", async () => {
    const manager = await h.signedIn('regional2@demo.busbar.test');
    const detail = (await manager.get('/api/reliability/category/house_battery').expect(200)).body as ReliabilityDetail;
    const austin = detail.funnel.points.find((p) => p.code === 'AUS')!;
    expect(austin.signal).toBe('above_998');
    expect(detail.funnel.points.filter((p) => p.signal === 'above_998')).toEqual([austin]);
    const share = (p: { claims: number; workmanshipClaims: number }) => p.workmanshipClaims / p.claims;
    for (const other of detail.funnel.points.filter((p) => p !== austin && p.claims >= 5)) expect(share(austin)).toBeGreaterThan(share(other));
  });

  it("counts a category's claims by shop, workmanship, mode and coverage as the claims themselves do, for the owner and for a region", async () => {
    const claimsOf = (locationIds?: number[]) => {
      let query = h.db
        .selectFrom('warrantyClaims as w')
        .innerJoin('builds as b', 'b.id', 'w.buildId')
        .innerJoin('catalogItems as ci', 'ci.id', 'w.catalogItemId')
        .select(['w.locationId', 'w.coverage', 'w.failureMode'])
        .where('ci.category', '=', 'house_battery')
        .where('b.status', '=', 'delivered');
      if (locationIds) query = query.where('w.locationId', 'in', locationIds);
      return query.execute();
    };
    const count = <T>(rows: T[], keyOf: (row: T) => string | number) => {
      const counts = new Map<string | number, number>();
      for (const row of rows) counts.set(keyOf(row), (counts.get(keyOf(row)) ?? 0) + 1);
      return counts;
    };
    const all = await claimsOf();
    expect(all.length).toBeGreaterThan(20);
    const owner = await h.signedIn('owner@demo.busbar.test');
    const network = (await owner.get('/api/reliability/category/house_battery').expect(200)).body as ReliabilityDetail;
    const [byShop, workmanship] = [count(all, (c) => c.locationId), count(all.filter((c) => c.coverage === 'workmanship'), (c) => c.locationId)];
    for (const point of network.funnel.points) {
      expect([point.claims, point.workmanshipClaims]).toEqual([byShop.get(point.locationId!) ?? 0, workmanship.get(point.locationId!) ?? 0]);
    }
    expect(network.funnel.points.reduce((sum, p) => sum + p.claims, 0)).toBe(all.length);

    const manager = await h.signedIn('regional2@demo.busbar.test');
    const region = (await manager.get('/api/reliability/category/house_battery').expect(200)).body as ReliabilityDetail;
    const mine = await claimsOf(region.funnel.points.filter((p) => p.locationId !== null).map((p) => p.locationId!));
    expect(mine.length).toBeLessThan(all.length);
    expect(new Map(region.failureModes.map((m) => [m.mode, m.claims]))).toEqual(count(mine, (c) => c.failureMode));
    expect(new Map(region.coverages.map((c) => [c.coverage, c.claims]))).toEqual(count(mine, (c) => c.coverage));
  });

  it("reads the chargers' shape as early failures (the demo draws them with shape 0.6)", async () => {
    const owner = await h.signedIn('owner@demo.busbar.test');
    const chargers = (await owner.get('/api/reliability/category/dc_dc_charger').expect(200)).body as ReliabilityDetail;
    expect(chargers.weibull?.shape).toBeLessThan(1);
    expect(chargers.weibull?.reading).toBe('early');
  });
});
