import request from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { demoIds, startHarness, type Agent, type Harness } from '../support/api-harness.ts';
import { addVendor, auditOf, catalogRows } from '../support/catalog-fixtures.ts';
import { SIGN_INS, type SignIn } from '../support/staff-fixtures.ts';

const ALL = Object.keys(SIGN_INS) as SignIn[];
const NOT_OWNER = ALL.filter((s) => s !== 'owner');
const STALE = { error: { code: 'stale', message: 'Someone changed this since you opened it. Reload to see their changes.' } };

describe('vendors', () => {
  let h: Harness;
  let ownerId: number;
  const agents = {} as Record<SignIn, Agent>;

  beforeAll(async () => {
    h = await startHarness();
    ownerId = (await demoIds(h.db)).user(SIGN_INS.owner);
    for (const name of ALL) agents[name] = await h.signedIn(SIGN_INS[name]);
  });
  afterAll(() => h.close());

  const body = (name: string) => ({ name, rmaEmail: 'Returns@Northwind-Cells.test', defaultWarrantyMonths: 36, notes: 'Ships from Reno' });

  it('answers 401 without a session', async () => {
    expect((await request(h.app).get('/api/vendors')).status).toBe(401);
  });

  it.each(ALL)('lists every vendor by name, in full, to %s', async (signIn) => {
    const cobalt = await addVendor(h.db, { name: `Cobalt Cells ${signIn}` });
    const amber = await addVendor(h.db, { name: `Amberline Power ${signIn}`, active: false });
    const res = await agents[signIn].get('/api/vendors');
    expect(res.status).toBe(200);
    expect(res.body).toMatchObject({ page: 1, pageSize: 200, totalCapped: false, total: res.body.items.length });
    const mine = res.body.items.filter((v: { id: number }) => v.id === cobalt.id || v.id === amber.id);
    expect(mine).toStrictEqual([
      { id: amber.id, name: amber.name, rmaEmail: amber.rmaEmail, defaultWarrantyMonths: 24, notes: '', active: false, version: 1 },
      { id: cobalt.id, name: cobalt.name, rmaEmail: cobalt.rmaEmail, defaultWarrantyMonths: 24, notes: '', active: true, version: 1 },
    ]);
    const names: string[] = res.body.items.map((v: { name: string }) => v.name);
    expect(names).toEqual([...names].sort((a, b) => (a < b ? -1 : a > b ? 1 : 0)));
  });

  it('lets the owner add a vendor, audited', async () => {
    h.clock.now = new Date('2026-06-15T15:10:00Z');
    const res = await agents.owner.post('/api/vendors').send(body('Northwind Cells'));
    expect(res.status).toBe(201);
    const vendor = { id: res.body.id, name: 'Northwind Cells', rmaEmail: 'returns@northwind-cells.test', defaultWarrantyMonths: 36, notes: 'Ships from Reno', active: true, version: 1 };
    expect(res.body).toStrictEqual(vendor);
    const row = await h.db.selectFrom('vendors').selectAll().where('id', '=', vendor.id).executeTakeFirstOrThrow();
    expect(row).toEqual({ ...vendor, active: 1 });
    expect(await auditOf(h.db, 'vendor', vendor.id)).toEqual([
      { at: '2026-06-15T15:10:00.000Z', actorId: ownerId, action: 'vendor.create', before: null, after: vendor },
    ]);
  });

  it.each(NOT_OWNER)('refuses %s adding or changing a vendor, and writes nothing', async (signIn) => {
    const vendor = await addVendor(h.db);
    const before = await catalogRows(h.db);
    const created = await agents[signIn].post('/api/vendors').send(body(`Refused ${signIn}`));
    const changed = await agents[signIn].put(`/api/vendors/${vendor.id}`).send({ ...body('Renamed'), version: 1 });
    expect([created.status, created.body.error.code, changed.status, changed.body.error.code]).toEqual([403, 'forbidden', 403, 'forbidden']);
    expect(await catalogRows(h.db)).toEqual(before);
    const row = await h.db.selectFrom('vendors').select(['name', 'version']).where('id', '=', vendor.id).executeTakeFirstOrThrow();
    expect(row).toEqual({ name: vendor.name, version: 1 });
  });

  it('names each field in error and writes nothing', async () => {
    const before = await catalogRows(h.db);
    const res = await agents.owner.post('/api/vendors').send({ name: ' ', rmaEmail: 'returns', defaultWarrantyMonths: -1, colour: 'red' });
    expect(res.status).toBe(400);
    expect(res.body.error.code).toBe('invalid');
    expect(res.body.error.fields).toEqual({
      name: 'Enter a name',
      rmaEmail: 'Enter a valid e-mail address',
      defaultWarrantyMonths: expect.any(String),
      colour: 'Unknown field',
    });
    expect(await catalogRows(h.db)).toEqual(before);
  });

  it('refuses a second vendor of the same name, whatever its case', async () => {
    const taken = await addVendor(h.db, { name: 'Harbor Solar Supply' });
    const other = await addVendor(h.db);
    const before = await catalogRows(h.db);
    const created = await agents.owner.post('/api/vendors').send(body('harbor solar supply'));
    const renamed = await agents.owner.put(`/api/vendors/${other.id}`).send({ ...body('HARBOR SOLAR SUPPLY'), version: 1 });
    for (const res of [created, renamed]) {
      expect(res.status).toBe(409);
      expect(res.body.error).toMatchObject({ code: 'conflict', fields: { name: 'Already in use' } });
    }
    expect(await catalogRows(h.db)).toEqual(before);
    const kept = await agents.owner.put(`/api/vendors/${taken.id}`).send({ ...body('Harbor Solar Supply'), version: 1 });
    expect(kept.status).toBe(200);
  });

  it('lets the owner change a vendor once per version, audited with before and after', async () => {
    const vendor = await addVendor(h.db, { name: 'Ridgeline Inverters' });
    h.clock.now = new Date('2026-06-15T16:30:00Z');
    const res = await agents.owner.put(`/api/vendors/${vendor.id}`).send({ ...body('Ridgeline Inverters'), active: false, version: 1 });
    expect(res.status).toBe(200);
    const after = { id: vendor.id, name: 'Ridgeline Inverters', rmaEmail: 'returns@northwind-cells.test', defaultWarrantyMonths: 36, notes: 'Ships from Reno', active: false, version: 2 };
    expect(res.body).toStrictEqual(after);

    const again = await agents.owner.put(`/api/vendors/${vendor.id}`).send({ ...body('Ridgeline Power'), version: 1 });
    expect(again.status).toBe(409);
    expect(again.body).toEqual(STALE);
    const row = await h.db.selectFrom('vendors').select(['name', 'version']).where('id', '=', vendor.id).executeTakeFirstOrThrow();
    expect(row).toEqual({ name: 'Ridgeline Inverters', version: 2 });

    const before = { id: vendor.id, name: 'Ridgeline Inverters', rmaEmail: vendor.rmaEmail, defaultWarrantyMonths: 24, notes: '', active: true, version: 1 };
    expect(await auditOf(h.db, 'vendor', vendor.id)).toEqual([
      { at: '2026-06-15T16:30:00.000Z', actorId: ownerId, action: 'vendor.update', before, after },
    ]);
  });

  it('answers 404 for a vendor that does not exist, and 400 for a bad id', async () => {
    const missing = await agents.owner.put('/api/vendors/999999').send({ ...body('Nobody'), version: 1 });
    expect([missing.status, missing.body.error.code]).toEqual([404, 'not_found']);
    const bad = await agents.owner.put('/api/vendors/abc').send({ ...body('Nobody'), version: 1 });
    expect([bad.status, Object.keys(bad.body.error.fields)]).toEqual([400, ['id']]);
  });

  it('needs the version an edit was made against', async () => {
    const vendor = await addVendor(h.db);
    const res = await agents.owner.put(`/api/vendors/${vendor.id}`).send(body(vendor.name));
    expect([res.status, Object.keys(res.body.error.fields)]).toEqual([400, ['version']]);
  });
});
