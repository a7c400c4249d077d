import { COST_FIELDS, PRICE_FIELDS, type BuildDetail } from '@busbar/shared';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { demoIds, startHarness, type Agent, type Harness } from '../support/api-harness.ts';
import { addCustomerWithVehicle, addParts, createBuild } from '../support/build-fixtures.ts';
import { SIGN_INS, signInEveryone, type SignIn } from '../support/staff-fixtures.ts';

let h: Harness;
let agents: Record<SignIn, Agent>;
let mine: BuildDetail; // Denver, led by tech@
let others: BuildDetail; // Denver, no lead technician
let avl: BuildDetail; // Asheville, in the other region
let parts: Awaited<ReturnType<typeof addParts>>;
let ids: Awaited<ReturnType<typeof demoIds>>;

beforeAll(async () => {
  h = await startHarness();
  ids = await demoIds(h.db);
  parts = await addParts(h.db);
  agents = await signInEveryone(h);
  mine = await createBuild(h.db, agents.lead, ids.location('DEN'), { leadTechnicianId: ids.user(SIGN_INS.tech) });
  const added = await agents.lead.post(`/api/builds/${mine.id}/items`).send({ version: mine.version, catalogItemId: parts.fuse.id, quantity: 3 });
  mine = added.body;
  others = await createBuild(h.db, agents.lead, ids.location('DEN'));
  avl = await createBuild(h.db, agents.lead2, ids.location('AVL'));
});
afterAll(() => h.close());

const listed = async (who: SignIn) => ((await agents[who].get('/api/builds?pageSize=200')).body.items as { id: number }[]).map((b) => b.id).sort();

describe('who sees which builds', () => {
  it.each([
    ['owner', ['mine', 'others', 'avl']],
    ['regional', ['mine', 'others']],
    ['lead', ['mine', 'others']],
    ['tech', ['mine', 'others']],
    ['warranty', ['mine', 'others']],
    ['accountant', ['mine', 'others', 'avl']],
    ['lead2', ['avl']],
  ] as [SignIn, string[]][])('lists for %s exactly %j', async (who, names) => {
    const byName: Record<string, number> = { mine: mine.id, others: others.id, avl: avl.id };
    expect(await listed(who)).toEqual(names.map((n) => byName[n]).sort());
  });

  it('answers 404 for a build of a location the person cannot see', async () => {
    for (const who of ['lead', 'tech', 'warranty', 'regional'] as SignIn[]) expect((await agents[who].get(`/api/builds/${avl.id}`)).status).toBe(404);
    expect((await agents.lead2.get(`/api/builds/${mine.id}`)).status).toBe(404);
    expect((await agents.lead2.patch(`/api/builds/${mine.id}`).send({ version: mine.version, notes: 'x' })).status).toBe(404);
  });
});

describe('what each person may change', () => {
  it.each([
    ['owner', 201],
    ['lead', 201],
    ['lead2', 404],
    ['regional', 403],
    ['tech', 403],
    ['warranty', 403],
    ['accountant', 403],
  ] as [SignIn, number][])('lets %s book a Denver build: %i', async (who, status) => {
    const { customer, vehicle } = await addCustomerWithVehicle(h.db, ids.location('DEN'));
    const before = await h.db.selectFrom('builds').select((eb) => eb.fn.countAll<number>().as('n')).executeTakeFirstOrThrow();
    const res = await agents[who].post('/api/builds').send({ locationId: ids.location('DEN'), customerId: customer.id, vehicleId: vehicle.id });
    expect(res.status).toBe(status);
    const after = await h.db.selectFrom('builds').select((eb) => eb.fn.countAll<number>().as('n')).executeTakeFirstOrThrow();
    expect(Number(after.n) - Number(before.n)).toBe(status === 201 ? 1 : 0);
  });

  it.each([
    ['tech', 'mine', 200],
    ['tech', 'others', 403],
    ['warranty', 'mine', 403],
    ['accountant', 'mine', 403],
    ['regional', 'mine', 403],
    ['lead', 'others', 200],
  ] as [SignIn, 'mine' | 'others', number][])('lets %s edit the notes of %s: %i', async (who, which, status) => {
    const id = (which === 'mine' ? mine : others).id;
    const current = (await agents.owner.get(`/api/builds/${id}`)).body;
    const res = await agents[who].patch(`/api/builds/${id}`).send({ version: current.version, notes: `by ${who}` });
    expect(res.status).toBe(status);
    expect((await agents.owner.get(`/api/builds/${id}`)).body.notes).toBe(status === 200 ? `by ${who}` : current.notes);
  });

  it('keeps the planning of a build (customer, lead technician, booked date) to the lead', async () => {
    const current = (await agents.owner.get(`/api/builds/${mine.id}`)).body;
    const res = await agents.tech.patch(`/api/builds/${mine.id}`).send({ version: current.version, bookedFor: '2026-07-04' });
    expect(res.status).toBe(403);
  });

  it('refuses a lead technician, customer or vehicle from elsewhere, naming the field', async () => {
    const current = (await agents.lead.get(`/api/builds/${others.id}`)).body;
    const avlCustomer = await addCustomerWithVehicle(h.db, ids.location('AVL'));
    const res = await agents.lead.patch(`/api/builds/${others.id}`).send({
      version: current.version,
      leadTechnicianId: ids.user(SIGN_INS.lead2),
      customerId: avlCustomer.customer.id,
    });
    expect(res.status).toBe(400);
    expect(res.body.error.fields).toEqual({ customerId: 'Choose a customer of this location', leadTechnicianId: 'Choose a technician of this location' });
  });
});

describe('money fields by role', () => {
  const moneyOf = (body: Record<string, unknown>) => Object.keys(body).filter((k) => k.endsWith('Cents')).sort();

  it('shows the warranty clerk no price and no cost, in the list, the detail and the items', async () => {
    const hidden: string[] = [...COST_FIELDS, ...PRICE_FIELDS];
    const detail = (await agents.warranty.get(`/api/builds/${mine.id}`)).body;
    const row = (await agents.warranty.get('/api/builds')).body.items.find((b: { id: number }) => b.id === mine.id);
    for (const body of [detail, row, ...detail.items]) for (const field of hidden) expect(body).not.toHaveProperty(field);
    expect(detail.items[0]).toMatchObject({ sku: parts.fuse.sku, quantity: 3 });
  });

  it('shows the technician prices but no cost or margin, and the accountant and the lead all of it', async () => {
    const tech = (await agents.tech.get(`/api/builds/${mine.id}`)).body;
    expect(moneyOf(tech)).toEqual(['laborCents', 'laborRateCents', 'partsPriceCents', 'totalCents']);
    expect(Object.keys(tech.items[0])).not.toContain('unitCostCents');
    const all = ['laborCents', 'laborRateCents', 'marginCents', 'partsCostCents', 'partsPriceCents', 'totalCents'];
    for (const who of ['accountant', 'lead', 'regional'] as SignIn[]) {
      const body = (await agents[who].get(`/api/builds/${mine.id}`)).body;
      expect(moneyOf(body)).toEqual(all);
      expect(body.items[0]).toMatchObject({ unitPriceCents: 1250, unitCostCents: 410 });
    }
  });
});

describe('who may lead a build', () => {
  it("lists a location's active technicians and leads to those who see the location, and 404 to others", async () => {
    const den = ids.location('DEN');
    const res = await agents.lead.get(`/api/locations/${den}/technicians`);
    const expected = await h.db
      .selectFrom('users as u')
      .innerJoin('roleAssignments as ra', 'ra.userId', 'u.id')
      .select(['u.id', 'u.name'])
      .where('ra.locationId', '=', den)
      .where('ra.role', 'in', ['technician', 'location_lead'])
      .orderBy('u.name')
      .execute();
    expect(res.body).toEqual(expected);
    expect(res.body.map((p: { name: string }) => p.name)).toEqual(expect.arrayContaining(['Dmitri Castellanos', 'Priya Halvorsen']));
    expect((await agents.lead2.get(`/api/locations/${den}/technicians`)).status).toBe(404);
  });
});
