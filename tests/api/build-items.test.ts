import type { BuildDetail } from '@busbar/shared';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { demoIds, startHarness, type Agent, type Harness } from '../support/api-harness.ts';
import { addParts, createBuild, moveThrough } from '../support/build-fixtures.ts';
import { addCatalogItem } from '../support/catalog-fixtures.ts';
import { SIGN_INS } from '../support/staff-fixtures.ts';

let h: Harness;
let lead: Agent;
let lead2: Agent;
let parts: Awaited<ReturnType<typeof addParts>>;
let ids: Awaited<ReturnType<typeof demoIds>>;
beforeAll(async () => {
  h = await startHarness();
  ids = await demoIds(h.db);
  parts = await addParts(h.db);
  lead = await h.signedIn(SIGN_INS.lead);
  lead2 = await h.signedIn(SIGN_INS.lead2);
});
afterAll(() => h.close());

const add = (agent: Agent, build: BuildDetail, body: object) => agent.post(`/api/builds/${build.id}/items`).send({ version: build.version, ...body });
const itemCount = async () => Number((await h.db.selectFrom('buildItems').select((eb) => eb.fn.countAll<number>().as('n')).executeTakeFirstOrThrow()).n);

describe('components of a build', () => {
  it('takes a serialized component one unit at a time, and refuses other bad lines, writing nothing', async () => {
    const build = await createBuild(h.db, lead, ids.location('DEN'));
    const before = await itemCount();
    expect((await add(lead, build, { catalogItemId: parts.battery.id, quantity: 2, serialNumber: 'A-1' })).body.error.fields).toEqual({
      quantity: 'Serialized components are added one unit at a time',
    });
    expect((await add(lead, build, { catalogItemId: parts.fuse.id, quantity: 1, serialNumber: 'F-1' })).body.error.fields).toEqual({
      serialNumber: 'This component has no serial numbers',
    });
    expect((await add(lead, build, { catalogItemId: parts.fuse.id, quantity: 0 })).body.error.fields).toEqual({ quantity: 'At least 1' });
    expect((await add(lead, build, { catalogItemId: 999999, quantity: 1 })).body.error.fields).toEqual({
      catalogItemId: 'Choose a component from the catalog',
    });
    expect(await itemCount()).toBe(before);
  });

  it('lets a planned unit wait for its serial number until the build leaves the bay', async () => {
    const tech = ids.user(SIGN_INS.tech);
    let build = await createBuild(h.db, lead, ids.location('DEN'), { leadTechnicianId: tech, bookedFor: '2026-06-16' });
    const planned = await add(lead, build, { catalogItemId: parts.battery.id, quantity: 1 });
    expect(planned.status).toBe(201);
    expect(planned.body.items[0]).toMatchObject({ serialized: true, serialNumber: null });
    build = await moveThrough(lead, planned.body, ['quoted', 'booked', 'in_bay']);
    const out = await lead.post(`/api/builds/${build.id}/status`).send({ version: build.version, to: 'quality_check' });
    expect(out.status).toBe(400);
    expect(out.body.error.fields).toEqual({ to: `Record the serial numbers first: ${parts.battery.sku}` });
    const fitted = await lead.patch(`/api/builds/${build.id}/items/${build.items[0]!.id}`).send({ version: build.version, serialNumber: 'LFP-FIT-1' });
    expect(fitted.body.items[0].serialNumber).toBe('LFP-FIT-1');
    build = await moveThrough(lead, fitted.body, ['quality_check']);
    // At the final check a unit goes in only with its serial number.
    expect((await add(lead, build, { catalogItemId: parts.charger.id, quantity: 1 })).body.error.fields).toEqual({
      serialNumber: 'Enter the serial number of this unit',
    });
  });

  it('refuses a serial number already installed for the same SKU anywhere, naming the build only to those who may see it', async () => {
    const den = await createBuild(h.db, lead, ids.location('DEN'));
    const first = await add(lead, den, { catalogItemId: parts.charger.id, quantity: 1, serialNumber: 'DCC-77' });
    expect(first.status).toBe(201);
    const again = await add(lead, first.body, { catalogItemId: parts.charger.id, quantity: 1, serialNumber: 'DCC-77' });
    expect(again.status).toBe(409);
    expect(again.body.error.fields).toEqual({ serialNumber: `Serial number DCC-77 of ${parts.charger.sku} is already recorded on build ${den.number}` });
    const avl = await createBuild(h.db, lead2, ids.location('AVL'));
    const elsewhere = await add(lead2, avl, { catalogItemId: parts.charger.id, quantity: 1, serialNumber: 'DCC-77' });
    expect(elsewhere.status).toBe(409);
    expect(elsewhere.body.error.fields.serialNumber).toBe(`Serial number DCC-77 of ${parts.charger.sku} is already recorded on another build`);
    // The same serial on another SKU is another unit.
    const otherSku = await addCatalogItem(h.db, { vendorId: parts.vendor.id });
    expect((await add(lead2, avl, { catalogItemId: otherSku.id, quantity: 1, serialNumber: 'DCC-77' })).status).toBe(201);
  });

  it('captures price and cost when added, so later catalog changes leave the build alone', async () => {
    const item = await addCatalogItem(h.db, { vendorId: parts.vendor.id, category: 'solar_panel', specs: { watts: 200 }, serialized: false, unitPriceCents: 30000, unitCostCents: 18000 });
    let build = await createBuild(h.db, lead, ids.location('DEN'));
    build = (await add(lead, build, { catalogItemId: item.id, quantity: 2 })).body;
    await h.db.updateTable('catalogItems').set({ unitPriceCents: 35000, unitCostCents: 20000 }).where('id', '=', item.id).execute();
    const fresh = (await lead.get(`/api/builds/${build.id}`)).body;
    expect(fresh.items[0]).toMatchObject({ unitPriceCents: 30000, unitCostCents: 18000 });
    expect(fresh).toMatchObject({ partsPriceCents: 60000, partsCostCents: 36000 });
  });

  it('changes and removes components against the current version, keeping totals right', async () => {
    let build = await createBuild(h.db, lead, ids.location('DEN'));
    build = (await add(lead, build, { catalogItemId: parts.fuse.id, quantity: 2 })).body;
    build = (await add(lead, build, { catalogItemId: parts.battery.id, quantity: 1, serialNumber: 'LFP-9' })).body;
    const [fuse, battery] = build.items;
    const stale = await lead.patch(`/api/builds/${build.id}/items/${fuse!.id}`).send({ version: build.version - 1, quantity: 5 });
    expect(stale.status).toBe(409);
    const changed = await lead.patch(`/api/builds/${build.id}/items/${fuse!.id}`).send({ version: build.version, quantity: 4 });
    expect(changed.status).toBe(200);
    // 4 × $12.50 + $899.00 = $949.00
    expect(changed.body.partsPriceCents).toBe(94900);
    const reserial = await lead.patch(`/api/builds/${build.id}/items/${battery!.id}`).send({ version: changed.body.version, serialNumber: 'LFP-10' });
    expect(reserial.body.items[1].serialNumber).toBe('LFP-10');
    const removed = await lead.delete(`/api/builds/${build.id}/items/${battery!.id}?version=${reserial.body.version}`);
    expect(removed.status).toBe(200);
    expect(removed.body.items.map((i: { sku: string }) => i.sku)).toEqual([parts.fuse.sku]);
    expect(removed.body.partsPriceCents).toBe(5000);
    expect((await lead.delete(`/api/builds/${build.id}/items/${battery!.id}?version=${removed.body.version}`)).status).toBe(404);
  });

  it('refuses a component of another build by its id', async () => {
    const a = (await add(lead, await createBuild(h.db, lead, ids.location('DEN')), { catalogItemId: parts.fuse.id, quantity: 1 })).body;
    const b = await createBuild(h.db, lead, ids.location('DEN'));
    const res = await lead.patch(`/api/builds/${b.id}/items/${a.items[0].id}`).send({ version: b.version, quantity: 9 });
    expect(res.status).toBe(404);
  });
});
