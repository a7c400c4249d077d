import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { demoIds, startHarness, type Agent, type Harness } from '../support/api-harness.ts';
import { addCustomer, auditOf, catalogRows } from '../support/catalog-fixtures.ts';
import { SIGN_INS, type SignIn } from '../support/staff-fixtures.ts';

const ALL = Object.keys(SIGN_INS) as SignIn[];
const STALE = { error: { code: 'stale', message: 'Someone changed this since you opened it. Reload to see their changes.' } };

/** Whether each sign-in may add or change customers at Denver and at Asheville: 'ok' or the refusal. */
const WRITES: Record<SignIn, { DEN: 'ok' | 403 | 404; AVL: 'ok' | 403 | 404 }> = {
  owner: { DEN: 'ok', AVL: 'ok' },
  regional: { DEN: 403, AVL: 404 },
  lead: { DEN: 'ok', AVL: 404 },
  tech: { DEN: 403, AVL: 404 },
  warranty: { DEN: 403, AVL: 404 },
  accountant: { DEN: 403, AVL: 403 },
  lead2: { DEN: 404, AVL: 'ok' },
};

const contact = {
  email: 'wren.calloway@mail.busbar.test',
  phone: '+1 (720) 555-0190',
  addressLine1: '88 Kestrel Way',
  addressLine2: 'Unit 4',
  city: 'Lakewood',
  region: 'CO',
  postalCode: '80226',
};

describe('adding and changing customers', () => {
  let h: Harness;
  let ids: Awaited<ReturnType<typeof demoIds>>;
  const agents = {} as Record<SignIn, Agent>;

  beforeAll(async () => {
    h = await startHarness();
    ids = await demoIds(h.db);
    for (const name of ALL) agents[name] = await h.signedIn(SIGN_INS[name]);
  });
  afterAll(() => h.close());

  const customerRow = (id: number) => h.db.selectFrom('customers').selectAll().where('id', '=', id).executeTakeFirst();

  it.each(ALL)('lets %s add customers only where they may', async (signIn) => {
    for (const code of ['DEN', 'AVL'] as const) {
      const before = await catalogRows(h.db);
      const body = { locationId: ids.location(code), name: `Wren Calloway ${signIn} ${code}`, ...contact, notes: 'Prefers texts' };
      const res = await agents[signIn].post('/api/customers').send(body);
      const expected = WRITES[signIn][code];
      if (expected !== 'ok') {
        expect([code, res.status]).toEqual([code, expected]);
        expect(await catalogRows(h.db)).toEqual(before);
        continue;
      }
      expect(res.status).toBe(201);
      expect(res.body).toStrictEqual({ id: res.body.id, ...body, version: 1 });
      expect(await customerRow(res.body.id)).toEqual({ id: res.body.id, ...body, version: 1, createdAt: '2026-06-15T15:00:00.000Z' });
    }
  });

  it.each(ALL)('lets %s change customers only where they may', async (signIn) => {
    for (const code of ['DEN', 'AVL'] as const) {
      const { createdAt: _, ...customer } = await addCustomer(h.db, ids.location(code));
      const res = await agents[signIn].put(`/api/customers/${customer.id}`).send({ name: 'Renamed Customer', ...contact, notes: '', version: 1 });
      const expected = WRITES[signIn][code];
      if (expected !== 'ok') {
        expect([code, res.status, Object.keys(res.body)]).toEqual([code, expected, ['error']]);
        expect(await customerRow(customer.id)).toMatchObject({ name: customer.name, version: 1 });
        continue;
      }
      const after = { ...customer, name: 'Renamed Customer', ...contact, version: 2 };
      expect([res.status, res.body]).toStrictEqual([200, after]);
      expect(await customerRow(customer.id)).toMatchObject(after);
    }
  });

  it('names each field in error and writes nothing', async () => {
    const before = await catalogRows(h.db);
    const empty = await agents.lead.post('/api/customers').send({});
    expect([empty.status, Object.keys(empty.body.error.fields).sort()]).toEqual([400, ['locationId', 'name']]);
    const bad = await agents.lead.post('/api/customers').send({ locationId: ids.location('DEN'), name: 'Pax Rudd', email: 'pax@', phone: 'call me', vip: true });
    expect(bad.body.error.fields).toEqual({
      email: 'Enter a valid e-mail address',
      phone: 'Digits, spaces and + ( ) - . only',
      vip: 'Unknown field',
    });
    const customer = await addCustomer(h.db, ids.location('DEN'));
    const moved = await agents.lead.put(`/api/customers/${customer.id}`).send({ name: customer.name, locationId: ids.location('BOI'), version: 1 });
    expect([moved.status, moved.body.error.fields]).toEqual([400, { locationId: 'Unknown field' }]);
    expect(await catalogRows(h.db)).toEqual({ ...before, customers: before.customers + 1 });
  });

  it('answers 404 for a location or a customer that does not exist', async () => {
    const location = await agents.owner.post('/api/customers').send({ locationId: 999_999, name: 'Nobody' });
    const customer = await agents.owner.put('/api/customers/999999').send({ name: 'Nobody', version: 1 });
    expect([location.status, location.body.error.message, customer.status]).toEqual([404, 'No such location', 404]);
  });

  it('takes one change per version and audits each change with before and after', async () => {
    const leadId = ids.user(SIGN_INS.lead);
    h.clock.now = new Date('2026-06-15T16:00:00Z');
    const created = await agents.lead.post('/api/customers').send({ locationId: ids.location('DEN'), name: 'Soren Voss' });
    const first = { id: created.body.id, locationId: ids.location('DEN'), name: 'Soren Voss', email: '', phone: '', addressLine1: '', addressLine2: '', city: '', region: '', postalCode: '', notes: '', version: 1 };
    expect(created.body).toStrictEqual(first);
    h.clock.now = new Date('2026-06-15T16:20:00Z');
    const changed = await agents.lead.put(`/api/customers/${first.id}`).send({ name: 'Soren Voss', phone: '720 555 0111', version: 1 });
    const second = { ...first, phone: '720 555 0111', version: 2 };
    expect([changed.status, changed.body]).toStrictEqual([200, second]);
    const again = await agents.owner.put(`/api/customers/${first.id}`).send({ name: 'Soren Voss Jr', version: 1 });
    expect([again.status, again.body]).toEqual([409, STALE]);
    expect(await customerRow(first.id)).toMatchObject({ name: 'Soren Voss', version: 2 });
    expect(await auditOf(h.db, 'customer', first.id)).toEqual([
      { at: '2026-06-15T16:00:00.000Z', actorId: leadId, action: 'customer.create', before: null, after: first },
      { at: '2026-06-15T16:20:00.000Z', actorId: leadId, action: 'customer.update', before: first, after: second },
    ]);
  });

  it('keeps contact details from the accountant after a change', async () => {
    const customer = await addCustomer(h.db, ids.location('DEN'), { name: 'Tamsin Oakes' });
    const changed = await agents.lead.put(`/api/customers/${customer.id}`).send({ name: 'Tamsin Oakes-Birch', ...contact, version: 1 });
    expect(changed.status).toBe(200);
    const detail = await agents.accountant.get(`/api/customers/${customer.id}`);
    expect(detail.body).toStrictEqual({ id: customer.id, locationId: customer.locationId, name: 'Tamsin Oakes-Birch', version: 2, vehicles: [] });
    const list = await agents.accountant.get('/api/customers').query({ q: 'Oakes-Birch' });
    expect(list.body.items).toStrictEqual([{ id: customer.id, locationId: customer.locationId, name: 'Tamsin Oakes-Birch', version: 2 }]);
  });
});
