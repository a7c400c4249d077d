import type { BuildDetail, CustomerBuildRow, CustomerPlanRow, PlanView } from '@busbar/shared';
import { sql } from 'kysely';
import request from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { demoIds, startHarness, type Agent, type Harness } from '../support/api-harness.ts';
import { createBuild } from '../support/build-fixtures.ts';
import { addCustomer, addVehicle } from '../support/catalog-fixtures.ts';
import { SIGN_INS, type SignIn } from '../support/staff-fixtures.ts';

const ALL = Object.keys(SIGN_INS) as SignIn[];

const weekend = {
  systemV: 12,
  gauge: 'awg',
  loads: [{ name: 'LED lights', watts: 10, hoursPerDay: 4 }],
  starterBattery: { capacityAh: 70 },
  trip: { daysParked: 2, daysDriving: 1, driveHoursPerDay: 3 },
  circuits: [],
};

/**
 * What each sign-in reads of a Denver customer's builds: Denver's, and one at Asheville that
 * points at the same customer (a record the screens never make, to show scope alone decides).
 */
const SEES: Record<SignIn, { builds: 'den' | 'all' | 404; prices: boolean }> = {
  owner: { builds: 'all', prices: true },
  regional: { builds: 'den', prices: true },
  lead: { builds: 'den', prices: true },
  tech: { builds: 'den', prices: true },
  warranty: { builds: 'den', prices: false },
  accountant: { builds: 'all', prices: true },
  lead2: { builds: 404, prices: false },
};

describe("a customer's builds and plans", () => {
  let h: Harness;
  const agents = {} as Record<SignIn, Agent>;
  let customerId: number;
  let den: BuildDetail[];
  let avl: BuildDetail;
  let denPlan: PlanView;
  let avlPlan: PlanView;

  async function attachedPlan(agent: Agent, locationId: number, build: BuildDetail, name: string): Promise<PlanView> {
    const plan = (await agent.post('/api/plans').send({ locationId, name, input: weekend })).body as PlanView;
    const res = await agent.post(`/api/plans/${plan.id}/attach`).send({ buildId: build.id, version: plan.version });
    expect(res.status).toBe(200);
    return res.body;
  }

  beforeAll(async () => {
    h = await startHarness();
    const ids = await demoIds(h.db);
    for (const name of ALL) agents[name] = await h.signedIn(SIGN_INS[name]);
    const customer = await addCustomer(h.db, ids.location('DEN'), { name: 'Wren Fairholm' });
    customerId = customer.id;
    const vehicle = await addVehicle(h.db, customer, { year: 2022, make: 'Halvard', model: 'Longbay Wren' });
    den = [];
    for (const bookedFor of [null, '2026-06-20', '2026-07-02']) {
      const res = await agents.lead.post('/api/builds').send({ locationId: customer.locationId, customerId, vehicleId: vehicle.id, bookedFor });
      den.push(res.body);
    }
    avl = await createBuild(h.db, agents.lead2, ids.location('AVL'));
    await sql`update builds set customer_id = ${customerId} where id = ${avl.id}`.execute(h.db);
    denPlan = await attachedPlan(agents.lead, customer.locationId, den[1]!, 'Weekend lights');
    avlPlan = await attachedPlan(agents.lead2, ids.location('AVL'), avl, 'Asheville lights');
    // A quick plan of the same shop belongs to no customer until it is attached.
    await agents.lead.post('/api/plans').send({ locationId: customer.locationId, name: 'Unattached consult', input: weekend });
  });
  afterAll(() => h.close());

  const row = (b: BuildDetail, prices: boolean): CustomerBuildRow => ({
    id: b.id,
    number: b.number,
    locationId: b.locationId,
    vehicleId: b.vehicleId,
    vehicleLabel: b.id === avl.id ? expect.any(String) : '2022 Halvard Longbay Wren',
    status: 'draft',
    bookedFor: b.bookedFor,
    deliveredAt: null,
    createdAt: b.createdAt,
    ...(prices ? { totalCents: 0 } : {}),
  });

  it('answers 401 without a session', async () => {
    expect((await request(h.app).get(`/api/customers/${customerId}/builds`)).status).toBe(401);
    expect((await request(h.app).get(`/api/customers/${customerId}/plans`)).status).toBe(401);
  });

  it.each(ALL)('lists to %s only the builds of the shops they see, newest first, with prices only if they read them', async (signIn) => {
    const { builds, prices } = SEES[signIn];
    const res = await agents[signIn].get(`/api/customers/${customerId}/builds`);
    if (builds === 404) {
      expect([res.status, res.body.error.message]).toEqual([404, 'No such customer']);
      return;
    }
    const shown = [...(builds === 'all' ? [...den, avl] : den)].sort((a, b) => b.id - a.id);
    expect([res.status, res.body]).toStrictEqual([200, { items: shown.map((b) => row(b, prices)), total: shown.length, totalCapped: false, page: 1, pageSize: 10 }]);
  });

  it.each(ALL)("lists to %s the plans of the customer's builds they see, never a quick plan", async (signIn) => {
    const { builds } = SEES[signIn];
    const res = await agents[signIn].get(`/api/customers/${customerId}/plans`);
    if (builds === 404) {
      expect(res.status).toBe(404);
      return;
    }
    const shown = builds === 'all' ? [avlPlan, denPlan] : [denPlan];
    const numbers = new Map([[den[1]!.id, den[1]!.number], [avl.id, avl.number]]);
    expect(res.status).toBe(200);
    expect(res.body).toMatchObject({ total: shown.length, totalCapped: false, page: 1, pageSize: 10 });
    expect(res.body.items as CustomerPlanRow[]).toStrictEqual(
      shown.map((p) => ({ id: p.id, buildId: p.buildId, buildNumber: numbers.get(p.buildId!), name: p.name, version: 2, updatedAt: p.updatedAt, verdict: expect.objectContaining({ kind: expect.any(String) }) })),
    );
  });

  it('pages the builds and refuses pages larger than 50', async () => {
    const first = await agents.lead.get(`/api/customers/${customerId}/builds`).query({ pageSize: 2 });
    const second = await agents.lead.get(`/api/customers/${customerId}/builds`).query({ pageSize: 2, page: 2 });
    expect([first.body.total, first.body.items.map((b: CustomerBuildRow) => b.id), second.body.items.map((b: CustomerBuildRow) => b.id)]).toEqual([
      3, [den[2]!.id, den[1]!.id], [den[0]!.id],
    ]);
    const large = await agents.lead.get(`/api/customers/${customerId}/plans`).query({ pageSize: 51 });
    expect([large.status, large.body.error.fields]).toEqual([400, { pageSize: 'At most 50 rows per page' }]);
  });

  it('answers 404 for a customer that does not exist, and an empty page for one without builds', async () => {
    expect((await agents.owner.get('/api/customers/999999/builds')).status).toBe(404);
    const ids = await demoIds(h.db);
    const quiet = await addCustomer(h.db, ids.location('DEN'));
    const res = await agents.lead.get(`/api/customers/${quiet.id}/plans`);
    expect(res.body).toStrictEqual({ items: [], total: 0, totalCapped: false, page: 1, pageSize: 10 });
  });
});
