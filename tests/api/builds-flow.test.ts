import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { demoIds, startHarness, type Agent, type Harness } from '../support/api-harness.ts';
import { addParts, createBuild, moveThrough } from '../support/build-fixtures.ts';
import { auditOf } from '../support/catalog-fixtures.ts';
import { SIGN_INS } from '../support/staff-fixtures.ts';

let h: Harness;
let ids: Awaited<ReturnType<typeof demoIds>>;
let parts: Awaited<ReturnType<typeof addParts>>;
let lead: Agent;
let tech: Agent;
beforeAll(async () => {
  h = await startHarness();
  ids = await demoIds(h.db);
  parts = await addParts(h.db);
  lead = await h.signedIn(SIGN_INS.lead);
  tech = await h.signedIn(SIGN_INS.tech);
});
afterAll(() => h.close());

describe('a build from booking to delivery', () => {
  it('numbers builds per location and starts them as drafts with the location labor rate', async () => {
    const first = await createBuild(h.db, lead, ids.location('DEN'));
    const second = await createBuild(h.db, lead, ids.location('DEN'));
    const avl = await createBuild(h.db, await h.signedIn(SIGN_INS.lead2), ids.location('AVL'));
    expect([first.number, second.number, avl.number]).toEqual(['DEN-00001', 'DEN-00002', 'AVL-00001']);
    expect(first).toMatchObject({ status: 'draft', version: 1, laborRateCents: 14500, totalCents: 0, locationCode: 'DEN' });
    expect(first.events.map((e) => [e.kind, e.fromStatus, e.toStatus])).toEqual([['status', null, 'draft']]);
    expect((await auditOf(h.db, 'build', first.id)).map((a) => a.action)).toEqual(['build.create']);
  });

  it('goes from draft to delivered: the lead plans, the lead technician works, totals follow every change', async () => {
    const techId = ids.user(SIGN_INS.tech);
    let build = await createBuild(h.db, lead, ids.location('DEN'), { leadTechnicianId: techId, bookedFor: '2026-06-20' });
    build = await moveThrough(lead, build, ['quoted', 'booked']);
    // The technician may not plan: quoting and booking are the lead's.
    expect((await tech.post(`/api/builds/${build.id}/status`).send({ version: build.version, to: 'quoted' })).status).toBe(403);
    build = await moveThrough(tech, build, ['in_bay']);
    expect(build.startedAt).toBe(h.clock.now.toISOString());

    const add = async (body: object) => {
      const res = await tech.post(`/api/builds/${build.id}/items`).send({ version: build.version, ...body });
      expect(res.status).toBe(201);
      build = res.body;
    };
    await add({ catalogItemId: parts.battery.id, quantity: 1, serialNumber: 'LFP-2026-0001' });
    await add({ catalogItemId: parts.fuse.id, quantity: 2 });
    const labor = await tech.patch(`/api/builds/${build.id}`).send({ version: build.version, laborHours: 3.5 });
    expect(labor.status).toBe(200);
    build = labor.body;
    // Hand-worked: parts $899.00 + 2 × $12.50 = $924.00; labor 3.5 h × $145.00 = $507.50; total $1,431.50.
    expect((await lead.get(`/api/builds/${build.id}`)).body).toMatchObject({
      partsPriceCents: 92400,
      partsCostCents: 61820,
      laborCents: 50750,
      totalCents: 143150,
      marginCents: 30580,
    });
    // The technician sees the prices but never the cost or the margin.
    expect(build).toMatchObject({ partsPriceCents: 92400, totalCents: 143150 });
    expect(build).not.toHaveProperty('partsCostCents');
    expect(build).not.toHaveProperty('marginCents');
    expect(build.items[0]).not.toHaveProperty('unitCostCents');
    expect(build.items.map((i) => [i.sku, i.quantity, i.serialNumber, i.unitPriceCents])).toEqual([
      [parts.battery.sku, 1, 'LFP-2026-0001', 89900],
      [parts.fuse.sku, 2, null, 1250],
    ]);

    h.clock.now = new Date('2026-06-15T18:30:00Z'); // sessions last 12 hours from their last use
    build = await moveThrough(tech, build, ['quality_check', 'delivered']);
    expect(build).toMatchObject({ status: 'delivered', deliveredAt: '2026-06-15T18:30:00.000Z' });
    expect(build.events.map((e) => e.toStatus)).toEqual(['draft', 'quoted', 'booked', 'in_bay', 'quality_check', 'delivered']);
    expect(build.events.at(-1)!.actorName).toBe('Dmitri Castellanos');
  });

  it('refuses changes of status the workflow does not allow, naming the field', async () => {
    const build = await createBuild(h.db, lead, ids.location('DEN'));
    const skip = await lead.post(`/api/builds/${build.id}/status`).send({ version: build.version, to: 'delivered' });
    expect(skip.status).toBe(400);
    expect(skip.body.error.fields).toEqual({ to: 'A build cannot go from Draft to Delivered' });
    const quoted = await moveThrough(lead, build, ['quoted']);
    const noDate = await lead.post(`/api/builds/${build.id}/status`).send({ version: quoted.version, to: 'booked' });
    expect(noDate.body.error.fields).toEqual({ to: 'Set the booked date before booking' });
    const dated = (await lead.patch(`/api/builds/${build.id}`).send({ version: quoted.version, bookedFor: '2026-07-01' })).body;
    const booked = await moveThrough(lead, dated, ['booked']);
    const noTech = await lead.post(`/api/builds/${build.id}/status`).send({ version: booked.version, to: 'in_bay' });
    expect(noTech.body.error.fields).toEqual({ to: 'Choose a lead technician before the build goes in the bay' });
    const unknown = await lead.post(`/api/builds/${build.id}/status`).send({ version: booked.version, to: 'finished' });
    expect(unknown.status).toBe(400);
    expect(Object.keys(unknown.body.error.fields)).toEqual(['to']);
  });

  it('answers 409 to an edit made against an old version, and changes nothing', async () => {
    const build = await createBuild(h.db, lead, ids.location('DEN'));
    expect((await lead.patch(`/api/builds/${build.id}`).send({ version: build.version, notes: 'First edit' })).status).toBe(200);
    const late = await lead.patch(`/api/builds/${build.id}`).send({ version: build.version, notes: 'Second, stale edit' });
    expect(late.status).toBe(409);
    expect(late.body.error.code).toBe('stale');
    const now = (await lead.get(`/api/builds/${build.id}`)).body;
    expect([now.notes, now.version]).toEqual(['First edit', 2]);
  });

  it('locks a delivered build except for a lead correction with a reason, which is recorded', async () => {
    const techId = ids.user(SIGN_INS.tech);
    let build = await createBuild(h.db, lead, ids.location('DEN'), { leadTechnicianId: techId, bookedFor: '2026-06-22' });
    build = await moveThrough(lead, build, ['quoted', 'booked', 'in_bay', 'quality_check', 'delivered']);
    expect((await tech.patch(`/api/builds/${build.id}`).send({ version: build.version, laborHours: 2, correctionNote: 'x' })).status).toBe(403);
    const noReason = await lead.patch(`/api/builds/${build.id}`).send({ version: build.version, laborHours: 2 });
    expect(noReason.status).toBe(400);
    expect(Object.keys(noReason.body.error.fields)).toEqual(['correctionNote']);
    const fixed = await lead.patch(`/api/builds/${build.id}`).send({ version: build.version, laborHours: 2, correctionNote: 'Labor was logged short' });
    expect(fixed.status).toBe(200);
    expect(fixed.body.laborCents).toBe(29000);
    expect(fixed.body.events.at(-1)).toMatchObject({ kind: 'correction', note: 'Labor was logged short', actorName: 'Priya Halvorsen' });
    expect((await auditOf(h.db, 'build', build.id)).at(-1)).toMatchObject({ action: 'build.correct', before: { laborHours: 0 }, after: { laborHours: 2 } });
    const added = await lead.post(`/api/builds/${build.id}/items`).send({ version: fixed.body.version, catalogItemId: parts.fuse.id, quantity: 1, correctionNote: 'Fuse fitted at pickup' });
    expect(added.status).toBe(201);
    expect(added.body.events.at(-1)).toMatchObject({ kind: 'correction', note: 'Fuse fitted at pickup' });
  });

  it('closes a cancelled build to every change', async () => {
    const build = await moveThrough(lead, await createBuild(h.db, lead, ids.location('DEN')), ['cancelled']);
    const res = await lead.patch(`/api/builds/${build.id}`).send({ version: build.version, notes: 'too late', correctionNote: 'x' });
    expect(res.status).toBe(409);
    expect((await lead.post(`/api/builds/${build.id}/status`).send({ version: build.version, to: 'draft' })).status).toBe(400);
  });
});
