import { afterAll, beforeAll, beforeEach, describe, expect, it } from 'vitest';
import { demoIds, startHarness, type Agent, type Harness } from '../support/api-harness.ts';
import { addCatalogItem, addVendor, auditOf, catalogRows } from '../support/catalog-fixtures.ts';
import { SIGN_INS, type SignIn } from '../support/staff-fixtures.ts';

const NOT_OWNER = (Object.keys(SIGN_INS) as SignIn[]).filter((s) => s !== 'owner');
const STALE = { error: { code: 'stale', message: 'Someone changed this since you opened it. Reload to see their changes.' } };

describe('keeping the catalog', () => {
  let h: Harness;
  let owner: Agent;
  let ownerId: number;
  let vendor: { id: number; name: string };
  let before: Awaited<ReturnType<typeof catalogRows>>;

  beforeAll(async () => {
    h = await startHarness();
    owner = await h.signedIn(SIGN_INS.owner);
    ownerId = (await demoIds(h.db)).user(SIGN_INS.owner);
    vendor = await addVendor(h.db, { name: 'Granite Peak Batteries' });
  });
  beforeEach(async () => {
    before = await catalogRows(h.db);
  });
  afterAll(() => h.close());

  const battery = (sku: string) => ({
    sku,
    vendorId: vendor.id,
    category: 'house_battery',
    name: 'Granite 280 Ah LiFePO4',
    specs: { chemistry: 'lifepo4', capacityAh: 280, nominalV: 12.8 },
    serialized: true,
    unitCostCents: 82_000,
    unitPriceCents: 119_000,
    warrantyMonths: 60,
  });

  /** A 400 naming exactly these fields, after which nothing was written. */
  async function expectInvalid(res: { status: number; body: unknown }, fields: Record<string, unknown>) {
    expect(res.status).toBe(400);
    expect(res.body).toEqual({ error: { code: 'invalid', message: 'Some fields need attention', fields } });
    expect(await catalogRows(h.db)).toEqual(before);
  }

  it('lets the owner add an item, with its margin, audited', async () => {
    h.clock.now = new Date('2026-06-15T15:05:00Z');
    const res = await owner.post('/api/catalog').send(battery('GPB-LFP-280'));
    expect(res.status).toBe(201);
    const { vendorId, ...body } = battery('GPB-LFP-280');
    const item = { id: res.body.id, ...body, vendorId, vendorName: 'Granite Peak Batteries', marginCents: 37_000, active: true, version: 1 };
    expect(res.body).toStrictEqual(item);
    const row = await h.db.selectFrom('catalogItems').selectAll().where('id', '=', item.id).executeTakeFirstOrThrow();
    expect({ ...row, specs: JSON.parse(row.specs) }).toEqual({ ...battery('GPB-LFP-280'), id: item.id, serialized: 1, active: 1, version: 1 });
    expect(await auditOf(h.db, 'catalog_item', item.id)).toEqual([
      { at: '2026-06-15T15:05:00.000Z', actorId: ownerId, action: 'catalog_item.create', before: null, after: item },
    ]);
  });

  it.each(NOT_OWNER)('refuses %s adding or changing an item, and writes nothing', async (signIn) => {
    const agent = await h.signedIn(SIGN_INS[signIn]);
    const item = await addCatalogItem(h.db, { vendorId: vendor.id });
    before = await catalogRows(h.db);
    const created = await agent.post('/api/catalog').send(battery(`REFUSED-${signIn}`));
    const changed = await agent.put(`/api/catalog/${item.id}`).send({ ...battery(item.sku), unitCostCents: 1, version: 1 });
    expect([created.status, created.body.error.code, changed.status, changed.body.error.code]).toEqual([403, 'forbidden', 403, 'forbidden']);
    expect(changed.body.error).not.toHaveProperty('unitCostCents');
    expect(await catalogRows(h.db)).toEqual(before);
    const row = await h.db.selectFrom('catalogItems').select(['unitCostCents', 'version']).where('id', '=', item.id).executeTakeFirstOrThrow();
    expect(row).toEqual({ unitCostCents: item.unitCostCents, version: 1 });
  });

  it('names a battery spec that is missing', async () => {
    const { specs, ...rest } = battery('NO-CAP');
    const { capacityAh: _, ...withoutCapacity } = specs;
    await expectInvalid(await owner.post('/api/catalog').send({ ...rest, specs: withoutCapacity }), { 'specs.capacityAh': 'Enter a number' });
  });

  it('names spec fields the category does not have', async () => {
    const res = await owner.post('/api/catalog').send({ ...battery('EXTRA'), specs: { ...battery('EXTRA').specs, watts: 100 } });
    await expectInvalid(res, { 'specs.watts': 'Unknown field' });
  });

  it('checks specs against the category of the item', async () => {
    const res = await owner.post('/api/catalog').send({ ...battery('PANEL'), category: 'solar_panel' });
    await expectInvalid(res, { 'specs.watts': 'Enter a number', 'specs.chemistry': 'Unknown field', 'specs.capacityAh': 'Unknown field', 'specs.nominalV': 'Unknown field' });
  });

  it('names an inverter whose surge is below its continuous rating', async () => {
    const inverter = { ...battery('INV-1'), category: 'inverter', specs: { continuousW: 2000, surgeW: 1500, efficiency: 0.9 } };
    await expectInvalid(await owner.post('/api/catalog').send(inverter), { 'specs.surgeW': 'Surge must be at least the continuous rating' });
  });

  it.each([
    ['unitPriceCents', -1, 'Cannot be negative'],
    ['unitCostCents', 12.5, 'Whole cents'],
    ['sku', 'has space', 'Letters, digits, dot, dash or underscore'],
    ['category', 'toaster', 'Choose a category'],
    ['vendorId', 0, 'Choose a vendor'],
    ['serialized', 'yes', expect.any(String)],
    ['marginCents', 5, 'Unknown field'],
  ])('names a bad %s', async (field, value, message) => {
    await expectInvalid(await owner.post('/api/catalog').send({ ...battery('BAD-1'), [field]: value }), { [field]: message });
  });

  it('names a vendor that does not exist or no longer trades', async () => {
    await expectInvalid(await owner.post('/api/catalog').send({ ...battery('NOV-1'), vendorId: 999_999 }), { vendorId: 'No such vendor' });
    const retired = await addVendor(h.db, { active: false });
    before = await catalogRows(h.db);
    await expectInvalid(await owner.post('/api/catalog').send({ ...battery('NOV-2'), vendorId: retired.id }), { vendorId: 'This vendor is no longer active' });
  });

  it('still edits an item whose vendor has since stopped trading', async () => {
    const retired = await addVendor(h.db, { active: false });
    const item = await addCatalogItem(h.db, { vendorId: retired.id });
    const res = await owner.put(`/api/catalog/${item.id}`).send({ ...battery(item.sku), vendorId: retired.id, active: false, version: 1 });
    expect([res.status, res.body.active, res.body.version]).toEqual([200, false, 2]);
  });

  it('refuses a SKU another item has, whatever its case', async () => {
    const taken = await addCatalogItem(h.db, { vendorId: vendor.id, sku: 'GPB-AGM-100' });
    const other = await addCatalogItem(h.db, { vendorId: vendor.id });
    before = await catalogRows(h.db);
    const created = await owner.post('/api/catalog').send(battery('gpb-agm-100'));
    const changed = await owner.put(`/api/catalog/${other.id}`).send({ ...battery('Gpb-Agm-100'), version: 1 });
    for (const res of [created, changed]) {
      expect(res.status).toBe(409);
      expect(res.body.error).toMatchObject({ code: 'conflict', fields: { sku: 'Already in use' } });
    }
    expect(await catalogRows(h.db)).toEqual(before);
    expect((await owner.put(`/api/catalog/${taken.id}`).send({ ...battery('GPB-AGM-100'), version: 1 })).status).toBe(200);
  });

  it('lets the owner change an item once per version, audited with before and after', async () => {
    const item = await addCatalogItem(h.db, { vendorId: vendor.id, sku: 'GPB-DC-25', name: 'Cairn 25 A charger', category: 'dc_dc_charger', specs: { outputA: 25 }, serialized: false, unitCostCents: 15_000, unitPriceCents: 25_000, warrantyMonths: 24 });
    h.clock.now = new Date('2026-06-15T17:45:00Z');
    const update = { ...battery('GPB-DC-25'), name: 'Cairn 25 A charger', category: 'dc_dc_charger', specs: { outputA: 25 }, serialized: false, unitCostCents: 16_000, unitPriceCents: 26_500, warrantyMonths: 24 };
    const res = await owner.put(`/api/catalog/${item.id}`).send({ ...update, version: 1 });
    expect(res.status).toBe(200);
    const common = { id: item.id, sku: 'GPB-DC-25', vendorId: vendor.id, vendorName: 'Granite Peak Batteries', category: 'dc_dc_charger', name: 'Cairn 25 A charger', specs: { outputA: 25 }, serialized: false, warrantyMonths: 24, active: true };
    const after = { ...common, unitCostCents: 16_000, marginCents: 10_500, unitPriceCents: 26_500, version: 2 };
    expect(res.body).toStrictEqual(after);

    const again = await owner.put(`/api/catalog/${item.id}`).send({ ...update, unitPriceCents: 1, version: 1 });
    expect([again.status, again.body]).toEqual([409, STALE]);
    const row = await h.db.selectFrom('catalogItems').select(['unitPriceCents', 'version']).where('id', '=', item.id).executeTakeFirstOrThrow();
    expect(row).toEqual({ unitPriceCents: 26_500, version: 2 });

    const beforeChange = { ...common, unitCostCents: 15_000, marginCents: 10_000, unitPriceCents: 25_000, version: 1 };
    expect(await auditOf(h.db, 'catalog_item', item.id)).toEqual([
      { at: '2026-06-15T17:45:00.000Z', actorId: ownerId, action: 'catalog_item.update', before: beforeChange, after },
    ]);
  });

  it('answers 404 for an item that does not exist', async () => {
    const res = await owner.put('/api/catalog/999999').send({ ...battery('NONE-1'), version: 1 });
    expect([res.status, res.body.error.code]).toEqual([404, 'not_found']);
  });
});
