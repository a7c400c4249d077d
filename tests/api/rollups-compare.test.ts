import { funnelLimits } from '@busbar/calc';
import type { LocationComparison, Rollups } from '@busbar/shared';
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
const A_YEAR = '/api/rollups/locations?from=2025-06&to=2026-05';
const comparisonOf = async (email: string, path = A_YEAR) => (await (await h.signedIn(email)).get(path).expect(200)).body as LocationComparison;
const idsOf = (codes: string[]) => codes.map((c) => ids.location(c)).sort((a, b) => a - b);
const locationsIn = (answer: LocationComparison) => answer.locations.map((l) => l.locationId).sort((a, b) => a - b);

describe('comparing locations', () => {
  // June to May is read as a month, three quarters and two months; a calendar year as one year.
  it.each([
    ['2025-06', '2026-05', '2026-05-31'],
    ['2025-01', '2025-12', '2025-12-31'],
  ])("sums each location's months from %s to %s as the monthly roll-ups do, and takes each median over every location", async (from, to, lastDay) => {
    const owner = await comparisonOf('owner@demo.busbar.test', `/api/rollups/locations?from=${from}&to=${to}`);
    const months = (await (await h.signedIn('owner@demo.busbar.test')).get(`/api/rollups?from=${from}-01&to=${lastDay}&grain=month`).expect(200)).body as Rollups;
    const asked = new Set(months.periods.map((p) => p.period));
    expect(owner.comparedLocations).toBe(8);
    for (const location of owner.locations) {
      const rows = months.rows.filter((r) => r.locationId === location.locationId && asked.has(r.period));
      const delivered = rows.reduce((n, r) => n + r.buildsDelivered, 0);
      const revenue = rows.reduce((n, r) => n + r.revenueCents!, 0);
      const claims = rows.reduce((n, r) => n + r.claimsOpened, 0);
      expect(location.figures.buildsDelivered).toBe(delivered);
      expect(location.figures.revenueCents).toBe(revenue);
      expect(location.figures.averageTicketCents).toBe(Math.round(revenue / delivered));
      expect(location.figures.claimsPer100Builds).toBeCloseTo((claims * 100) / delivered, 9);
      expect(location.figures.grossMarginShare).toBeCloseTo(rows.reduce((n, r) => n + r.grossMarginCents!, 0) / revenue, 9);
    }
    // A median has as many locations at or below it as at or above it.
    for (const field of ['buildsDelivered', 'averageTicketCents', 'claimsPer100Builds', 'laborHoursPerBuild'] as const) {
      const values = owner.locations.map((l) => l.figures[field]!);
      const middle = owner.median[field]!;
      expect(values.filter((v) => v <= middle).length).toBeGreaterThanOrEqual(4);
      expect(values.filter((v) => v >= middle).length).toBeGreaterThanOrEqual(4);
    }
  });

  it("marks Austin's claims per 100 builds above the network's funnel, and no shop inside it", async () => {
    const owner = await comparisonOf('owner@demo.busbar.test');
    const all = owner.locations;
    const delivered = all.reduce((n, l) => n + l.figures.buildsDelivered, 0);
    const rate = all.reduce((n, l) => n + l.figures.claimsOpened, 0) / delivered;
    for (const location of all) {
      const { upper, lower } = funnelLimits(rate, location.figures.buildsDelivered, { confidence: 0.998 });
      const own = location.figures.claimsOpened / location.figures.buildsDelivered;
      const side = own > upper ? 'high' : own < lower ? 'low' : undefined;
      expect(location.outliers.claimsPer100Builds).toBe(side);
    }
    expect(all.find((l) => l.locationId === ids.location('AUS'))!.outliers.claimsPer100Builds).toBe('high');
  });

  it('gives a regional manager their region and a lead their shop alone, both beside the whole network', async () => {
    const owner = await comparisonOf('owner@demo.busbar.test');
    const west = await comparisonOf('regional@demo.busbar.test');
    expect(locationsIn(west)).toEqual(idsOf(WEST));
    expect(west.median).toEqual(owner.median);
    expect(west.locations).toEqual(owner.locations.filter((l) => idsOf(WEST).includes(l.locationId)));
    const lead = await comparisonOf('lead@demo.busbar.test');
    expect(locationsIn(lead)).toEqual([ids.location('DEN')]);
    expect(lead.median).toEqual(owner.median);
    expect(lead.comparedLocations).toBe(8);
    const text = JSON.stringify(lead);
    for (const other of ids.locations.filter((l) => l.code !== 'DEN')) expect(text).not.toMatch(new RegExp(`"locationId":${other.id}\\b`));
  });

  it('refuses people who read no figures, and months that are not months', async () => {
    for (const email of ['tech@demo.busbar.test', 'warranty@demo.busbar.test']) {
      expect((await (await h.signedIn(email)).get(A_YEAR).expect(403)).body.error.message).toBe('You cannot read the figures of any location');
    }
    const owner = await h.signedIn('owner@demo.busbar.test');
    const bad = await owner.get('/api/rollups/locations?from=2026-13&to=2026-05').expect(400);
    expect(bad.body.error.fields.from).toBe('Use a month like 2026-03');
    const long = await owner.get('/api/rollups/locations?from=2020-01&to=2026-05').expect(400);
    expect(long.body.error.fields.to).toBe('Pick at most 36 months');
    const backwards = await owner.get('/api/rollups/locations?from=2026-05&to=2026-01').expect(400);
    expect(backwards.body.error.fields.to).toBe('Pick an end on or after the start');
  });
});
