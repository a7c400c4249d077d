import type { BuildDetail, ClaimDetail, RollupGrain, Rollups } from '@busbar/shared';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { demoIds, startHarness, type Agent, type Harness } from '../support/api-harness.ts';
import { addParts, createBuild, moveThrough } from '../support/build-fixtures.ts';
import { direct, expectedFigures, noDirect, type Direct } from '../support/rollup-direct.ts';

/**
 * A hand-made network built through the API at chosen moments: deliveries a minute either side of
 * local midnight in Denver (UTC−7 in winter) and Asheville (UTC−5), an imported one, in the ISO week
 * that runs from Monday 2025-12-29 to Sunday 2026-01-04, and claims logged late in the evening.
 */
let h: Harness;
let ids: Awaited<ReturnType<typeof demoIds>>;
let agents: Record<'den' | 'avl' | 'warranty', Agent>;
let parts: Awaited<ReturnType<typeof addParts>>;
beforeAll(async () => {
  h = await startHarness();
  ids = await demoIds(h.db);
  agents = { den: await h.signedIn('lead@demo.busbar.test'), avl: await h.signedIn('lead2@demo.busbar.test'), warranty: await h.signedIn('warranty@demo.busbar.test') };
  parts = await addParts(h.db);
  await handMadeNetwork();
});
afterAll(() => h.close());

async function technicianAt(code: string): Promise<number> {
  const row = await h.db.selectFrom('roleAssignments').select('userId').where('role', '=', 'technician').where('locationId', '=', ids.location(code)).executeTakeFirstOrThrow();
  return row.userId;
}

let serial = 0;
/** A build at a shop with a fuse block (and a charger when asked), booked for `bookedFor`, delivered at `deliveredAt` (UTC) unless null. */
async function build(code: 'DEN' | 'AVL', bookedFor: string, deliveredAt: string | null, options: { charger?: boolean; laborHours?: number; cancel?: boolean } = {}) {
  const agent = code === 'DEN' ? agents.den : agents.avl;
  h.clock.now = new Date(Date.parse(`${bookedFor}T15:00:00Z`) - 3 * 86_400_000);
  let detail = await createBuild(h.db, agent, ids.location(code), { leadTechnicianId: await technicianAt(code), bookedFor, laborHours: options.laborHours ?? 2.5 });
  const lines = [{ catalogItemId: parts.fuse.id, quantity: 2, serialNumber: null as string | null }];
  if (options.charger) lines.push({ catalogItemId: parts.charger.id, quantity: 1, serialNumber: `RU-${++serial}` });
  for (const line of lines) {
    const res = await agent.post(`/api/builds/${detail.id}/items`).send({ version: detail.version, ...line });
    expect(res.status).toBe(201);
    detail = res.body as BuildDetail;
  }
  detail = await moveThrough(agent, detail, ['quoted', 'booked']);
  if (options.cancel) return moveThrough(agent, detail, ['cancelled']);
  if (deliveredAt === null) return detail;
  detail = await moveThrough(agent, detail, ['in_bay', 'quality_check']);
  h.clock.now = new Date(deliveredAt);
  return moveThrough(agent, detail, ['delivered']);
}

/** A claim logged at `at` (UTC) by the shop's clerk or lead, for a failure on `failedOn` (the shop's day). */
async function claim(agent: Agent, detail: BuildDetail, at: string, failedOn: string, body: { laborHours: number; creditRequestedCents: number }) {
  h.clock.now = new Date(at);
  const unit = detail.items.find((i) => i.catalogItemId === parts.charger.id)!;
  const res = await agent.post('/api/claims').send({ buildItemId: unit.id, failedOn, failureMode: 'will_not_charge', coverage: 'vendor_defect', symptoms: 'No output', ...body });
  expect(res.status).toBe(201);
  return res.body as ClaimDetail;
}

async function handMadeNetwork() {
  // Denver, winter: local midnight is 07:00 UTC.
  const a = await build('DEN', '2025-12-30', '2025-12-31T06:59:00.000Z', { charger: true, laborHours: 3.25 }); // Tuesday 30th, 23:59
  await build('DEN', '2025-12-31', '2025-12-31T07:01:00.000Z'); // Wednesday 31st, 00:01
  await build('DEN', '2026-01-04', '2026-01-04T23:00:00.000Z', { laborHours: 4 }); // Sunday, last day of the week
  await build('DEN', '2026-01-05', '2026-01-05T08:00:00.000Z'); // Monday: the next week
  await build('DEN', '2024-12-31', '2024-12-31T18:00:00.000Z', { charger: true }); // a year before
  await build('DEN', '2026-01-02', null); // booked, not yet delivered
  await build('DEN', '2026-01-03', null, { cancel: true }); // booked, then cancelled: counts nowhere
  // An imported delivery is stamped 17:00 at the shop: for Denver in winter, midnight UTC of the next day.
  const header = 'customer_name,customer_email,vehicle_year,vehicle_body_style,vehicle_make,vehicle_model,status,booked_for,delivered_on,lead_technician_email,labor_hours,items';
  const row = `Orla Fenwick,orla@example.test,2019,van,Alder,Trekker,delivered,2025-12-29,2025-12-30,,2,${parts.fuse.sku} x1`;
  const imported = await agents.den.post('/api/imports/builds').send({ locationId: ids.location('DEN'), csv: `${header}\r\n${row}`, dryRun: false });
  expect(imported.body).toMatchObject({ ok: true, created: 1 });
  // Asheville, winter: local midnight is 05:00 UTC; the first is in 2026 in UTC, in 2025 at the shop.
  const c = await build('AVL', '2025-12-31', '2026-01-01T04:59:00.000Z', { charger: true }); // Wednesday 31st, 23:59
  await build('AVL', '2026-01-01', '2026-01-01T05:01:00.000Z'); // Thursday 1st, 00:01
  // Claims logged late in the local evening: the day at the shop, the next day in UTC.
  const den = await claim(agents.warranty, a, '2026-01-02T06:30:00.000Z', '2026-01-01', { laborHours: 1.5, creditRequestedCents: 20_000 }); // Denver, 1 January 23:30
  await claim(agents.avl, c, '2026-01-02T04:30:00.000Z', '2026-01-01', { laborHours: 0.5, creditRequestedCents: 0 }); // Asheville, 1 January 23:30
  // The Denver claim's credit comes in: the cost asked and received is no longer a cost.
  await h.db.updateTable('warrantyClaims').set({ creditReceivedCents: 15_000 }).where('id', '=', den.id).execute();
  h.clock.now = new Date('2026-01-20T15:00:00Z');
}

/** Figures with every number rounded to 9 places, so sums of hours compare however they were added. */
const rounded = (figures: object) => JSON.parse(JSON.stringify(figures), (_, v) => (typeof v === 'number' ? Math.round(v * 1e9) / 1e9 : v));

async function rollups(grain: RollupGrain, from: string, to: string): Promise<Rollups> {
  return (await (await h.signedIn('owner@demo.busbar.test')).get(`/api/rollups?from=${from}&to=${to}&grain=${grain}`).expect(200)).body as Rollups;
}

describe('roll-up figures', () => {
  it.each(['day', 'week', 'month', 'quarter', 'year'] as const)('by %s equal a direct computation from the base rows, per location and for the network', async (grain) => {
    const answer = await rollups(grain, '2025-12-01', '2026-01-31');
    const expected = await direct(h.db, grain);
    const keys = new Set(answer.periods.flatMap((p) => [p.period, p.previous, p.lastYear]));
    const wanted = [...expected].filter(([key]) => keys.has(key.split(' ')[1]!)).map(([key, d]) => ({ locationId: Number(key.split(' ')[0]), period: key.split(' ')[1]!, ...expectedFigures(d) }));
    const order = (rows: { period: string; locationId: number }[]) => [...rows].sort((a, b) => a.period.localeCompare(b.period) || a.locationId - b.locationId);
    expect(rounded(order(answer.rows))).toEqual(rounded(order(wanted)));
    const network = new Map<string, Direct>();
    for (const [key, d] of expected) {
      const period = key.split(' ')[1]!;
      if (!keys.has(period)) continue;
      const sum = network.get(period) ?? noDirect();
      for (const f of ['delivered', 'booked', 'revenue', 'cost', 'labor', 'claims', 'warranty', 'credits'] as const) sum[f] += d[f];
      for (const [c, n] of Object.entries(d.mix)) sum.mix[c] = (sum.mix[c] ?? 0) + n;
      network.set(period, sum);
    }
    const wantedNetwork = [...network].map(([period, d]) => ({ period, ...expectedFigures(d) })).sort((a, b) => a.period.localeCompare(b.period));
    expect(rounded([...answer.network].sort((a, b) => a.period.localeCompare(b.period)))).toEqual(rounded(wantedNetwork));
  });

  it('cuts days at local midnight: a minute either side falls on different days, months and years', async () => {
    const [den, avl] = [ids.location('DEN'), ids.location('AVL')];
    const byDay = await rollups('day', '2025-12-30', '2026-01-01');
    const delivered = (locationId: number, period: string) => byDay.rows.find((r) => r.locationId === locationId && r.period === period)?.buildsDelivered ?? 0;
    // Denver's 30th: the delivery at 23:59 and the imported one (00:00 UTC on the 31st); the 31st: the one at 00:01.
    expect([delivered(den, '2025-12-30'), delivered(den, '2025-12-31')]).toEqual([2, 1]);
    expect([delivered(avl, '2025-12-31'), delivered(avl, '2026-01-01')]).toEqual([1, 1]);
    // Asheville's delivery at 04:59 UTC on 1 January was on 31 December at the shop: 2025's, not 2026's.
    const byYear = await rollups('year', '2026-01-01', '2026-01-01');
    expect(byYear.rows.find((r) => r.locationId === avl && r.period === '2025')).toMatchObject({ buildsDelivered: 1, jobMix: { dc_dc_charger: 1, fuse_block: 1 } });
    expect(byYear.rows.find((r) => r.locationId === avl && r.period === '2026')).toMatchObject({ buildsDelivered: 1, claimsOpened: 1, jobMix: { fuse_block: 1 } });
    // Both claims were logged at 23:30 on 1 January at their shops, 2 January in UTC.
    const claims = byDay.network.find((n) => n.period === '2026-01-01')!;
    expect(claims.claimsOpened).toBe(2);
  });

  it('keeps a week that crosses the new year whole, Monday to Sunday, beside the week before and the same week a year before', async () => {
    const byWeek = await rollups('week', '2025-12-31', '2026-01-06');
    expect(byWeek.periods).toEqual([
      { period: '2025-12-29', start: '2025-12-29', end: '2026-01-04', previous: '2025-12-22', lastYear: '2024-12-30' },
      { period: '2026-01-05', start: '2026-01-05', end: '2026-01-11', previous: '2025-12-29', lastYear: '2025-01-06' },
    ]);
    const week = (locationId: number, period: string) => byWeek.rows.find((r) => r.locationId === locationId && r.period === period);
    // Denver: Tuesday 23:59, the import of Tuesday, Wednesday 00:01 and Sunday; Asheville: Wednesday and Thursday.
    expect(week(ids.location('DEN'), '2025-12-29')).toMatchObject({ buildsDelivered: 4, laborHours: 11.75, laborHoursPerBuild: 2.9375, claimsOpened: 1 });
    expect(week(ids.location('AVL'), '2025-12-29')).toMatchObject({ buildsDelivered: 2, claimsOpened: 1, claimsPer100Builds: 50 });
    expect(week(ids.location('DEN'), '2026-01-05')).toMatchObject({ buildsDelivered: 1 });
    // The same week a year before holds Denver's delivery of 31 December 2024.
    expect(week(ids.location('DEN'), '2024-12-30')).toMatchObject({ buildsDelivered: 1, buildsBooked: 1 });
    expect(byWeek.network.find((n) => n.period === '2025-12-29')).toMatchObject({ buildsDelivered: 6, claimsOpened: 2 });
  });

  it('counts bookings on their booked day unless cancelled, and the warranty cost as claim labor plus credit not received', async () => {
    const den = (await rollups('month', '2026-01-01', '2026-01-31')).rows.find((r) => r.locationId === ids.location('DEN') && r.period === '2026-01')!;
    // Booked for 2, 4 and 5 January (3 January was cancelled).
    expect(den.buildsBooked).toBe(3);
    const rate = (await h.db.selectFrom('locations').select('laborRateCents').where('code', '=', 'DEN').executeTakeFirstOrThrow()).laborRateCents;
    expect(den.warrantyCostCents).toBe(Math.round(1.5 * rate) + 5_000);
    expect(den.vendorCreditsReceivedCents).toBe(15_000);
    expect(den.warrantyCostShare).toBeCloseTo(den.warrantyCostCents! / den.revenueCents!, 12);
  });
});
