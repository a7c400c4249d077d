import { SAFETY_CAUTION } from '@busbar/calc';
import type { BuildDetail } from '@busbar/shared';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { demoIds, startHarness, type Agent, type Harness } from '../support/api-harness.ts';
import { createBuild } from '../support/build-fixtures.ts';
import { SIGN_INS, signInEveryone, type SignIn } from '../support/staff-fixtures.ts';

// 10 W × 4 h + 10 W × 2 h = 60 Wh a day, 5 Ah at 12 V.
const weekend = {
  systemV: 12,
  gauge: 'awg',
  loads: [
    { name: 'LED lights', watts: 10, hoursPerDay: 4, activeHours: [19, 20, 21, 22] },
    { name: 'Phone charging', watts: 10, hoursPerDay: 2 },
  ],
  starterBattery: { capacityAh: 70 },
  trip: { daysParked: 2, daysDriving: 1, driveHoursPerDay: 3 },
  circuits: [],
};

let h: Harness;
let ids: Awaited<ReturnType<typeof demoIds>>;
let agents: Record<SignIn, Agent>;
let planned: BuildDetail; // Denver, led by tech@, with a plan the lead saved
let avl: BuildDetail; // Asheville, no plan

beforeAll(async () => {
  h = await startHarness();
  ids = await demoIds(h.db);
  agents = await signInEveryone(h);
  planned = await denverBuild();
  const saved = await agents.lead.put(`/api/builds/${planned.id}/plan`).send({ version: 0, input: weekend });
  expect(saved.status).toBe(200);
  avl = await createBuild(h.db, agents.lead2, ids.location('AVL'));
});
afterAll(() => h.close());

const denverBuild = (leadTechnicianId: number | null = ids.user(SIGN_INS.tech)) => createBuild(h.db, agents.lead, ids.location('DEN'), { leadTechnicianId });

const rowsOf = async (buildId: number) => {
  const plans = await h.db.selectFrom('powerPlans').select(['id', 'version']).where('buildId', '=', buildId).execute();
  const revisions = await h.db.selectFrom('powerPlanRevisions').select('version').where('planId', 'in', [0, ...plans.map((p) => p.id)]).execute();
  const audit = await h.db.selectFrom('auditLog').select('action').where('entity', '=', 'plan').where('entityId', 'in', [0, ...plans.map((p) => p.id)]).execute();
  return { plans: plans.length, revisions: revisions.length, audit: audit.map((a) => a.action) };
};

describe("reading a build's plan", () => {
  it.each([
    ['owner', 200],
    ['regional', 200],
    ['lead', 200],
    ['tech', 200],
    ['warranty', 200],
    ['accountant', 200],
    ['lead2', 404],
  ] as [SignIn, number][])('answers %s %i for a Denver build, with the caution', async (who, status) => {
    const res = await agents[who].get(`/api/builds/${planned.id}/plan`);
    expect(res.status).toBe(status);
    if (status === 404) return expect(res.body.error.code).toBe('not_found');
    expect(res.body.plan).toMatchObject({ buildId: planned.id, locationId: ids.location('DEN'), name: planned.number, version: 1, updatedByName: 'Priya Halvorsen' });
    expect(res.body.plan.input).toEqual(weekend);
    expect(res.body.plan.result.dailyWattHours).toBeCloseTo(60, 9);
    expect(res.body.plan.result.caution).toBe(SAFETY_CAUTION);
  });

  it.each([
    ['owner', 200],
    ['regional', 200],
    ['lead', 200],
    ['tech', 200],
    ['warranty', 200],
    ['accountant', 200],
    ['lead2', 404],
  ] as [SignIn, number][])('answers %s %i for the revisions of a Denver plan', async (who, status) => {
    const res = await agents[who].get(`/api/builds/${planned.id}/plan/revisions`);
    expect(res.status).toBe(status);
    if (status === 200) expect(res.body).toEqual([{ version: 1, savedAt: h.clock.now.toISOString(), savedByName: 'Priya Halvorsen', note: '' }]);
  });

  it.each([
    ['owner', 200],
    ['regional', 404],
    ['lead', 404],
    ['tech', 404],
    ['warranty', 404],
    ['accountant', 200],
    ['lead2', 200],
  ] as [SignIn, number][])('answers %s %i for an Asheville build without a plan', async (who, status) => {
    const plan = await agents[who].get(`/api/builds/${avl.id}/plan`);
    const revisions = await agents[who].get(`/api/builds/${avl.id}/plan/revisions`);
    expect([plan.status, revisions.status]).toEqual([status, status]);
    if (status === 200) expect([plan.body, revisions.body]).toEqual([{ plan: null }, []]);
  });

  it('answers 404 for a build that does not exist', async () => {
    expect((await agents.owner.get('/api/builds/999999/plan')).status).toBe(404);
  });
});

describe("saving a build's plan", () => {
  it.each([
    ['owner', 200],
    ['lead', 200],
    ['tech', 200],
    ['regional', 403],
    ['warranty', 403],
    ['accountant', 403],
    ['lead2', 404],
  ] as [SignIn, number][])('lets %s save the first plan of a build tech@ leads: %i', async (who, status) => {
    const build = await denverBuild();
    const res = await agents[who].put(`/api/builds/${build.id}/plan`).send({ version: 0, input: weekend });
    expect(res.status).toBe(status);
    const saved = status === 200;
    expect(await rowsOf(build.id)).toEqual({ plans: saved ? 1 : 0, revisions: saved ? 1 : 0, audit: saved ? ['plan.create'] : [] });
    if (saved) expect(res.body).toMatchObject({ buildId: build.id, name: build.number, version: 1, result: { caution: SAFETY_CAUTION } });
  });

  it('refuses a technician on a build they do not lead, and anyone outside the shop', async () => {
    const others = await denverBuild(null);
    const res = await agents.tech.put(`/api/builds/${others.id}/plan`).send({ version: 0, input: weekend });
    expect(res.status).toBe(403);
    expect((await agents.lead.put(`/api/builds/${avl.id}/plan`).send({ version: 0, input: weekend })).status).toBe(404);
    expect(await rowsOf(others.id)).toEqual({ plans: 0, revisions: 0, audit: [] });
    expect(await rowsOf(avl.id)).toEqual({ plans: 0, revisions: 0, audit: [] });
  });

  it('refuses a change to a visible plan by people who only read it, and leaves it as it was', async () => {
    const heavier = { ...weekend, loads: [...weekend.loads, { name: 'Fan', watts: 24, hoursPerDay: 5 }] };
    for (const who of ['regional', 'warranty', 'accountant'] as SignIn[]) {
      expect((await agents[who].put(`/api/builds/${planned.id}/plan`).send({ version: 1, input: heavier })).status).toBe(403);
    }
    expect((await agents.lead2.put(`/api/builds/${planned.id}/plan`).send({ version: 1, input: heavier })).status).toBe(404);
    expect(await rowsOf(planned.id)).toEqual({ plans: 1, revisions: 1, audit: ['plan.create'] });
  });
});
