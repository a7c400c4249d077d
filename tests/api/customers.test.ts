import { CONTACT_FIELDS } from '@busbar/shared';
import request from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { demoIds, startHarness, type Agent, type Harness } from '../support/api-harness.ts';
import { addCustomer, addVehicle } from '../support/catalog-fixtures.ts';
import { SIGN_INS, type SignIn } from '../support/staff-fixtures.ts';

const ALL = Object.keys(SIGN_INS) as SignIn[];
type Place = 'den' | 'pdx' | 'avl';

/** Whose customers each sign-in reads (regional: WEST, so Denver and Portland). */
const READS: Record<SignIn, Place[]> = {
  owner: ['den', 'pdx', 'avl'],
  regional: ['den', 'pdx'],
  lead: ['den'],
  tech: ['den'],
  warranty: ['den'],
  accountant: ['den', 'pdx', 'avl'],
  lead2: ['avl'],
};

/** Only the accountant reads no contact details. */
const withoutContact = (signIn: SignIn, customer: Record<string, unknown>) => {
  if (signIn !== 'accountant') return customer;
  return Object.fromEntries(Object.entries(customer).filter(([key]) => !(CONTACT_FIELDS as readonly string[]).includes(key)));
};

describe('reading customers', () => {
  let h: Harness;
  const agents = {} as Record<SignIn, Agent>;
  const customers = {} as Record<Place, Record<string, unknown> & { id: number; locationId: number }>;
  let denVehicles: Record<string, unknown>[];

  beforeAll(async () => {
    h = await startHarness();
    const ids = await demoIds(h.db);
    for (const name of ALL) agents[name] = await h.signedIn(SIGN_INS[name]);
    // Names sort Denver, Portland, Asheville; each carries "Quillon" so a search finds only these.
    const seeds = { den: ['DEN', 'Ada Quillon', '303-555-0142'], pdx: ['PDX', 'Bram Quillon', '503-555-0178'], avl: ['AVL', 'Cleo Quillon', '828-555-0123'] } as const;
    for (const [place, [code, name, phone]] of Object.entries(seeds) as [Place, (typeof seeds)[Place]][]) {
      const { createdAt: _, ...row } = await addCustomer(h.db, ids.location(code), { name, email: `${place}.harbor@mail.busbar.test`, phone });
      customers[place] = { ...row, version: 1 };
    }
    const older = await addVehicle(h.db, customers.den, { year: 2016, bodyStyle: 'van', make: 'Fixture Motors', model: 'Longbay Wren' });
    const newer = await addVehicle(h.db, customers.den, { year: 2023, bodyStyle: 'pickup', make: 'Fixture Motors', model: 'Tallgrass Fieldline' });
    denVehicles = [newer, older].map((v) => ({ ...v, version: 1 }));
  });
  afterAll(() => h.close());

  it('answers 401 without a session', async () => {
    expect((await request(h.app).get('/api/customers')).status).toBe(401);
    expect((await request(h.app).get(`/api/customers/${customers.den.id}`)).status).toBe(401);
  });

  it.each(ALL)('lists to %s the customers of their locations, by name', async (signIn) => {
    const res = await agents[signIn].get('/api/customers').query({ q: 'quillon' });
    expect(res.status).toBe(200);
    const items = READS[signIn].map((place) => withoutContact(signIn, customers[place]));
    expect(res.body).toStrictEqual({ items, total: items.length, totalCapped: false, page: 1, pageSize: 50 });
    if (signIn === 'accountant') expect(Object.keys(res.body.items[0]).sort()).toEqual(['id', 'locationId', 'name', 'version']);
  });

  it.each(ALL)('shows %s one customer with vehicles, newest first, or 404 outside their locations', async (signIn) => {
    for (const place of ['den', 'avl'] as const) {
      const res = await agents[signIn].get(`/api/customers/${customers[place].id}`);
      if (!READS[signIn].includes(place)) {
        expect([place, res.status, res.body.error.code]).toEqual([place, 404, 'not_found']);
        continue;
      }
      expect(res.status).toBe(200);
      const vehicles = place === 'den' ? denVehicles : [];
      expect(res.body).toStrictEqual({ ...withoutContact(signIn, customers[place]), vehicles });
      if (signIn === 'accountant') expect(Object.keys(res.body).sort()).toEqual(['id', 'locationId', 'name', 'vehicles', 'version']);
    }
  });

  it('narrows the list to one location, and to nothing outside the person\'s locations', async () => {
    const den = (await demoIds(h.db)).location('DEN');
    const avl = (await demoIds(h.db)).location('AVL');
    const owner = await agents.owner.get('/api/customers').query({ q: 'quillon', locationId: den });
    expect(owner.body.items.map((c: { id: number }) => c.id)).toEqual([customers.den.id]);
    const lead = await agents.lead.get('/api/customers').query({ q: 'quillon', locationId: avl });
    expect([lead.status, lead.body.items, lead.body.total]).toEqual([200, [], 0]);
  });

  it('finds a customer by e-mail or phone only for people who read them', async () => {
    for (const q of ['den.harbor', '555-0142']) {
      const lead = await agents.lead.get('/api/customers').query({ q });
      expect(lead.body.items.map((c: { id: number }) => c.id)).toEqual([customers.den.id]);
      const accountant = await agents.accountant.get('/api/customers').query({ q });
      expect([q, accountant.status, accountant.body.total]).toEqual([q, 200, 0]);
    }
  });

  it('pages through the list', async () => {
    const res = await agents.owner.get('/api/customers').query({ q: 'quillon', page: 2, pageSize: 2 });
    expect(res.body).toStrictEqual({ items: [customers.avl], total: 3, totalCapped: false, page: 2, pageSize: 2 });
  });

  it('names a bad filter and answers 404 for a customer that does not exist', async () => {
    const bad = await agents.owner.get('/api/customers').query({ locationId: 'DEN', page: 0 });
    expect([bad.status, Object.keys(bad.body.error.fields).sort()]).toEqual([400, ['locationId', 'page']]);
    const missing = await agents.owner.get('/api/customers/999999');
    expect([missing.status, missing.body.error.code]).toEqual([404, 'not_found']);
  });
});
