import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { startHarness, type Harness } from '../support/api-harness.ts';
import { addCatalogItem, addVendor } from '../support/catalog-fixtures.ts';
import { SIGN_INS, type SignIn } from '../support/staff-fixtures.ts';

let h: Harness;

beforeAll(async () => {
  h = await startHarness();
  const { id: vendorId } = await addVendor(h.db);
  await addCatalogItem(h.db, { vendorId, sku: 'LFP-280', specs: { chemistry: 'lifepo4', capacityAh: 280, nominalV: 12.8 } });
  await addCatalogItem(h.db, { vendorId, sku: 'LFP-100', specs: { chemistry: 'lifepo4', capacityAh: 100, nominalV: 12.8 } });
  await addCatalogItem(h.db, { vendorId, sku: 'LFP-100B', specs: { chemistry: 'lifepo4', capacityAh: 100, nominalV: 12.8 } });
  await addCatalogItem(h.db, { vendorId, sku: 'AGM-120', specs: { chemistry: 'agm', capacityAh: 120, nominalV: 12 } });
  await addCatalogItem(h.db, { vendorId, sku: 'LFP-460-OLD', specs: { chemistry: 'lifepo4', capacityAh: 460, nominalV: 12.8 }, active: false });
  await addCatalogItem(h.db, { vendorId, sku: 'DCDC-30', category: 'dc_dc_charger', specs: { outputA: 30 } });
  await addCatalogItem(h.db, { vendorId, sku: 'DCDC-50', category: 'dc_dc_charger', specs: { outputA: 50 } });
});
afterAll(() => h.close());

describe('the sizes the planner rounds to', () => {
  it.each(Object.keys(SIGN_INS) as SignIn[])('answers %s the active catalog sizes, each once, smallest first', async (who) => {
    const agent = await h.signedIn(SIGN_INS[who]);
    const res = await agent.get('/api/plans/stock');
    expect(res.status).toBe(200);
    expect(res.body).toEqual({ bankAh: { lifepo4: [100, 280], agm: [120] }, chargerA: [30, 50] });
  });

  it('asks for a sign-in, and refuses unknown parameters', async () => {
    expect((await (await h.agent()).get('/api/plans/stock')).status).toBe(401);
    expect((await (await h.signedIn(SIGN_INS.tech)).get('/api/plans/stock?all=1')).status).toBe(400);
  });
});
