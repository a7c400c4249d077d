import { SAFETY_CAUTION } from '@busbar/calc';
import type { BuildDetail, PlanView, QuickPlanSummary } from '@busbar/shared';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { demoIds, startHarness, type Agent, type Harness } from '../support/api-harness.ts';
import { createBuild, moveThrough } from '../support/build-fixtures.ts';
import { auditOf } from '../support/catalog-fixtures.ts';
import { SIGN_INS, signInEveryone, type SignIn } from '../support/staff-fixtures.ts';

// 10 W × 4 h + 10 W × 2 h = 60 Wh a day.
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
let mine: BuildDetail; // Denver, led by tech@
let others: BuildDetail; // Denver, no lead technician
let avl: BuildDetail; // Asheville

beforeAll(async () => {
  h = await startHarness();
  ids = await demoIds(h.db);
  agents = await signInEveryone(h);
  mine = await techBuild();
  others = await createBuild(h.db, agents.lead, ids.location('DEN'));
  avl = await createBuild(h.db, agents.lead2, ids.location('AVL'));
});
afterAll(() => h.close());

function techBuild() {
  return createBuild(h.db, agents.lead, ids.location('DEN'), { leadTechnicianId: ids.user(SIGN_INS.tech), bookedFor: '2026-06-25' });
}
async function quickPlan(name: string): Promise<PlanView> {
  const res = await agents.tech.post('/api/plans').send({ locationId: ids.location('DEN'), name, input: weekend });
  expect(res.status).toBe(201);
  return res.body;
}
const attach = (who: SignIn, plan: PlanView, buildId: number, version = plan.version) =>
  agents[who].post(`/api/plans/${plan.id}/attach`).send({ buildId, version });
const buildIdOf = async (plan: PlanView) => (await h.db.selectFrom('powerPlans').select('buildId').where('id', '=', plan.id).executeTakeFirstOrThrow()).buildId;

describe('attaching a quick plan to its build', () => {
  it.each([
    ['regional', 403],
    ['warranty', 403],
    ['accountant', 403],
    ['lead2', 404],
  ] as [SignIn, number][])('refuses %s: %i', async (who, status) => {
    const plan = await quickPlan(`Consult for ${who}`);
    expect((await attach(who, plan, mine.id)).status).toBe(status);
    expect(await buildIdOf(plan)).toBeNull();
  });

  it('lets a technician attach only to a build they lead', async () => {
    const plan = await quickPlan('Consult for a build led by nobody');
    expect((await attach('tech', plan, others.id)).status).toBe(403);
    expect(await buildIdOf(plan)).toBeNull();
  });

  it('refuses a build of another location or none, naming buildId, and a stale version', async () => {
    const plan = await quickPlan('Consult for the wrong build');
    for (const buildId of [avl.id, 999999]) {
      const res = await attach('owner', plan, buildId);
      expect(res.status).toBe(400);
      expect(res.body.error.fields).toEqual({ buildId: 'Choose a build at the location of the plan' });
    }
    const late = await attach('tech', plan, mine.id, 2);
    expect([late.status, late.body.error.code]).toEqual([409, 'stale']);
    expect(await buildIdOf(plan)).toBeNull();
  });

  it('moves the plan onto the build as its next version, with a revision saying so', async () => {
    const plan = await quickPlan('Longbay weekend');
    h.clock.now = new Date('2026-06-15T15:30:00Z');
    const res = await attach('tech', plan, mine.id);
    expect(res.status).toBe(200);
    expect(res.body).toMatchObject({ id: plan.id, buildId: mine.id, name: 'Longbay weekend', version: 2, input: weekend, result: { caution: SAFETY_CAUTION } });
    expect((await agents.lead.get(`/api/builds/${mine.id}/plan`)).body.plan).toMatchObject({ id: plan.id, version: 2 });
    expect((await agents.lead.get(`/api/builds/${mine.id}/plan/revisions`)).body).toEqual([
      { version: 2, savedAt: '2026-06-15T15:30:00.000Z', savedByName: 'Dmitri Castellanos', note: `Attached to ${mine.number}` },
      { version: 1, savedAt: '2026-06-15T15:00:00.000Z', savedByName: 'Dmitri Castellanos', note: '' },
    ]);
    expect(((await agents.lead.get('/api/plans')).body.items as QuickPlanSummary[]).map((p) => p.id)).not.toContain(plan.id);
    expect((await auditOf(h.db, 'plan', plan.id)).at(-1)).toMatchObject({
      action: 'plan.attach',
      actorId: ids.user(SIGN_INS.tech),
      before: { buildId: null, version: 1 },
      after: { buildId: mine.id, version: 2, note: `Attached to ${mine.number}` },
    });

    // From now on it is the build's plan: changed on the build, not as a quick plan.
    const quickEdit = await agents.tech.put(`/api/plans/${plan.id}`).send({ version: 2, name: 'Renamed', input: weekend });
    expect(quickEdit.status).toBe(409);
    expect((await agents.tech.put(`/api/builds/${mine.id}/plan`).send({ version: 2, input: weekend })).body.version).toBe(3);
    expect((await attach('tech', { ...plan, version: 3 }, others.id)).status).toBe(409);
  });

  it('refuses a build that already has a plan', async () => {
    const plan = await quickPlan('A second consult');
    const res = await attach('lead', plan, mine.id);
    expect(res.status).toBe(409);
    expect(res.body.error.fields).toEqual({ buildId: 'This build already has a power plan' });
    expect(await buildIdOf(plan)).toBeNull();
  });

  it('refuses a cancelled build, and records an attachment after delivery as a correction by the lead', async () => {
    const cancelled = await moveThrough(agents.lead, await techBuild(), ['cancelled']);
    const plan = await quickPlan('Late consult');
    expect((await attach('lead', plan, cancelled.id)).status).toBe(409);

    const delivered = await moveThrough(agents.lead, await techBuild(), ['quoted', 'booked', 'in_bay', 'quality_check', 'delivered']);
    expect((await attach('tech', plan, delivered.id)).status).toBe(403);
    expect((await attach('lead', plan, delivered.id)).status).toBe(200);
    const detail = (await agents.lead.get(`/api/builds/${delivered.id}`)).body as BuildDetail;
    expect(detail.events.at(-1)).toMatchObject({ kind: 'correction', note: 'Quick plan "Late consult" attached after delivery', actorName: 'Priya Halvorsen' });
  });
});
