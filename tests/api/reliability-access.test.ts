import type { ReliabilityDetail, ReliabilityList } from '@busbar/shared';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { demoIds, startHarness, type Harness } from '../support/api-harness.ts';

let h: Harness;
let ids: Awaited<ReturnType<typeof demoIds>>;
beforeAll(async () => {
  h = await startHarness({}, true, { history: true });
  ids = await demoIds(h.db);
}, 60_000);
afterAll(() => h.close());

const WEST = ['DEN', 'BOI', 'PDX', 'PHX'];
const EAST = ['AUS', 'DLH', 'AVL', 'BTV'];
const detailOf = async (email: string, path = '/api/reliability/category/house_battery') =>
  (await (await h.signedIn(email)).get(path).expect(200)).body as ReliabilityDetail;

describe('who reads reliability', () => {
  it('the owner sees every location by name', async () => {
    const detail = await detailOf('owner@demo.busbar.test');
    expect(detail.funnel.points.map((p) => p.code).sort()).toEqual([...WEST, ...EAST].sort());
    expect(detail.figures).toEqual(detail.network);
  });

  it("a regional manager sees the region's shops by name and the rest of the network without names", async () => {
    const detail = await detailOf('regional@demo.busbar.test');
    const named = detail.funnel.points.filter((p) => p.code !== null);
    expect(named.map((p) => p.code).sort()).toEqual([...WEST].sort());
    const unnamed = detail.funnel.points.filter((p) => p.code === null);
    expect(unnamed).toHaveLength(EAST.length);
    for (const p of unnamed) expect([p.locationId, p.name]).toEqual([null, null]);
    // Their figures are the region's; the network's are everyone's.
    expect(detail.figures.failures).toBe(named.reduce((sum, p) => sum + p.failures, 0));
    expect(detail.network.failures).toBe(detail.funnel.points.reduce((sum, p) => sum + p.failures, 0));
    expect(detail.network.failures).toBeGreaterThan(detail.figures.failures);
  });

  it("a regional manager's figures add up their shops' one by one (the region's sums agree with the shops' cells)", async () => {
    const regional = await h.signedIn('regional@demo.busbar.test');
    const list = (await regional.get('/api/reliability?groupBy=category').expect(200)).body as ReliabilityList;
    const shops = await Promise.all(
      WEST.map(async (code) => (await regional.get(`/api/reliability?groupBy=category&locationIds=${ids.location(code)}`).expect(200)).body as ReliabilityList),
    );
    const added = (key: string, field: 'units' | 'failures') => shops.reduce((sum, shop) => sum + (shop.rows.find((r) => r.key === key)?.[field] ?? 0), 0);
    expect(list.rows.length).toBeGreaterThan(3);
    for (const row of list.rows) expect([row.key, row.units, row.failures]).toEqual([row.key, added(row.key, 'units'), added(row.key, 'failures')]);
    const detail = await detailOf('regional@demo.busbar.test');
    const shopDetails = await Promise.all(WEST.map((code) => detailOf('regional@demo.busbar.test', `/api/reliability/category/house_battery?locationIds=${ids.location(code)}`)));
    expect(detail.plannedUnits).toBeGreaterThan(0);
    expect(detail.plannedUnits).toBe(shopDetails.reduce((sum, d) => sum + d.plannedUnits, 0));
  });

  it("a lead sees their shop against the network, and no other shop's id, code or name anywhere", async () => {
    const detail = await detailOf('lead@demo.busbar.test');
    const named = detail.funnel.points.filter((p) => p.code !== null);
    expect(named.map((p) => [p.locationId, p.code])).toEqual([[ids.location('DEN'), 'DEN']]);
    expect(detail.figures.unitMonths).toBeCloseTo(named[0]!.unitMonths, 6);
    const text = JSON.stringify(detail);
    for (const code of [...WEST, ...EAST].filter((c) => c !== 'DEN')) expect(text).not.toContain(`"${code}"`);
    for (const name of ['Boise', 'Austin', 'Portland', 'Asheville']) expect(text).not.toContain(name);
    const list = (await (await h.signedIn('lead@demo.busbar.test')).get('/api/reliability?groupBy=category').expect(200)).body as ReliabilityList;
    const owners = (await (await h.signedIn('owner@demo.busbar.test')).get(`/api/reliability?groupBy=category&locationIds=${ids.location('DEN')}`).expect(200)).body as ReliabilityList;
    expect(list.rows).toEqual(owners.rows);
    // Beside each of the shop's rows, the network's rate of the same category.
    const network = (await (await h.signedIn('owner@demo.busbar.test')).get('/api/reliability?groupBy=category').expect(200)).body as ReliabilityList;
    for (const row of list.rows) expect(row.networkRate).toEqual(network.rows.find((r) => r.key === row.key)!.rate);
    expect(list.rows.some((row) => row.rate?.estimate !== row.networkRate?.estimate)).toBe(true);
  });

  it('a location outside the scope answers 404; the own location narrows', async () => {
    const lead = await h.signedIn('lead@demo.busbar.test');
    await lead.get(`/api/reliability?locationIds=${ids.location('BOI')}`).expect(404);
    await lead.get(`/api/reliability/category/inverter?locationIds=${ids.location('DEN')},${ids.location('AUS')}`).expect(404);
    const regional = await h.signedIn('regional@demo.busbar.test');
    await regional.get(`/api/reliability/category/inverter?locationIds=${ids.location('AUS')}`).expect(404);
    const one = (await regional.get(`/api/reliability/category/inverter?locationIds=${ids.location('BOI')}`).expect(200)).body as ReliabilityDetail;
    expect(one.figures.failures).toBe(one.funnel.points.find((p) => p.code === 'BOI')!.failures);
  });

  it('technicians, warranty clerks and accountants do not read reliability', async () => {
    for (const email of ['tech@demo.busbar.test', 'warranty@demo.busbar.test', 'accountant@demo.busbar.test']) {
      const agent = await h.signedIn(email);
      await agent.get('/api/reliability').expect(403);
      await agent.get('/api/reliability/category/inverter').expect(403);
    }
    await (await h.agent()).get('/api/reliability').expect(401);
  });
});

describe('reliability queries are checked', () => {
  it('refuses what it cannot read, naming the field', async () => {
    const owner = await h.signedIn('owner@demo.busbar.test');
    const refused = [
      '/api/reliability?groupBy=shop',
      '/api/reliability?from=2026-13',
      '/api/reliability?from=2026-05&to=2026-01',
      '/api/reliability?locationIds=1,abc',
      '/api/reliability?colour=red',
      '/api/reliability/category/toaster',
      '/api/reliability/item/abc',
      '/api/reliability/shop/1',
    ];
    for (const path of refused) {
      const res = await owner.get(path);
      expect(res.status, path).toBe(400);
      expect(JSON.stringify(res.body), path).not.toMatch(/invalid_|Expected|received/);
    }
    expect((await owner.get('/api/reliability?from=2026-05&to=2026-01')).body.error.fields).toEqual({ to: 'Pick a month on or after the first' });
    await owner.get('/api/reliability/item/999999').expect(404);
    await owner.get('/api/reliability/vendor/999999').expect(404);
  });

  it('counts only units installed in the months asked for', async () => {
    const owner = await h.signedIn('owner@demo.busbar.test');
    const whole = (await owner.get('/api/reliability?groupBy=category').expect(200)).body as ReliabilityList;
    const first = (await owner.get('/api/reliability?groupBy=category&to=2025-06').expect(200)).body as ReliabilityList;
    const rest = (await owner.get('/api/reliability?groupBy=category&from=2025-07').expect(200)).body as ReliabilityList;
    for (const row of whole.rows) {
      const parts = [first, rest].map((list) => list.rows.find((r) => r.key === row.key));
      expect(parts.reduce((sum, r) => sum + (r?.units ?? 0), 0)).toBe(row.units);
      expect(parts.reduce((sum, r) => sum + (r?.failures ?? 0), 0)).toBe(row.failures);
      expect(parts.reduce((sum, r) => sum + (r?.unitMonths ?? 0), 0)).toBeCloseTo(row.unitMonths, 6);
    }
  });
});
