import type { BuildDetail, BuildHistory } from '@busbar/shared';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { demoIds, startHarness, type Agent, type Harness } from '../support/api-harness.ts';
import { addParts, createBuild, moveThrough } from '../support/build-fixtures.ts';
import { auditOf } from '../support/catalog-fixtures.ts';
import { SIGN_INS } from '../support/staff-fixtures.ts';

let h: Harness;
let ids: Awaited<ReturnType<typeof demoIds>>;
let parts: Awaited<ReturnType<typeof addParts>>;
let lead: Agent;
/** A DEN build taken to delivery with a battery, a charger and two fuses, then corrected line by line. */
let build: BuildDetail;

const refusal = { error: { code: 'invalid', message: 'Say why this delivered build is being corrected', fields: { correctionNote: 'Enter the reason for the correction' } } };

beforeAll(async () => {
  h = await startHarness();
  ids = await demoIds(h.db);
  parts = await addParts(h.db);
  lead = await h.signedIn(SIGN_INS.lead);
  const tech = ids.user(SIGN_INS.tech);
  build = await createBuild(h.db, lead, ids.location('DEN'), { leadTechnicianId: tech, bookedFor: '2026-06-22', laborHours: 3.5 });
  for (const line of [
    { catalogItemId: parts.battery.id, quantity: 1, serialNumber: 'LFP-100' },
    { catalogItemId: parts.charger.id, quantity: 1, serialNumber: 'DC-200' },
    { catalogItemId: parts.fuse.id, quantity: 2 },
  ]) {
    build = (await lead.post(`/api/builds/${build.id}/items`).send({ version: build.version, ...line })).body;
  }
  build = await moveThrough(lead, build, ['quoted', 'booked', 'in_bay', 'quality_check', 'delivered']);
});
afterAll(() => h.close());

const lineOf = (sku: string) => build.items.find((i) => i.sku === sku)!;
const lastAudit = async () => (await auditOf(h.db, 'build', build.id)).at(-1)!;

describe('corrections after delivery', () => {
  it('refuses each change of a delivered build or its lines without a reason, in words, and writes nothing', async () => {
    const before = (await auditOf(h.db, 'build', build.id)).length;
    const attempts = [
      lead.patch(`/api/builds/${build.id}`).send({ version: build.version, laborHours: 4 }),
      lead.patch(`/api/builds/${build.id}`).send({ version: build.version, laborHours: 4, correctionNote: '   ' }),
      lead.post(`/api/builds/${build.id}/items`).send({ version: build.version, catalogItemId: parts.fuse.id, quantity: 1 }),
      lead.patch(`/api/builds/${build.id}/items/${lineOf(parts.battery.sku).id}`).send({ version: build.version, serialNumber: 'LFP-101' }),
      lead.delete(`/api/builds/${build.id}/items/${lineOf(parts.fuse.sku).id}?version=${build.version}`),
    ];
    for (const res of await Promise.all(attempts)) expect([res.status, res.body]).toEqual([400, refusal]);
    expect((await auditOf(h.db, 'build', build.id)).length).toBe(before);
    const events = await h.db.selectFrom('buildEvents').select('kind').where('buildId', '=', build.id).where('kind', '=', 'correction').execute();
    expect(events).toEqual([]);
  });

  it('keeps the reason in the audit row (after.reason) and in the build event of every kind of correction', async () => {
    const reasonsAt = async (reason: string, action: string) => {
      expect(await lastAudit()).toMatchObject({ action, after: expect.objectContaining({ reason }) });
      const event = await h.db.selectFrom('buildEvents').select(['kind', 'note']).where('buildId', '=', build.id).orderBy('id', 'desc').executeTakeFirstOrThrow();
      expect(event).toEqual({ kind: 'correction', note: reason });
    };
    let res = await lead.patch(`/api/builds/${build.id}`).send({ version: build.version, laborHours: 4, correctionNote: 'Wiring took longer' });
    expect(res.status).toBe(200);
    await reasonsAt('Wiring took longer', 'build.correct');
    res = await lead.post(`/api/builds/${res.body.id}/items`).send({ version: res.body.version, catalogItemId: parts.fuse.id, quantity: 1, correctionNote: 'Spare fuse fitted at pickup' });
    expect(res.status).toBe(201);
    await reasonsAt('Spare fuse fitted at pickup', 'build.item.add');
    res = await lead.patch(`/api/builds/${build.id}/items/${lineOf(parts.battery.sku).id}`).send({ version: res.body.version, serialNumber: 'LFP-101', correctionNote: 'Serial misread' });
    expect(res.status).toBe(200);
    await reasonsAt('Serial misread', 'build.item.update');
    res = await lead.patch(`/api/builds/${build.id}/items/${lineOf(parts.fuse.sku).id}`).send({ version: res.body.version, quantity: 3, correctionNote: 'One more fuse used' });
    await reasonsAt('One more fuse used', 'build.item.update');
    res = await lead.delete(`/api/builds/${build.id}/items/${lineOf(parts.charger.sku).id}?version=${res.body.version}`).send({ correctionNote: 'Charger went back unused' });
    expect(res.status).toBe(200);
    expect(await lastAudit()).toMatchObject({ action: 'build.item.remove', before: { sku: parts.charger.sku, serialNumber: 'DC-200' }, after: { reason: 'Charger went back unused' } });
    build = res.body;
  });

  it("tells the build's history in words, newest first, with who, when and each correction's reason", async () => {
    const res = await lead.get(`/api/builds/${build.id}/history`);
    expect(res.status).toBe(200);
    const history = res.body as BuildHistory;
    expect(history.number).toBe(build.number);
    const said = history.entries.map((e) => [e.kind, e.summary, e.details, e.reason]);
    const battery = `${parts.battery.name} (SKU ${parts.battery.sku})`;
    const charger = `${parts.charger.name} (SKU ${parts.charger.sku})`;
    const fuse = `${parts.fuse.name} (SKU ${parts.fuse.sku})`;
    expect(said).toEqual([
      ['correction', `Removed ${charger}, serial DC-200`, [], 'Charger went back unused'],
      ['correction', `Quantity of ${fuse} changed from 2 to 3`, [], 'One more fuse used'],
      ['correction', `Serial of ${battery} changed from LFP-100 to LFP-101`, [], 'Serial misread'],
      ['correction', `Added 1 × ${fuse}`, [], 'Spare fuse fitted at pickup'],
      ['correction', 'Corrected the delivered build', ['Labor: 3.5 h → 4 h'], 'Wiring took longer'],
      ['status', 'Status: Final check → Delivered', [], null],
      ['status', 'Status: In the bay → Final check', [], null],
      ['status', 'Status: Booked → In the bay', [], null],
      ['status', 'Status: Quoted → Booked', [], null],
      ['status', 'Status: Draft → Quoted', [], null],
      ['change', `Added 2 × ${fuse}`, [], null],
      ['change', `Added ${charger}, serial DC-200`, [], null],
      ['change', `Added ${battery}, serial LFP-100`, [], null],
      ['status', 'Created the build as Draft', expect.arrayContaining([expect.stringMatching(/^Customer: /), 'Lead technician: Dmitri Castellanos', 'Booked for: 2026-06-22', 'Labor: 3.5 h']), null],
    ]);
    expect(new Set(history.entries.map((e) => e.actorName))).toEqual(new Set(['Priya Halvorsen']));
    expect(history.more).toBe(false);
  });

  it('says a lead technician change and a serial first recorded in words', async () => {
    const draft = await createBuild(h.db, lead, ids.location('DEN'), { bookedFor: '2026-07-01' });
    const added = (await lead.post(`/api/builds/${draft.id}/items`).send({ version: draft.version, catalogItemId: parts.battery.id, quantity: 1 })).body as BuildDetail;
    const serial = await lead.patch(`/api/builds/${draft.id}/items/${added.items[0]!.id}`).send({ version: added.version, serialNumber: 'LFP-300' });
    const tech = await lead.patch(`/api/builds/${draft.id}`).send({ version: serial.body.version, leadTechnicianId: ids.user(SIGN_INS.tech), bookedFor: '2026-07-02' });
    expect(tech.status).toBe(200);
    const [latest, recorded] = ((await lead.get(`/api/builds/${draft.id}/history`)).body as BuildHistory).entries;
    expect(latest).toMatchObject({ kind: 'change', summary: 'Changed the build', details: ['Lead technician: none → Dmitri Castellanos', 'Booked for: 2026-07-01 → 2026-07-02'], reason: null });
    expect(recorded).toMatchObject({ kind: 'change', summary: `Serial of ${parts.battery.name} (SKU ${parts.battery.sku}) recorded: LFP-300` });
  });

  it("answers another shop's build history with 404 and never says money, whoever reads it", async () => {
    expect((await (await h.signedIn(SIGN_INS.lead2)).get(`/api/builds/${build.id}/history`)).status).toBe(404);
    const clerk = await (await h.signedIn(SIGN_INS.warranty)).get(`/api/builds/${build.id}/history`);
    expect(clerk.status).toBe(200);
    expect(JSON.stringify(clerk.body)).not.toMatch(/\$|price|cost|cents/i);
    expect(clerk.body.entries.length).toBe(14);
  });
});
