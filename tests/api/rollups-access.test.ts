import { isoDay, localDay } from '@busbar/calc';
import type { Rollups } from '@busbar/shared';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { loadViewer } from '../../apps/api/src/access/viewer.ts';
import { checkAnswerSize, moneyScopes, rollupReport } from '../../apps/api/src/queries/rollups-report.ts';
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
const YEAR_BY_MONTH = '/api/rollups?from=2025-07-01&to=2026-06-30&grain=month';
const MONEY = ['revenueCents', 'partsCostCents', 'grossMarginCents', 'averageTicketCents', 'warrantyCostCents', 'warrantyCostShare', 'vendorCreditsReceivedCents'];

async function rollupsOf(email: string, path = YEAR_BY_MONTH): Promise<Rollups> {
  return (await (await h.signedIn(email)).get(path).expect(200)).body as Rollups;
}
const locationsIn = (answer: Rollups) => [...new Set(answer.rows.map((r) => r.locationId))].sort((a, b) => a - b);
const idsOf = (codes: string[]) => codes.map((c) => ids.location(c)).sort((a, b) => a - b);

describe('who reads the roll-ups', () => {
  it('the owner and a network accountant read every location, both regions and the network, with money', async () => {
    const owner = await rollupsOf('owner@demo.busbar.test');
    expect(locationsIn(owner)).toEqual(idsOf([...WEST, ...EAST]));
    expect([...new Set(owner.regions.map((r) => r.regionId))].sort()).toEqual([ids.region('WEST'), ids.region('EAST')].sort());
    expect(owner.periods).toHaveLength(12);
    for (const field of MONEY) expect(owner.rows[0]).toHaveProperty(field);
    expect(await rollupsOf('accountant@demo.busbar.test')).toEqual(owner);
    // The network is the sum of its locations.
    const may = owner.network.find((n) => n.period === '2026-05')!;
    const shops = owner.rows.filter((r) => r.period === '2026-05');
    expect(may.buildsDelivered).toBe(shops.reduce((sum, r) => sum + r.buildsDelivered, 0));
    expect(may.revenueCents).toBe(shops.reduce((sum, r) => sum + r.revenueCents!, 0));
  });

  it("a regional manager reads their region's locations and region, and the whole network's totals", async () => {
    const owner = await rollupsOf('owner@demo.busbar.test');
    const west = await rollupsOf('regional@demo.busbar.test');
    expect(locationsIn(west)).toEqual(idsOf(WEST));
    expect(west.regions.map((r) => r.regionId)).toEqual(west.regions.map(() => ids.region('WEST')));
    expect(west.rows).toEqual(owner.rows.filter((r) => idsOf(WEST).includes(r.locationId)));
    expect(west.network).toEqual(owner.network);
    const region = west.regions.find((r) => r.period === '2026-05')!;
    expect(region.buildsDelivered).toBe(west.rows.filter((r) => r.period === '2026-05').reduce((sum, r) => sum + r.buildsDelivered, 0));
    for (const field of MONEY) expect(west.rows[0]).toHaveProperty(field);
  });

  it("a lead reads their shop and the network's totals, and never another shop's id, nor any region", async () => {
    const owner = await rollupsOf('owner@demo.busbar.test');
    const lead = await rollupsOf('lead@demo.busbar.test');
    const den = ids.location('DEN');
    expect(locationsIn(lead)).toEqual([den]);
    expect(lead.rows).toEqual(owner.rows.filter((r) => r.locationId === den));
    expect(lead.network).toEqual(owner.network);
    expect(lead.regions).toEqual([]);
    for (const field of MONEY) expect(lead.rows[0]).toHaveProperty(field);
    const text = JSON.stringify(lead);
    expect(text.match(/"locationId":\d+/g)!.every((m) => m === `"locationId":${den}`)).toBe(true);
    for (const name of ['Boise', 'Austin', 'Portland', 'Asheville', 'Denver']) expect(text).not.toContain(name);
    // Asheville's lead reads Asheville, never Denver.
    expect(locationsIn(await rollupsOf('lead2@demo.busbar.test'))).toEqual([ids.location('AVL')]);
  });

  it("sums each person's rows by period, and leaves the rows out when asked for none", async () => {
    const asked: [email: string, path: string][] = [
      ['owner@demo.busbar.test', YEAR_BY_MONTH],
      ['regional@demo.busbar.test', YEAR_BY_MONTH],
      ['lead@demo.busbar.test', YEAR_BY_MONTH],
      ['owner@demo.busbar.test', `${YEAR_BY_MONTH}&locationId=${ids.location('AUS')}`],
    ];
    for (const [email, path] of asked) {
      const each = await rollupsOf(email, path);
      expect(each.rows.length).toBeGreaterThan(0);
      for (const period of new Set(each.rows.map((r) => r.period))) {
        const rows = each.rows.filter((r) => r.period === period);
        const sums = each.scope.find((s) => s.period === period)!;
        const total = (field: 'buildsDelivered' | 'claimsOpened' | 'revenueCents' | 'partsCostCents') => rows.reduce((sum, r) => sum + r[field]!, 0);
        expect([sums.buildsDelivered, sums.claimsOpened, sums.revenueCents, sums.partsCostCents]).toEqual([
          total('buildsDelivered'),
          total('claimsOpened'),
          total('revenueCents'),
          total('partsCostCents'),
        ]);
      }
      expect(each.scope.map((s) => s.period).sort()).toEqual([...new Set(each.rows.map((r) => r.period))].sort());
      expect(await rollupsOf(email, `${path}&rows=none`)).toEqual({ ...each, rows: [], locationIds: [] });
    }
  });

  it('gives the rows a page of shops at a time, by id, with the sums of every shop of the person on each page', async () => {
    const whole = await rollupsOf('owner@demo.busbar.test');
    const everyShop = idsOf([...WEST, ...EAST]);
    expect(whole).toMatchObject({ page: 1, pageSize: 25, total: 8, locationIds: everyShop });
    const pages = await Promise.all([1, 2, 3, 4].map((page) => rollupsOf('owner@demo.busbar.test', `${YEAR_BY_MONTH}&pageSize=3&page=${page}`)));
    expect(pages.map((p) => p.locationIds)).toEqual([everyShop.slice(0, 3), everyShop.slice(3, 6), everyShop.slice(6), []]);
    for (const page of pages) {
      expect(page).toMatchObject({ pageSize: 3, total: 8, scope: whole.scope, regions: whole.regions, network: whole.network });
      expect(page.rows).toEqual(whole.rows.filter((r) => page.locationIds.includes(r.locationId)));
    }
    // A lead's one shop: the second page holds no shop, and still no other shop's figures.
    const lead = await rollupsOf('lead@demo.busbar.test', `${YEAR_BY_MONTH}&pageSize=1&page=2`);
    expect(lead).toMatchObject({ total: 1, locationIds: [], rows: [] });
    expect(lead.scope).toEqual((await rollupsOf('lead@demo.busbar.test')).scope);
  });

  it('refuses a page of more than 50 shops, in words', async () => {
    const owner = await h.signedIn('owner@demo.busbar.test');
    await owner.get(`${YEAR_BY_MONTH}&pageSize=50`).expect(200);
    const res = await owner.get(`${YEAR_BY_MONTH}&pageSize=51`).expect(400);
    expect(res.body.error.fields).toEqual({ pageSize: 'At most 50 shops per page' });
    expect((await owner.get(`${YEAR_BY_MONTH}&pageSize=0`).expect(400)).body.error.fields).toEqual({ pageSize: 'At least 1 shop per page' });
  });

  it('technicians and warranty clerks read no roll-ups', async () => {
    for (const email of ['tech@demo.busbar.test', 'warranty@demo.busbar.test']) {
      const res = await (await h.signedIn(email)).get(YEAR_BY_MONTH).expect(403);
      expect(res.body.error.message).toBe('You cannot read the figures of any location');
      expect(JSON.stringify(res.body)).not.toContain('revenueCents');
    }
    await (await h.agent()).get(YEAR_BY_MONTH).expect(401);
  });

  it('leaves out the money a person may not read where the figures come from', async () => {
    const query = { from: '2026-01-01', to: '2026-03-31', grain: 'month' as const };
    const scope = [ids.location('DEN')];
    const asTech = await rollupReport(h.db, query, scope, moneyScopes((await loadViewer(h.db, ids.user('tech@demo.busbar.test')))!));
    // A technician reads prices but not costs; a warranty clerk neither.
    expect(asTech.rows.length).toBeGreaterThan(0);
    for (const row of [...asTech.rows, ...asTech.network]) {
      expect(row).toHaveProperty('revenueCents');
      expect(row).not.toHaveProperty('partsCostCents');
      expect(row).not.toHaveProperty('grossMarginCents');
    }
    const asClerk = await rollupReport(h.db, query, scope, moneyScopes((await loadViewer(h.db, ids.user('warranty@demo.busbar.test')))!));
    for (const row of [...asClerk.rows, ...asClerk.network]) {
      for (const field of MONEY) expect(row).not.toHaveProperty(field);
      expect(row.buildsDelivered).toBeGreaterThanOrEqual(0);
    }
    const asLead = await rollupReport(h.db, query, scope, moneyScopes((await loadViewer(h.db, ids.user('lead@demo.busbar.test')))!));
    for (const row of asLead.rows) expect(row.partsCostCents).toEqual(expect.any(Number));
  });

  it('leaves out costs row by row where a person reads them at one shop only', async () => {
    const [den, avl] = [ids.location('DEN'), ids.location('AVL')];
    const report = await rollupReport(h.db, { from: '2026-01-01', to: '2026-03-31', grain: 'month' }, 'all', { prices: 'all', costs: [den] });
    const at = (id: number) => report.rows.filter((row) => row.locationId === id);
    expect(at(den).length).toBeGreaterThan(0);
    expect(at(avl).length).toBeGreaterThan(0);
    for (const row of at(den)) expect(row.grossMarginCents).toBe(row.revenueCents! - row.partsCostCents!);
    for (const row of report.rows.filter((r) => r.locationId !== den)) expect(row).not.toHaveProperty('partsCostCents');
    // A region or the network is more than the one shop: its costs are not shown.
    for (const row of [...report.regions, ...report.network]) {
      expect(row).toHaveProperty('revenueCents');
      expect(row).not.toHaveProperty('partsCostCents');
      expect(row).not.toHaveProperty('grossMarginCents');
    }
  });
});

describe('asking for roll-ups', () => {
  const ask = async (query: string) => (await (await h.signedIn('owner@demo.busbar.test')).get(`/api/rollups?${query}`).expect(400)).body.error;

  it('answers a missing or wrong field in plain words, naming it', async () => {
    expect((await ask('from=2026-01-01&to=2026-02-01')).fields.grain).toBe('Pick day, week, month, quarter or year');
    expect((await ask('from=2026-01-01&to=2026-02-01&grain=month&rows=some')).fields.rows).toBe('Pick each or none');
    expect((await ask('from=2026-01-01&to=2026-02-01&grain=fortnight')).fields.grain).toBe('Pick day, week, month, quarter or year');
    expect((await ask('from=2026-02-30&to=2026-03-01&grain=day')).fields.from).toBe('Use a date like 2026-03-31');
    expect((await ask('to=2026-03-01&grain=day')).fields.from).toBe('Use a date like 2026-03-31');
    expect((await ask('from=2026-03-01&to=2026-02-01&grain=day')).fields.to).toBe('Pick an end on or after the start');
    expect((await ask('from=2026-01-01&to=2026-02-01&grain=day&shop=3')).fields.shop).toBe('Unknown field');
    expect((await ask('from=2026-01-01&to=2026-02-01&grain=day&regionId=east')).fields.regionId).toBe('Use an id: a whole number above 0');
  });

  it('caps a request at 400 periods', async () => {
    await (await h.signedIn('owner@demo.busbar.test')).get('/api/rollups?from=2025-01-01&to=2026-02-04&grain=day').expect(200);
    const error = await ask('from=2025-01-01&to=2026-02-05&grain=day');
    expect(error.fields.to).toBe('Pick at most 400 periods: a shorter range or a longer period');
    // The same range by week is 58 periods.
    await (await h.signedIn('owner@demo.busbar.test')).get('/api/rollups?from=2025-01-01&to=2026-02-05&grain=week').expect(200);
  });

  it('refuses more than 25,000 location-periods in one answer, in words', () => {
    // A year by week for 200 locations: 52 weeks, the one before, and 52 a year before.
    expect(() => checkAnswerSize(200, 105)).not.toThrow();
    expect(() => checkAnswerSize(200, 731)).toThrow('That is 731 periods (with those compared) for each of 200 locations: pick a shorter range or a longer period');
  });
});

describe("the demo's history", () => {
  it("stores each delivery's and each claim's day at its shop, which the roll-ups count on", async () => {
    const zones = new Map((await h.db.selectFrom('locations').select(['id', 'timeZone']).execute()).map((l) => [l.id, l.timeZone]));
    const local = (locationId: number, at: string) => isoDay(localDay(zones.get(locationId)!, Date.parse(at)));
    const builds = await h.db.selectFrom('builds').select(['locationId', 'deliveredAt', 'deliveredOn']).where('deliveredAt', 'is not', null).execute();
    expect(builds.length).toBeGreaterThan(1_000);
    expect(builds.filter((b) => b.deliveredOn !== local(b.locationId, b.deliveredAt!))).toEqual([]);
    const claims = await h.db.selectFrom('warrantyClaims').select(['locationId', 'createdAt', 'loggedOn']).execute();
    expect(claims.length).toBeGreaterThan(50);
    expect(claims.filter((c) => c.loggedOn !== local(c.locationId, c.createdAt))).toEqual([]);
  });
});
