import { SAFETY_CAUTION } from '@busbar/calc';
import type { PlanView, QuickPlanSummary } from '@busbar/shared';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { demoIds, startHarness, type Agent, type Harness } from '../support/api-harness.ts';
import { auditOf } from '../support/catalog-fixtures.ts';
import { SIGN_INS, signInEveryone, type SignIn } from '../support/staff-fixtures.ts';

// 10 W × 4 h = 40 Wh a day, which the starter battery carries; with a 24 W fan for 5 h, 160 Wh.
const weekend = {
  systemV: 12,
  gauge: 'awg',
  loads: [{ name: 'LED lights', watts: 10, hoursPerDay: 4, activeHours: [19, 20, 21, 22] }],
  starterBattery: { capacityAh: 70 },
  trip: { daysParked: 2, daysDriving: 1, driveHoursPerDay: 3 },
  circuits: [],
};
const withFan = { ...weekend, loads: [...weekend.loads, { name: 'Roof fan', watts: 24, hoursPerDay: 5 }] };

let h: Harness;
let ids: Awaited<ReturnType<typeof demoIds>>;
let agents: Record<SignIn, Agent>;
let den: PlanView; // a Denver consultation by tech@
let avl: PlanView; // an Asheville consultation by lead2@

beforeAll(async () => {
  h = await startHarness();
  ids = await demoIds(h.db);
  agents = await signInEveryone(h);
  den = (await agents.tech.post('/api/plans').send({ locationId: ids.location('DEN'), name: 'Longbay weekend', input: weekend })).body;
  avl = (await agents.lead2.post('/api/plans').send({ locationId: ids.location('AVL'), name: 'Scarp camper', input: weekend })).body;
});
afterAll(() => h.close());

const planCount = async () => Number((await h.db.selectFrom('powerPlans').select((eb) => eb.fn.countAll<number>().as('n')).executeTakeFirstOrThrow()).n);

describe('making a quick plan', () => {
  it.each([
    ['owner', 201],
    ['lead', 201],
    ['tech', 201],
    ['regional', 403],
    ['warranty', 403],
    ['accountant', 403],
    ['lead2', 404],
  ] as [SignIn, number][])('lets %s make one in Denver: %i', async (who, status) => {
    const before = await planCount();
    const res = await agents[who].post('/api/plans').send({ locationId: ids.location('DEN'), name: `Consult by ${who}`, input: weekend });
    expect(res.status).toBe(status);
    expect(await planCount()).toBe(before + (status === 201 ? 1 : 0));
    if (status !== 201) return;
    expect(res.body).toMatchObject({ buildId: null, locationId: ids.location('DEN'), name: `Consult by ${who}`, version: 1, input: weekend });
    expect(res.body.result).toMatchObject({ verdict: { kind: 'no-second-battery' }, caution: SAFETY_CAUTION });
    expect(res.body.result.dailyAmpHours).toBeCloseTo(40 / 12, 9);
    const audit = await auditOf(h.db, 'plan', res.body.id);
    expect(audit.map((a) => [a.action, a.actorId, a.after])).toEqual([
      ['plan.create', ids.user(SIGN_INS[who]), { locationId: ids.location('DEN'), name: `Consult by ${who}`, version: 1, verdict: 'no-second-battery' }],
    ]);
  });

  it('answers 404 for a location that does not exist', async () => {
    expect((await agents.owner.post('/api/plans').send({ locationId: 9999, name: 'Nowhere', input: weekend })).status).toBe(404);
  });
});

describe('reading quick plans', () => {
  it.each([
    ['owner', ['den', 'avl']],
    ['regional', ['den']],
    ['lead', ['den']],
    ['tech', ['den']],
    ['warranty', ['den']],
    ['accountant', ['den', 'avl']],
    ['lead2', ['avl']],
  ] as [SignIn, string[]][])('lists for %s the plans of their locations, with their verdicts and without their inputs', async (who, names) => {
    const res = await agents[who].get('/api/plans');
    expect(res.status).toBe(200);
    const plans = res.body.items as QuickPlanSummary[];
    expect(res.body).toMatchObject({ page: 1, pageSize: 50, total: plans.length, totalCapped: false });
    const byId: Record<number, string> = { [den.id]: 'den', [avl.id]: 'avl' };
    const listed = plans.filter((p) => byId[p.id]);
    expect(listed.map((p) => byId[p.id]).sort()).toEqual([...names].sort());
    for (const plan of listed) expect(plan.verdict).toEqual((byId[plan.id] === 'den' ? den : avl).result.verdict);
    for (const plan of plans) expect(Object.keys(plan).sort()).toEqual(['buildId', 'id', 'locationId', 'name', 'updatedAt', 'updatedByName', 'verdict', 'version']);
    const allowed = names.map((n) => ids.location(n.toUpperCase()));
    expect(plans.every((p) => allowed.includes(p.locationId) && p.buildId === null)).toBe(true);
  });

  it('filters by location, and lists nothing at a location the person cannot see', async () => {
    const owner = (await agents.owner.get(`/api/plans?locationId=${ids.location('AVL')}`)).body.items as QuickPlanSummary[];
    expect(owner.map((p) => p.id)).toEqual([avl.id]);
    expect((await agents.lead.get(`/api/plans?locationId=${ids.location('AVL')}`)).body).toMatchObject({ items: [], total: 0 });
  });

  it.each([
    ['owner', 200, 200],
    ['regional', 200, 404],
    ['lead', 200, 404],
    ['tech', 200, 404],
    ['warranty', 200, 404],
    ['accountant', 200, 200],
    ['lead2', 404, 200],
  ] as [SignIn, number, number][])('answers %s %i for the Denver plan and %i for the Asheville one', async (who, denStatus, avlStatus) => {
    const [d, a] = [await agents[who].get(`/api/plans/${den.id}`), await agents[who].get(`/api/plans/${avl.id}`)];
    expect([d.status, a.status]).toEqual([denStatus, avlStatus]);
    if (denStatus === 200) expect(d.body).toMatchObject({ id: den.id, name: 'Longbay weekend', updatedByName: 'Dmitri Castellanos', result: { caution: SAFETY_CAUTION } });
  });
});

describe('changing a quick plan', () => {
  it.each([
    ['owner', 200],
    ['lead', 200],
    ['tech', 200],
    ['regional', 403],
    ['warranty', 403],
    ['accountant', 403],
    ['lead2', 404],
  ] as [SignIn, number][])('lets %s change the Denver plan: %i', async (who, status) => {
    const current = await h.db.selectFrom('powerPlans').select(['version', 'name']).where('id', '=', den.id).executeTakeFirstOrThrow();
    const res = await agents[who].put(`/api/plans/${den.id}`).send({ version: current.version, name: `Longbay, by ${who}`, input: withFan });
    expect(res.status).toBe(status);
    const after = await h.db.selectFrom('powerPlans').select(['version', 'name']).where('id', '=', den.id).executeTakeFirstOrThrow();
    expect(after).toEqual(status === 200 ? { version: current.version + 1, name: `Longbay, by ${who}` } : current);
    if (status === 200) expect(res.body.result.dailyWattHours).toBeCloseTo(160, 9);
  });

  it('keeps a revision of every version and answers 409 to a stale one', async () => {
    const row = await h.db.selectFrom('powerPlans').select(['version']).where('id', '=', den.id).executeTakeFirstOrThrow();
    const late = await agents.tech.put(`/api/plans/${den.id}`).send({ version: row.version - 1, name: 'Late', input: weekend });
    expect([late.status, late.body.error.code]).toEqual([409, 'stale']);
    const revisions = await h.db.selectFrom('powerPlanRevisions').select(['version', 'savedBy']).where('planId', '=', den.id).orderBy('version').execute();
    // Made by tech@, then changed by the owner, the lead and tech@ in the matrix above.
    expect(revisions).toEqual([
      { version: 1, savedBy: ids.user(SIGN_INS.tech) },
      { version: 2, savedBy: ids.user(SIGN_INS.owner) },
      { version: 3, savedBy: ids.user(SIGN_INS.lead) },
      { version: 4, savedBy: ids.user(SIGN_INS.tech) },
    ]);
    expect((await auditOf(h.db, 'plan', den.id)).map((a) => a.action)).toEqual(['plan.create', 'plan.update', 'plan.update', 'plan.update']);
  });

  it('answers 404 for a plan that does not exist', async () => {
    expect((await agents.owner.put('/api/plans/999999').send({ version: 1, name: 'x', input: weekend })).status).toBe(404);
  });
});
