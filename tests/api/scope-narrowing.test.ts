import type { LocationComparison, Rollups } from '@busbar/shared';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { demoIds, startHarness, type Agent, type Harness } from '../support/api-harness.ts';
import { SIGN_INS } from '../support/staff-fixtures.ts';

/**
 * The scope chosen in the header reaches the API as `regionId` (or `locationId`): every list and
 * figure keeps to the shops of that region the person may see, and never widens what they see.
 */
let h: Harness;
let ids: Awaited<ReturnType<typeof demoIds>>;
let owner: Agent;
let lead: Agent;
beforeAll(async () => {
  h = await startHarness({}, true, { history: true });
  ids = await demoIds(h.db);
  owner = await h.signedIn(SIGN_INS.owner);
  lead = await h.signedIn(SIGN_INS.lead);
  // The demo's history holds no quick plans: one at a shop of each region.
  const input = { systemV: 12, gauge: 'awg', loads: [{ name: 'LED lights', watts: 10, hoursPerDay: 4 }], starterBattery: { capacityAh: 70 }, trip: { daysParked: 2, daysDriving: 1, driveHoursPerDay: 3 }, circuits: [] };
  for (const code of ['DEN', 'AVL']) await owner.post('/api/plans').send({ locationId: ids.location(code), name: `Weekend at ${code}`, input }).expect(201);
}, 60_000);
afterAll(() => h.close());

const LISTS = ['/api/builds', '/api/claims', '/api/customers', '/api/plans'] as const;
const regionOf = (locationId: number) => ids.locations.find((l) => l.id === locationId)!.regionId;
const shopsOf = (regionId: number) => ids.locations.filter((l) => l.regionId === regionId).map((l) => l.id);

async function page(agent: Agent, list: string, query: string) {
  const res = await agent.get(`${list}?pageSize=100&${query}`);
  expect(res.status, `${list}?${query}`).toBe(200);
  return res.body as { total: number; items: { locationId: number }[] };
}

describe('a list narrowed to a region', () => {
  it('holds only that region’s shops, and the regions together hold the whole list', async () => {
    const regionIds = ids.regions.map((r) => r.id);
    expect(regionIds.length).toBeGreaterThan(1);
    for (const list of LISTS) {
      const all = await page(owner, list, '');
      expect(all.total, list).toBeGreaterThan(0);
      let sum = 0;
      for (const regionId of regionIds) {
        const narrowed = await page(owner, list, `regionId=${regionId}`);
        for (const item of narrowed.items) expect(regionOf(item.locationId), list).toBe(regionId);
        sum += narrowed.total;
      }
      expect(sum, list).toBe(all.total);
    }
  });

  it('holds nothing for a shop outside the region, and answers a region that is not a number in words', async () => {
    const den = ids.location('DEN');
    const elsewhere = ids.regions.find((r) => r.id !== regionOf(den))!.id;
    for (const list of LISTS) expect((await page(owner, list, `locationId=${den}&regionId=${elsewhere}`)).total, list).toBe(0);
    const bad = await owner.get('/api/builds?regionId=east');
    expect(bad.status).toBe(400);
    expect(JSON.stringify(bad.body)).not.toMatch(/expected|NaN/i);
  });

  it('never widens a lead’s list: another region holds nothing, their own region only their shop', async () => {
    const den = ids.location('DEN');
    const elsewhere = ids.regions.find((r) => r.id !== regionOf(den))!.id;
    for (const list of LISTS) {
      expect((await page(lead, list, `regionId=${elsewhere}`)).total, list).toBe(0);
      const own = await page(lead, list, `regionId=${regionOf(den)}`);
      expect(own.total, list).toBe((await page(lead, list, '')).total);
      for (const item of own.items) expect(item.locationId, list).toBe(den);
    }
  });
});

describe('figures narrowed to a region or a shop', () => {
  const months = 'from=2025-07-01&to=2026-06-30&grain=month';

  it('roll-ups keep to the region’s shops and the region, beside the unchanged network', async () => {
    const regionId = regionOf(ids.location('DEN'));
    const all = (await owner.get(`/api/rollups?${months}`).expect(200)).body as Rollups;
    const narrowed = (await owner.get(`/api/rollups?${months}&regionId=${regionId}`).expect(200)).body as Rollups;
    expect(narrowed.rows.length).toBeGreaterThan(0);
    expect(new Set(narrowed.rows.map((r) => r.locationId))).toEqual(new Set(all.rows.filter((r) => shopsOf(regionId).includes(r.locationId)).map((r) => r.locationId)));
    expect(narrowed.regions.map((r) => r.regionId)).toEqual(narrowed.regions.map(() => regionId));
    expect(narrowed.network).toEqual(all.network);
  });

  it('the comparison lists the one shop asked for, against the same network medians', async () => {
    const avl = ids.location('AVL');
    const all = (await owner.get('/api/rollups/locations?from=2025-07&to=2026-06').expect(200)).body as LocationComparison;
    const one = (await owner.get(`/api/rollups/locations?from=2025-07&to=2026-06&locationId=${avl}`).expect(200)).body as LocationComparison;
    expect(one.locations.map((l) => l.locationId)).toEqual([avl]);
    expect(one.locations[0]).toEqual(all.locations.find((l) => l.locationId === avl));
    expect(one.median).toEqual(all.median);
  });

  it('refuses a lead the figures of another shop or region, in words', async () => {
    const den = ids.location('DEN');
    const elsewhere = ids.regions.find((r) => r.id !== regionOf(den))!.id;
    for (const path of [`/api/rollups?${months}&regionId=${elsewhere}`, `/api/rollups/locations?from=2025-07&to=2026-06&locationId=${ids.location('AVL')}`]) {
      const res = await lead.get(path);
      expect(res.status, path).toBe(403);
      expect(res.body.error.message).toBe('You cannot read the figures of that shop or region');
    }
    const own = (await lead.get(`/api/rollups?${months}&regionId=${regionOf(den)}`).expect(200)).body as Rollups;
    expect(new Set(own.rows.map((r) => r.locationId))).toEqual(new Set([den]));
  });
});
