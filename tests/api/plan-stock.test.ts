import type { PlanView, QuickPlanSummary } from '@busbar/shared';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { demoIds, startHarness, type Harness } from '../support/api-harness.ts';
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

describe('plans rounded to the catalog', () => {
  // 45 W at 40 % for three parked days is far past a starter battery: a house bank is needed.
  const fridgeWeekend = {
    systemV: 12,
    gauge: 'awg',
    loads: [{ name: 'Fridge', watts: 45, hoursPerDay: 24, dutyCycle: 0.4 }],
    starterBattery: { capacityAh: 70 },
    trip: { daysParked: 3, daysDriving: 1, driveHoursPerDay: 5 },
    circuits: [],
  };

  it('recommends the smallest catalog bank that carries the trip, on the plan and in the list', async () => {
    const tech = await h.signedIn(SIGN_INS.tech);
    const created = await tech.post('/api/plans').send({ locationId: (await demoIds(h.db)).location('DEN'), name: 'Fridge weekend', input: fridgeWeekend });
    expect(created.status).toBe(201);
    const { result } = created.body as PlanView;
    expect(result.recommendedBank).toMatchObject({ rule: 'catalog', size: 280, chemistry: 'lifepo4' });
    expect(result.recommendedBank.minimum).toBeGreaterThan(100);
    const listed = (await tech.get('/api/plans')).body.items as QuickPlanSummary[];
    expect(listed.find((p) => p.id === created.body.id)?.verdict.headline).toContain('280 Ah LiFePO4');
  });
});
