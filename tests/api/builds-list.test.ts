import type { BuildDetail, BuildView } from '@busbar/shared';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { demoIds, startHarness, type Agent, type Harness } from '../support/api-harness.ts';
import { addParts, createBuild, moveThrough } from '../support/build-fixtures.ts';
import { SIGN_INS } from '../support/staff-fixtures.ts';

let h: Harness;
let lead: Agent;
let owner: Agent;
let ids: Awaited<ReturnType<typeof demoIds>>;
let builds: BuildDetail[];

beforeAll(async () => {
  h = await startHarness();
  ids = await demoIds(h.db);
  const parts = await addParts(h.db);
  lead = await h.signedIn(SIGN_INS.lead);
  owner = await h.signedIn(SIGN_INS.owner);
  const tech = ids.user(SIGN_INS.tech);
  const den = ids.location('DEN');
  builds = [
    await createBuild(h.db, lead, den, { leadTechnicianId: tech, bookedFor: '2026-05-02' }),
    await createBuild(h.db, lead, den, { bookedFor: '2026-06-10' }),
    await createBuild(h.db, lead, den, { leadTechnicianId: tech, bookedFor: '2026-07-20' }),
  ];
  builds[1] = await moveThrough(lead, builds[1]!, ['quoted']);
  const withSerial = await lead.post(`/api/builds/${builds[2]!.id}/items`).send({ version: builds[2]!.version, catalogItemId: parts.battery.id, quantity: 1, serialNumber: 'KSTR-4471-B' });
  builds[2] = withSerial.body;
  await createBuild(h.db, await h.signedIn(SIGN_INS.lead2), ids.location('AVL'), { bookedFor: '2026-06-11' });
});
afterAll(() => h.close());

const numbers = async (agent: Agent, query: string) => {
  const res = await agent.get(`/api/builds?${query}`);
  expect(res.status).toBe(200);
  return (res.body.items as BuildView[]).map((b) => b.number);
};

describe('the build list', () => {
  it("refuses to rank builds by a price the person's role does not show, and ranks them for a lead", async () => {
    const clerk = await h.signedIn(SIGN_INS.warranty);
    const refused = await clerk.get('/api/builds?sort=totalCents&order=desc');
    expect(refused.status).toBe(400);
    expect(refused.body.error.fields).toEqual({ sort: 'Prices are not shown to your role, so builds cannot be sorted by them' });
    expect((await clerk.get('/api/builds?sort=number')).status).toBe(200);
    const ranked = (await lead.get('/api/builds?sort=totalCents&order=desc').expect(200)).body.items as { totalCents: number }[];
    expect(ranked.length).toBeGreaterThan(1);
    expect(ranked.map((b) => b.totalCents)).toEqual([...ranked.map((b) => b.totalCents)].sort((a, b) => b - a));
  });

  it('filters by status, one or several', async () => {
    expect(await numbers(lead, 'status=quoted')).toEqual(['DEN-00002']);
    expect(await numbers(lead, 'status=quoted&status=draft&sort=number&order=asc')).toEqual(['DEN-00001', 'DEN-00002', 'DEN-00003']);
  });

  it('filters by lead technician, location and booked date range', async () => {
    expect(await numbers(lead, `technicianId=${ids.user(SIGN_INS.tech)}&sort=number&order=asc`)).toEqual(['DEN-00001', 'DEN-00003']);
    expect(await numbers(owner, `locationId=${ids.location('AVL')}`)).toEqual(['AVL-00001']);
    expect(await numbers(owner, 'from=2026-06-01&to=2026-06-30&sort=number&order=asc')).toEqual(['AVL-00001', 'DEN-00002']);
  });

  it('filters by the day a build was delivered at its location', async () => {
    const delivered = await moveThrough(lead, builds[0]!, ['quoted', 'booked', 'in_bay', 'quality_check', 'delivered']);
    // Delivered at 15:00 UTC: 09:00 in Denver, the same day there.
    expect(delivered.deliveredAt).toBe('2026-06-15T15:00:00.000Z');
    expect(await numbers(owner, 'deliveredFrom=2026-06-15&deliveredTo=2026-06-15')).toEqual(['DEN-00001']);
    expect(await numbers(owner, 'deliveredFrom=2026-06-15')).toEqual(['DEN-00001']);
    expect(await numbers(owner, 'deliveredTo=2026-06-14')).toEqual([]);
    expect(await numbers(owner, 'deliveredFrom=2026-06-16')).toEqual([]);
    const bad = await owner.get('/api/builds?deliveredFrom=June');
    expect(bad.status).toBe(400);
    expect(bad.body.error.fields.deliveredFrom).toBeTruthy();
  });

  it('counts the lines of serial-numbered parts still without a serial on each build', async () => {
    const parts = await h.db.selectFrom('catalogItems').select(['id', 'serialized']).where('serialized', '=', 1).execute();
    const before = await owner.get(`/api/builds/${builds[1]!.id}`);
    const added = await lead.post(`/api/builds/${builds[1]!.id}/items`).send({ version: before.body.version, catalogItemId: parts[0]!.id, quantity: 1 });
    expect(added.status).toBe(201);
    const listed = async () => new Map(((await lead.get('/api/builds?pageSize=50')).body.items as BuildView[]).map((b) => [b.number, b.serialsToRecord]));
    expect((await listed()).get('DEN-00002')).toBe(1);
    // The battery of DEN-00003 has its serial.
    expect((await listed()).get('DEN-00003')).toBe(0);
  });

  it('searches build numbers, customer names and serial numbers', async () => {
    expect(await numbers(lead, 'q=00003')).toEqual(['DEN-00003']);
    expect(await numbers(lead, `q=${encodeURIComponent(builds[1]!.customerName)}`)).toEqual(['DEN-00002']);
    expect(await numbers(lead, 'q=4471')).toEqual(['DEN-00003']);
    expect(await numbers(lead, 'q=%25')).toEqual([]);
  });

  it('sorts and pages', async () => {
    expect(await numbers(owner, 'sort=bookedFor&order=desc')).toEqual(['DEN-00003', 'AVL-00001', 'DEN-00002', 'DEN-00001']);
    const page = await owner.get('/api/builds?sort=number&order=asc&page=2&pageSize=3');
    expect(page.body).toMatchObject({ total: 4, page: 2, pageSize: 3 });
    expect(page.body.items.map((b: BuildView) => b.number)).toEqual(['DEN-00003']);
  });

  it('lists deliveries by the day each was delivered at its shop, page after page, and orders only a list of deliveries so', async () => {
    const den4 = await moveThrough(lead, await createBuild(h.db, lead, ids.location('DEN'), { leadTechnicianId: ids.user(SIGN_INS.tech), bookedFor: '2026-06-01' }), ['quoted', 'booked', 'in_bay', 'quality_check', 'delivered']);
    // Delivered three days before DEN-00001 (June 15), at 20:00 in Denver: June 13 in UTC, June 12 at the shop.
    await h.db.updateTable('builds').set({ deliveredAt: '2026-06-13T02:00:00.000Z', deliveredOn: '2026-06-12' }).where('id', '=', den4.id).execute();
    expect(await numbers(owner, 'deliveredFrom=2026-06-01&sort=deliveredOn')).toEqual(['DEN-00001', 'DEN-00004']);
    expect(await numbers(lead, 'deliveredTo=2026-06-30&sort=deliveredOn&order=asc')).toEqual(['DEN-00004', 'DEN-00001']);
    const first = (await owner.get('/api/builds?deliveredFrom=2026-06-01&sort=deliveredOn&pageSize=1').expect(200)).body;
    expect(first.items.map((b: BuildView) => [b.number, b.deliveredOn])).toEqual([['DEN-00001', '2026-06-15']]);
    const next = (await owner.get(`/api/builds?deliveredFrom=2026-06-01&sort=deliveredOn&pageSize=1&cursor=${first.nextCursor}`).expect(200)).body;
    expect(next.items.map((b: BuildView) => [b.number, b.deliveredOn])).toEqual([['DEN-00004', '2026-06-12']]);
    const refused = await owner.get('/api/builds?status=delivered&sort=deliveredOn');
    expect(refused.status).toBe(400);
    expect(refused.body.error.fields).toEqual({ sort: 'Sort by delivery day once the list is narrowed to days of delivery' });
  });

  it('rejects filters it does not know, naming them', async () => {
    const res = await lead.get('/api/builds?status=finished&sort=price&colour=red');
    expect(res.status).toBe(400);
    expect(Object.keys(res.body.error.fields).sort()).toEqual(['colour', 'sort', 'status']);
  });
});

describe('finding a serial number', () => {
  it('finds an installed unit by the start of its serial number, within the locations the person may see', async () => {
    const found = await lead.get('/api/serials?q=kstr-44');
    expect(found.body).toEqual({
      items: [expect.objectContaining({ serialNumber: 'KSTR-4471-B', buildNumber: 'DEN-00003', locationCode: 'DEN', status: 'draft' })],
      total: 1,
      totalCapped: false,
      page: 1,
      pageSize: 50,
    });
    expect((await (await h.signedIn(SIGN_INS.lead2)).get('/api/serials?q=KSTR')).body.items).toEqual([]);
    expect((await (await h.signedIn(SIGN_INS.warranty)).get('/api/serials?q=KSTR')).body.items).toHaveLength(1);
    expect((await lead.get('/api/serials?q=KS')).body.error.fields).toEqual({ q: 'Enter at least 3 characters' });
  });
});

describe('builds with and without a power plan', () => {
  it('filters on whether a build has a plan', async () => {
    const planned = builds[0]!;
    await h.db
      .insertInto('powerPlans')
      .values({ buildId: planned.id, locationId: planned.locationId, name: planned.number, input: '{}', version: 1, createdBy: ids.user(SIGN_INS.lead), createdAt: 'x', updatedAt: 'x', updatedBy: ids.user(SIGN_INS.lead) })
      .execute();
    expect(await numbers(lead, 'hasPlan=true')).toEqual([planned.number]);
    expect(await numbers(lead, 'hasPlan=false&sort=number&order=asc')).toEqual(['DEN-00002', 'DEN-00003', 'DEN-00004']);
  });
});
