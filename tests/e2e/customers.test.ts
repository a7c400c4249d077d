import type { BuildDetail, PlanView } from '@busbar/shared';
import type { Page } from 'playwright-core';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { demoIds } from '../support/api-harness.ts';
import { addCustomer, addVehicle } from '../support/catalog-fixtures.ts';
import { startE2e, type E2e } from '../support/e2e-harness.ts';

const weekend = {
  systemV: 12,
  gauge: 'awg',
  loads: [{ name: 'LED lights', watts: 10, hoursPerDay: 4 }],
  starterBattery: { capacityAh: 70 },
  trip: { daysParked: 2, daysDriving: 1, driveHoursPerDay: 3 },
  circuits: [],
};

let e2e: E2e;
let customerId: number;
let quietId: number;
let builds: BuildDetail[];
let plan: PlanView;

beforeAll(async () => {
  e2e = await startE2e();
  const { db } = e2e.harness;
  const ids = await demoIds(db);
  const customer = await addCustomer(db, ids.location('DEN'), { name: 'Maren Holloway' });
  customerId = customer.id;
  quietId = (await addCustomer(db, ids.location('DEN'), { name: 'Tobin Quell' })).id;
  const vehicle = await addVehicle(db, customer, { year: 2022, bodyStyle: 'van', make: 'Halvard', model: 'Longbay Wren' });
  const lead = await e2e.harness.signedIn('lead@demo.busbar.test');
  builds = [];
  // Eleven builds: one more than a page holds.
  for (let i = 0; i < 11; i++) builds.push((await lead.post('/api/builds').send({ locationId: customer.locationId, customerId, vehicleId: vehicle.id })).body);
  const quick = (await lead.post('/api/plans').send({ locationId: customer.locationId, name: 'Holloway weekend', input: weekend })).body as PlanView;
  plan = (await lead.post(`/api/plans/${quick.id}/attach`).send({ buildId: builds[3]!.id, version: quick.version })).body;
});
afterAll(async () => {
  await e2e?.close();
});

/** The page scrolls sideways by no more than a pixel of rounding. */
async function expectNoSidewaysScroll(page: Page) {
  expect(await page.evaluate(() => document.documentElement.scrollWidth - document.documentElement.clientWidth)).toBeLessThanOrEqual(1);
}

const card = (page: Page, title: string) => page.locator('.ant-card').filter({ has: page.locator('.ant-card-head-title', { hasText: new RegExp(`^${title}$`) }) });

describe("a customer's page", () => {
  it('lists their builds a page at a time and their plans, each opening its record', async () => {
    const page = await e2e.newPage();
    await e2e.signIn(page, 'lead@demo.busbar.test');
    await page.goto(`/customers/${customerId}`);
    const buildsCard = card(page, 'Builds');
    await buildsCard.getByRole('link', { name: builds[10]!.number }).waitFor();
    expect(await buildsCard.locator('.ant-table-row').count()).toBe(10);
    await expect.poll(() => buildsCard.locator('th', { hasText: 'Total' }).count()).toBe(1);
    await buildsCard.locator('.ant-pagination-item-2').click();
    await buildsCard.getByRole('link', { name: builds[0]!.number }).waitFor();
    expect(await buildsCard.locator('.ant-table-row').count()).toBe(1);

    const plansCard = card(page, 'Power plans');
    await plansCard.getByRole('link', { name: 'Holloway weekend' }).click();
    await page.waitForURL((url) => url.pathname === `/builds/${plan.buildId}` && url.searchParams.get('tab') === 'plan');
  });

  it('says when a customer has no builds or plans yet, and keeps to the phone width', async () => {
    const page = await e2e.newPage();
    await e2e.signIn(page, 'lead@demo.busbar.test');
    await page.goto(`/customers/${quietId}`);
    await card(page, 'Builds').getByText('No builds for this customer at your shops yet.').waitFor();
    await card(page, 'Power plans').getByText("No power plans for this customer's builds yet.").waitFor();
    for (const id of [quietId, customerId]) {
      await page.setViewportSize({ width: 390, height: 800 });
      await page.goto(`/customers/${id}`);
      await card(page, 'Builds').locator('.ant-table-row, .empty-note').first().waitFor();
      await expectNoSidewaysScroll(page);
    }
  });

  it('shows the warranty clerk the builds without their totals', async () => {
    const page = await e2e.newPage();
    await e2e.signIn(page, 'warranty@demo.busbar.test');
    await page.goto(`/customers/${customerId}`);
    const buildsCard = card(page, 'Builds');
    await buildsCard.getByRole('link', { name: builds[10]!.number }).waitFor();
    expect(await buildsCard.locator('th', { hasText: 'Total' }).count()).toBe(0);
  });
});

describe('a vehicle on file', () => {
  it('takes its VIN, plate and miles, asks before the miles go down, and tells it apart when booking', async () => {
    const page = await e2e.newPage();
    await e2e.signIn(page, 'lead@demo.busbar.test');
    await page.goto(`/customers/${customerId}`);
    const vehicles = card(page, 'Vehicles');
    await vehicles.getByRole('button', { name: 'Edit the 2022 Halvard Longbay Wren' }).click();
    const dialog = page.getByRole('dialog', { name: 'Edit vehicle' });
    await dialog.getByLabel('VIN').fill('0hl7wzn81ng275411');
    await dialog.getByRole('button', { name: 'Save vehicle' }).click();
    await dialog.getByText('This VIN does not add up: check each character against the vehicle (the 9th is a check digit)').waitFor();
    await dialog.getByLabel('VIN').fill('0cv7wzn81ng275411');
    await dialog.getByLabel('Plate').fill('bbr 4821');
    await dialog.getByLabel('Miles').fill('48210');
    await dialog.getByRole('button', { name: 'Save vehicle' }).click();
    const row = vehicles.locator('.ant-table-row', { hasText: 'Longbay Wren' });
    await row.getByText('0CV7WZN81NG275411').waitFor();
    await row.getByText('BBR 4821', { exact: true }).waitFor();
    await row.getByText('48,210').waitFor();

    await vehicles.getByRole('button', { name: 'Edit the 2022 Halvard Longbay Wren' }).click();
    await dialog.getByLabel('Miles').fill('4821');
    await dialog.getByRole('button', { name: 'Save vehicle' }).click();
    const confirm = page.locator('.ant-modal-confirm', { hasText: 'Lower the miles on file?' });
    await confirm.getByText('The odometer read 48,210 miles').waitFor();
    await confirm.getByRole('button', { name: 'Save the lower reading' }).click();
    await row.getByText('4,821').waitFor();
    const stored = await e2e.harness.db.selectFrom('vehicles').select(['vin', 'plate', 'mileage']).where('customerId', '=', customerId).executeTakeFirstOrThrow();
    expect(stored).toEqual({ vin: '0CV7WZN81NG275411', plate: 'BBR 4821', mileage: 4821 });

    await page.getByRole('button', { name: 'New build' }).click();
    await page.locator('#main .ant-select-selection-item', { hasText: '2022 Halvard Longbay Wren · plate BBR 4821' }).waitFor();
  });
});
