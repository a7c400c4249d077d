import type { PlanInput } from '@busbar/calc';
import type { BuildDetail } from '@busbar/shared';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { demoIds, startHarness, type Agent, type Harness } from '../support/api-harness.ts';
import { addParts, createBuild, moveThrough } from '../support/build-fixtures.ts';
import { SIGN_INS } from '../support/staff-fixtures.ts';
import { feeder, feederPlan } from '../support/margin-plans.ts';

const roomy = feederPlan;
const tight: PlanInput = { ...roomy, circuits: [{ ...feeder, size: { awg: '10' } }] };
const noCircuits: PlanInput = { ...roomy, circuits: [] };

let h: Harness;
let ids: Awaited<ReturnType<typeof demoIds>>;
let lead: Agent;
let tech: Agent;
beforeAll(async () => {
  h = await startHarness();
  ids = await demoIds(h.db);
  lead = await h.signedIn(SIGN_INS.lead);
  tech = await h.signedIn(SIGN_INS.tech);
});
afterAll(() => h.close());

/** A Denver build with a battery, a charger and three fuses (five units), delivered; its plan saved in the bay when given. */
async function deliveredBuild(plan?: PlanInput) {
  const parts = await addParts(h.db);
  let build = await createBuild(h.db, lead, ids.location('DEN'), { leadTechnicianId: ids.user(SIGN_INS.tech), bookedFor: '2026-06-20' });
  const lines = [
    { catalogItemId: parts.battery.id, quantity: 1, serialNumber: `MB-${build.id}` },
    { catalogItemId: parts.charger.id, quantity: 1, serialNumber: `MC-${build.id}` },
    { catalogItemId: parts.fuse.id, quantity: 3 },
  ];
  for (const line of lines) build = (await lead.post(`/api/builds/${build.id}/items`).send({ version: build.version, ...line })).body as BuildDetail;
  build = await moveThrough(lead, build, ['quoted', 'booked', 'in_bay']);
  const itemIds = [parts.battery.id, parts.charger.id, parts.fuse.id];
  if (plan) expect((await tech.put(`/api/builds/${build.id}/plan`).send({ version: 0, input: plan })).status).toBe(200);
  const before = await unitsByBand(itemIds);
  build = await moveThrough(tech, build, ['quality_check', 'delivered']);
  return { build, itemIds, before };
}

const MEASURE_NAMES = ['drop', 'load', 'discharge'];

/** Units of the items by margin measure and band ("drop 3"), and those on builds without margins ("none"), leaving out what adds up to nothing. */
async function unitsByBand(itemIds: number[]): Promise<Record<string, number>> {
  const bands = await h.db.selectFrom('unitExposureBands').selectAll().where('catalogItemId', 'in', itemIds).execute();
  const cells = await h.db.selectFrom('unitExposure').select('units').where('catalogItemId', 'in', itemIds).execute();
  const units: Record<string, number> = { none: cells.reduce((sum, c) => sum + c.units, 0) };
  for (const r of bands) {
    const key = `${MEASURE_NAMES[r.measure - 1]} ${r.band}`;
    units[key] = (units[key] ?? 0) + r.units;
    if (r.measure === 1) units.none! -= r.units;
  }
  return Object.fromEntries(Object.entries(units).filter(([, n]) => n !== 0));
}

const marginsOf = (buildId: number) => h.db.selectFrom('planMargins').select(['dropBand', 'loadBand', 'dischargeBand']).where('buildId', '=', buildId).executeTakeFirst();
const correct = (build: BuildDetail, version: number, input: PlanInput) =>
  lead.put(`/api/builds/${build.id}/plan`).send({ version, input, correctionNote: 'Feeder checked again at the customer visit' });

describe("a build's design margins follow its plan", () => {
  it('counts the units of a delivered build in its plan’s bands, moves them when a correction tightens the plan, and back to "no plan" when the plan can no longer tell', async () => {
    const { build, itemIds, before } = await deliveredBuild(roomy);
    expect(before).toEqual({});
    expect(await marginsOf(build.id)).toEqual({ dropBand: 3, loadBand: 1, dischargeBand: 1 });
    expect(await unitsByBand(itemIds)).toEqual({ 'drop 3': 5, 'load 1': 5, 'discharge 1': 5 });

    expect((await correct(build, 1, tight)).status).toBe(200);
    expect(await marginsOf(build.id)).toEqual({ dropBand: 4, loadBand: 1, dischargeBand: 1 });
    expect(await unitsByBand(itemIds)).toEqual({ 'drop 4': 5, 'load 1': 5, 'discharge 1': 5 });

    expect((await correct(build, 2, tight)).status).toBe(200);
    expect(await unitsByBand(itemIds)).toEqual({ 'drop 4': 5, 'load 1': 5, 'discharge 1': 5 });

    expect((await correct(build, 3, noCircuits)).status).toBe(200);
    expect(await marginsOf(build.id)).toBeUndefined();
    expect(await unitsByBand(itemIds)).toEqual({ none: 5 });
  });

  it('leaves the units where they were when a save is refused', async () => {
    const { build, itemIds } = await deliveredBuild(roomy);
    expect((await tech.put(`/api/builds/${build.id}/plan`).send({ version: 1, input: tight, correctionNote: 'Rewired' })).status).toBe(403);
    expect((await correct(build, 0, tight)).status).toBe(409);
    expect(await unitsByBand(itemIds)).toEqual({ 'drop 3': 5, 'load 1': 5, 'discharge 1': 5 });
  });

  it('writes no margins for a quick plan, and moves a delivered build’s units when one is attached to it', async () => {
    const { build, itemIds } = await deliveredBuild();
    expect(await unitsByBand(itemIds)).toEqual({ none: 5 });
    const rowsBefore = await h.db.selectFrom('planMargins').select('buildId').execute();
    const quick = await tech.post('/api/plans').send({ locationId: ids.location('DEN'), name: 'Van consult', input: tight });
    expect(quick.status).toBe(201);
    expect(await h.db.selectFrom('planMargins').select('buildId').execute()).toEqual(rowsBefore);

    const attached = await lead.post(`/api/plans/${quick.body.id}/attach`).send({ buildId: build.id, version: 1 });
    expect(attached.status).toBe(200);
    expect(await marginsOf(build.id)).toEqual({ dropBand: 4, loadBand: 1, dischargeBand: 1 });
    expect(await unitsByBand(itemIds)).toEqual({ 'drop 4': 5, 'load 1': 5, 'discharge 1': 5 });
  });
});
