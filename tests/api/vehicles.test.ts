import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { demoIds, startHarness, type Agent, type Harness } from '../support/api-harness.ts';
import { addCustomer, addVehicle, auditOf, catalogRows } from '../support/catalog-fixtures.ts';
import { SIGN_INS, type SignIn } from '../support/staff-fixtures.ts';

const ALL = Object.keys(SIGN_INS) as SignIn[];
const STALE = { error: { code: 'stale', message: 'Someone changed this since you opened it. Reload to see their changes.' } };

/** Whether each sign-in may add or change vehicles of customers at Denver and at Asheville. */
const WRITES: Record<SignIn, { DEN: 'ok' | 403 | 404; AVL: 'ok' | 403 | 404 }> = {
  owner: { DEN: 'ok', AVL: 'ok' },
  regional: { DEN: 403, AVL: 404 },
  lead: { DEN: 'ok', AVL: 404 },
  tech: { DEN: 403, AVL: 404 },
  warranty: { DEN: 403, AVL: 404 },
  accountant: { DEN: 403, AVL: 403 },
  lead2: { DEN: 404, AVL: 'ok' },
};

const van = { year: 2022, bodyStyle: 'van', make: 'Fixture Motors', model: 'Camper Tallback', notes: 'Roof rack fitted', vin: '0CV7WZN81NG275411', plate: 'BBR 4821', mileage: 48_210 };
/** The fixture clock's day at Denver and Asheville: a new odometer reading is dated then. */
const READ_ON = { mileageReadOn: '2026-06-15' };

describe('vehicles', () => {
  let h: Harness;
  let ids: Awaited<ReturnType<typeof demoIds>>;
  const agents = {} as Record<SignIn, Agent>;

  beforeAll(async () => {
    h = await startHarness();
    ids = await demoIds(h.db);
    for (const name of ALL) agents[name] = await h.signedIn(SIGN_INS[name]);
  });
  afterAll(() => h.close());

  const vehicleRow = (id: number) => h.db.selectFrom('vehicles').selectAll().where('id', '=', id).executeTakeFirst();

  it('answers 401 without a session', async () => {
    const signedOut = await h.agent();
    expect((await signedOut.post('/api/vehicles').send({ customerId: 1, ...van })).status).toBe(401);
    expect((await signedOut.put('/api/vehicles/1').send({ ...van, version: 1 })).status).toBe(401);
  });

  it.each(ALL)('lets %s add vehicles only where they may, at the customer\'s location', async (signIn) => {
    for (const code of ['DEN', 'AVL'] as const) {
      const customer = await addCustomer(h.db, ids.location(code));
      const before = await catalogRows(h.db);
      const res = await agents[signIn].post('/api/vehicles').send({ customerId: customer.id, ...van });
      const expected = WRITES[signIn][code];
      if (expected !== 'ok') {
        expect([code, res.status]).toEqual([code, expected]);
        expect(await catalogRows(h.db)).toEqual(before);
        continue;
      }
      const vehicle = { id: res.body.id, customerId: customer.id, locationId: ids.location(code), ...van, ...READ_ON, version: 1 };
      expect([res.status, res.body]).toStrictEqual([201, vehicle]);
      expect(await vehicleRow(vehicle.id)).toEqual(vehicle);
    }
  });

  it.each(ALL)('lets %s change vehicles only where they may', async (signIn) => {
    for (const code of ['DEN', 'AVL'] as const) {
      const vehicle = await addVehicle(h.db, await addCustomer(h.db, ids.location(code)));
      const res = await agents[signIn].put(`/api/vehicles/${vehicle.id}`).send({ ...van, version: 1 });
      const expected = WRITES[signIn][code];
      if (expected !== 'ok') {
        expect([code, res.status]).toEqual([code, expected]);
        expect(await vehicleRow(vehicle.id)).toEqual({ ...vehicle, version: 1 });
        continue;
      }
      const after = { ...vehicle, ...van, ...READ_ON, version: 2 };
      expect([res.status, res.body]).toStrictEqual([200, after]);
      expect(await vehicleRow(vehicle.id)).toEqual(after);
    }
  });

  it('shows a new vehicle with its customer', async () => {
    const customer = await addCustomer(h.db, ids.location('DEN'));
    const created = await agents.lead.post('/api/vehicles').send({ customerId: customer.id, ...van });
    const detail = await agents.tech.get(`/api/customers/${customer.id}`);
    expect(detail.body.vehicles).toStrictEqual([created.body]);
  });

  it('names each field in error and writes nothing', async () => {
    const customer = await addCustomer(h.db, ids.location('DEN'));
    const before = await catalogRows(h.db);
    const res = await agents.lead.post('/api/vehicles').send({ customerId: customer.id, year: 1949, bodyStyle: 'hatchback', make: ' ', model: 'X', locationId: ids.location('DEN') });
    expect(res.status).toBe(400);
    expect(res.body.error.fields).toEqual({ year: 'From 1950', bodyStyle: 'Choose a body style', make: 'Enter the make', locationId: 'Unknown field' });
    const vehicle = await addVehicle(h.db, customer);
    const moved = await agents.lead.put(`/api/vehicles/${vehicle.id}`).send({ ...van, customerId: customer.id, version: 1 });
    expect([moved.status, moved.body.error.fields]).toEqual([400, { customerId: 'Unknown field' }]);
    expect(await catalogRows(h.db)).toEqual({ ...before, vehicles: before.vehicles + 1 });
  });

  it('answers 404 for a customer or a vehicle that does not exist', async () => {
    const customer = await agents.owner.post('/api/vehicles').send({ customerId: 999_999, ...van });
    const vehicle = await agents.owner.put('/api/vehicles/999999').send({ ...van, version: 1 });
    expect([customer.status, customer.body.error.message, vehicle.status, vehicle.body.error.message]).toEqual([404, 'No such customer', 404, 'No such vehicle']);
  });

  it('takes one change per version and audits each change with before and after', async () => {
    const leadId = ids.user(SIGN_INS.lead);
    const customer = await addCustomer(h.db, ids.location('DEN'));
    h.clock.now = new Date('2026-06-15T18:00:00Z');
    const created = await agents.lead.post('/api/vehicles').send({ customerId: customer.id, ...van });
    const first = { id: created.body.id, customerId: customer.id, locationId: customer.locationId, ...van, ...READ_ON, version: 1 };
    h.clock.now = new Date('2026-06-15T18:30:00Z');
    const changed = await agents.lead.put(`/api/vehicles/${first.id}`).send({ ...van, year: 2021, version: 1 });
    const second = { ...first, year: 2021, version: 2 };
    expect([changed.status, changed.body]).toStrictEqual([200, second]);
    const again = await agents.owner.put(`/api/vehicles/${first.id}`).send({ ...van, model: 'Something else', version: 1 });
    expect([again.status, again.body]).toEqual([409, STALE]);
    expect(await vehicleRow(first.id)).toEqual(second);
    expect(await auditOf(h.db, 'vehicle', first.id)).toEqual([
      { at: '2026-06-15T18:00:00.000Z', actorId: leadId, action: 'vehicle.create', before: null, after: first },
      { at: '2026-06-15T18:30:00.000Z', actorId: leadId, action: 'vehicle.update', before: first, after: second },
    ]);
  });

  it('keeps the VIN and plate in capitals without spaces around them, and refuses what cannot be one', async () => {
    const customer = await addCustomer(h.db, ids.location('DEN'));
    const typed = await agents.lead.post('/api/vehicles').send({ customerId: customer.id, ...van, vin: ' 0cv7wzn8 1ng275411 ', plate: '  bbr   4821 ' });
    expect([typed.status, typed.body.vin, typed.body.plate]).toEqual([201, '0CV7WZN81NG275411', 'BBR 4821']);
    const before = await catalogRows(h.db);
    const cases: [Record<string, unknown>, Record<string, string>][] = [
      [{ vin: '0CV7WZN82NG275411' }, { vin: 'This VIN does not add up: check each character against the vehicle (the 9th is a check digit)' }],
      [{ vin: '0CV7WZN81NG27541' }, { vin: 'A VIN has 17 characters' }],
      [{ vin: '0CV7WZN81NG27541O' }, { vin: 'A VIN has only digits and letters, never I, O or Q' }],
      [{ plate: 'ABC\u00071234' }, { plate: 'Use letters, digits and the marks on the plate only' }],
      [{ plate: 'ABCDEFGHJKLMN' }, { plate: 'A plate has at most 12 characters' }],
      [{ mileage: -1 }, { mileage: 'Miles cannot be below 0' }],
      [{ mileage: 1200.5 }, { mileage: 'Enter the miles as a whole number' }],
      [{ mileage: 2_000_001 }, { mileage: 'At most 2,000,000 miles' }],
    ];
    for (const [fields, errors] of cases) {
      const res = await agents.lead.post('/api/vehicles').send({ customerId: customer.id, ...van, ...fields });
      expect([res.status, res.body.error?.fields]).toEqual([400, errors]);
    }
    expect(await catalogRows(h.db)).toEqual(before);
  });

  it('takes a vehicle without VIN, plate or miles, and keeps them as they are when a change leaves them out', async () => {
    const customer = await addCustomer(h.db, ids.location('DEN'));
    const { vin, plate, mileage, ...bare } = van;
    const created = await agents.lead.post('/api/vehicles').send({ customerId: customer.id, ...bare, vin: '', plate: '' });
    expect(created.body).toMatchObject({ vin: null, plate: null, mileage: null, mileageReadOn: null });
    const filled = await agents.lead.put(`/api/vehicles/${created.body.id}`).send({ ...van, version: 1 });
    const kept = await agents.lead.put(`/api/vehicles/${created.body.id}`).send({ ...bare, notes: 'Second battery tray', version: 2 });
    expect([kept.status, kept.body]).toStrictEqual([200, { ...filled.body, notes: 'Second battery tray', version: 3 }]);
  });

  it('asks before the miles go down, and dates each new reading at the location', async () => {
    const customer = await addCustomer(h.db, ids.location('DEN'));
    h.clock.now = new Date('2026-06-15T20:00:00Z');
    const created = (await agents.lead.post('/api/vehicles').send({ customerId: customer.id, ...van })).body;
    h.clock.now = new Date('2026-06-16T02:30:00Z'); // still 15 June in Denver
    const lower = await agents.lead.put(`/api/vehicles/${created.id}`).send({ ...van, mileage: 4_821, version: 1 });
    expect([lower.status, lower.body.error]).toEqual([
      409,
      { code: 'mileage_lower', message: 'The odometer read 48,210 miles on 2026-06-15. Save again to confirm the lower reading.', fields: { mileage: 'Lower than the miles on file' } },
    ]);
    expect(await vehicleRow(created.id)).toEqual(created);
    const same = await agents.lead.put(`/api/vehicles/${created.id}`).send({ ...van, version: 1 });
    expect(same.body).toMatchObject({ mileage: 48_210, mileageReadOn: '2026-06-15', version: 2 });
    const confirmed = await agents.lead.put(`/api/vehicles/${created.id}`).send({ ...van, mileage: 4_821, confirmLowerMileage: true, version: 2 });
    expect([confirmed.status, confirmed.body.mileage, confirmed.body.mileageReadOn]).toEqual([200, 4_821, '2026-06-15']);
    const higher = await agents.lead.put(`/api/vehicles/${created.id}`).send({ ...van, mileage: 5_000, version: 3 });
    expect([higher.status, higher.body.mileage]).toEqual([200, 5_000]);
    const refused = await agents.lead.put(`/api/vehicles/${created.id}`).send({ ...van, mileage: 5_000, confirmLowerMileage: false, version: 4 });
    expect([refused.status, refused.body.error.fields]).toEqual([400, { confirmLowerMileage: expect.any(String) }]);
    h.clock.now = new Date('2026-06-15T15:00:00Z');
  });
});
