import request from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { startHarness, type Agent, type Harness } from '../support/api-harness.ts';
import { addCatalogItem, addVendor } from '../support/catalog-fixtures.ts';
import { SIGN_INS, type SignIn } from '../support/staff-fixtures.ts';

const ALL = Object.keys(SIGN_INS) as SignIn[];

/** The money each sign-in reads on a catalog item (DESIGN.md, "Roles and scopes"). */
const MONEY: Record<SignIn, 'cost and price' | 'price only' | 'none'> = {
  owner: 'cost and price',
  regional: 'cost and price',
  lead: 'cost and price',
  tech: 'price only',
  warranty: 'none',
  accountant: 'cost and price',
  lead2: 'cost and price',
};

describe('reading the catalog', () => {
  let h: Harness;
  const agents = {} as Record<SignIn, Agent>;
  let vendor: { id: number; name: string };
  /** The fixture vendor's items as the owner reads them, in the catalog's order. */
  let full: Record<'alpine' | 'ridge' | 'charger' | 'panel' | 'retired', Record<string, unknown>>;

  beforeAll(async () => {
    h = await startHarness();
    for (const name of ALL) agents[name] = await h.signedIn(SIGN_INS[name]);
    vendor = await addVendor(h.db, { name: 'Tamarack Energy' });
    const vendorId = vendor.id;
    const panel = await addCatalogItem(h.db, { vendorId, sku: 'TAM-PV-200', name: 'Flatiron 200 W panel', category: 'solar_panel', specs: { watts: 200 }, serialized: false, unitCostCents: 9_000, unitPriceCents: 16_500, warrantyMonths: 120 });
    const ridge = await addCatalogItem(h.db, { vendorId, sku: 'TAM-LFP-200', name: 'Ridge 200 Ah LiFePO4', unitCostCents: 70_000, unitPriceCents: 109_900, warrantyMonths: 60, specs: { chemistry: 'lifepo4', capacityAh: 200, nominalV: 12.8 } });
    const charger = await addCatalogItem(h.db, { vendorId, sku: 'TAM-DC-40', name: 'Switchback 40 A DC-DC charger', category: 'dc_dc_charger', specs: { outputA: 40 }, unitCostCents: 21_000, unitPriceCents: 32_000, warrantyMonths: 24 });
    const alpine = await addCatalogItem(h.db, { vendorId, sku: 'TAM-LFP-100', name: 'Alpine 100 Ah LiFePO4', unitCostCents: 38_000, unitPriceCents: 59_900, warrantyMonths: 60 });
    const retired = await addCatalogItem(h.db, { vendorId, sku: 'TAM-AGM-90', name: 'Old 90 Ah AGM', specs: { chemistry: 'agm', capacityAh: 90, nominalV: 12 }, unitCostCents: 15_000, unitPriceCents: 24_000, active: false });
    const view = (item: typeof panel, marginCents: number) => ({
      id: item.id, sku: item.sku, vendorId, vendorName: 'Tamarack Energy', category: item.category, name: item.name, specs: item.specs,
      serialized: item.serialized === 1, unitCostCents: item.unitCostCents, marginCents, unitPriceCents: item.unitPriceCents,
      warrantyMonths: item.warrantyMonths, active: item.active === 1, version: 1,
    });
    full = {
      alpine: view(alpine, 21_900),
      ridge: view(ridge, 39_900),
      charger: view(charger, 11_000),
      panel: view(panel, 7_500),
      retired: view(retired, 9_000),
    };
  });
  afterAll(() => h.close());

  /** An item as a sign-in may read it: cost and margin gone for technicians, prices too for clerks. */
  function seenBy(signIn: SignIn, item: Record<string, unknown>) {
    const { unitCostCents, marginCents, unitPriceCents, ...rest } = item;
    if (MONEY[signIn] === 'none') return rest;
    if (MONEY[signIn] === 'price only') return { ...rest, unitPriceCents };
    return { ...rest, unitCostCents, marginCents, unitPriceCents };
  }

  it('answers 401 without a session', async () => {
    expect((await request(h.app).get('/api/catalog')).status).toBe(401);
    expect((await request(h.app).get(`/api/catalog/${full.ridge.id}`)).status).toBe(401);
  });

  it.each(ALL)('lists active items by category, then name, with the money %s may read', async (signIn) => {
    const res = await agents[signIn].get('/api/catalog').query({ vendorId: vendor.id });
    expect(res.status).toBe(200);
    const order = [full.alpine, full.ridge, full.charger, full.panel];
    expect(res.body).toStrictEqual({ items: order.map((i) => seenBy(signIn, i)), total: 4, totalCapped: false, page: 1, pageSize: 50 });
  });

  it.each(ALL)('shows one item with the money %s may read', async (signIn) => {
    const res = await agents[signIn].get(`/api/catalog/${full.charger.id}`);
    expect(res.status).toBe(200);
    expect(res.body).toStrictEqual(seenBy(signIn, full.charger));
  });

  it.each([
    ['category', { category: 'house_battery' }, ['alpine', 'ridge']],
    ['SKU text, any case', { q: 'tam-dc' }, ['charger']],
    ['name text', { q: 'RIDGE' }, ['ridge']],
    ['a literal %', { q: '%' }, []],
    ['retired only', { active: 'false' }, ['retired']],
    ['active or not', { active: 'all', category: 'house_battery' }, ['alpine', 'retired', 'ridge']],
  ] as const)('filters by %s', async (_label, filter, expected) => {
    const res = await agents.lead.get('/api/catalog').query({ vendorId: vendor.id, ...filter });
    expect(res.status).toBe(200);
    expect(res.body.items.map((i: { id: number }) => i.id)).toEqual(expected.map((k) => full[k].id));
    expect(res.body.total).toBe(expected.length);
  });

  it('pages through the list', async () => {
    const res = await agents.tech.get('/api/catalog').query({ vendorId: vendor.id, page: 2, pageSize: 3 });
    expect(res.status).toBe(200);
    expect(res.body).toStrictEqual({ items: [seenBy('tech', full.panel)], total: 4, totalCapped: false, page: 2, pageSize: 3 });
  });

  it('shows a retired item on its own page too', async () => {
    const res = await agents.warranty.get(`/api/catalog/${full.retired.id}`);
    expect(res.status).toBe(200);
    expect(res.body).toStrictEqual(seenBy('warranty', full.retired));
  });

  it('names a bad filter', async () => {
    const res = await agents.owner.get('/api/catalog').query({ active: 'maybe', pageSize: 500, colour: 'red' });
    expect(res.status).toBe(400);
    expect(Object.keys(res.body.error.fields).sort()).toEqual(['active', 'colour', 'pageSize']);
  });

  it('answers 404 for an item that does not exist', async () => {
    const res = await agents.owner.get('/api/catalog/999999');
    expect([res.status, res.body.error.code]).toEqual([404, 'not_found']);
  });
});
