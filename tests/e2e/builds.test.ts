import type { Page } from 'playwright-core';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { demoIds } from '../support/api-harness.ts';
import { addCatalogItem, addVendor } from '../support/catalog-fixtures.ts';
import { addDeliveredUnit } from '../support/claim-fixtures.ts';
import { choose, startE2e, type E2e } from '../support/e2e-harness.ts';

let e2e: E2e;
beforeAll(async () => {
  e2e = await startE2e();
});
afterAll(async () => {
  await e2e?.close();
});

/** The parts the technician installs: two units with serial numbers and fuse blocks sold by the piece. */
async function stockParts() {
  const db = e2e.harness.db;
  const vendor = await addVendor(db, { name: 'Harrow Cell Works' });
  await addCatalogItem(db, { vendorId: vendor.id, sku: 'HCW-LFP200', name: 'Harrow 200 Ah house battery', specs: { chemistry: 'lifepo4', capacityAh: 200, nominalV: 12.8 } });
  await addCatalogItem(db, { vendorId: vendor.id, sku: 'HCW-DC40', name: 'Harrow 40 A DC-DC charger', category: 'dc_dc_charger', specs: { outputA: 40 } });
  await addCatalogItem(db, {
    vendorId: vendor.id,
    sku: 'HCW-FB6',
    name: 'Harrow 6-way fuse block',
    category: 'fuse_block',
    specs: { circuits: 6, maxA: 100 },
    serialized: false,
  });
}

/** Presses a status button and waits until the header shows the new status. */
async function move(page: Page, label: string) {
  await page.getByRole('button', { name: `Move to ${label}` }).click();
  await page.locator('.bb-page-header').getByText(label, { exact: true }).waitFor();
}

async function addComponent(page: Page, sku: string, details: { serial?: string; quantity?: number }) {
  const form = page.locator('form').filter({ has: page.getByLabel('Serial number') });
  await choose(page, form, 'Component', sku);
  if (details.quantity) await form.getByLabel('Quantity').fill(String(details.quantity));
  if (details.serial) await form.getByLabel('Serial number').fill(details.serial);
  await form.getByRole('button', { name: 'Add' }).click();
  const row = page.locator('.ant-table-row', { hasText: sku });
  await expect.poll(() => row.filter({ hasText: details.serial ?? sku }).count()).toBe(1);
}

describe('a build from booking to delivery', () => {
  it('the lead books it for a new customer; the technician installs, logs labor and delivers; the serial finds it', async () => {
    await stockParts();

    const lead = await e2e.newPage();
    await e2e.signIn(lead, 'lead@demo.busbar.test');
    await lead.getByRole('navigation').getByText('Builds', { exact: true }).click();
    await lead.getByRole('button', { name: 'New build' }).click();
    const main = lead.locator('#main');
    await choose(lead, main, 'Location', 'DEN');

    await main.getByRole('button', { name: 'New customer' }).click();
    await main.getByLabel('Name').fill('Oriel Fairbank');
    await main.getByLabel('E-mail').fill('oriel.fairbank@example.test');
    await main.getByLabel('Phone').fill('(303) 555-0199');
    await main.getByRole('button', { name: 'Save customer' }).click();
    await main.locator('.ant-select-selection-item', { hasText: 'Oriel Fairbank' }).waitFor();

    await main.getByRole('button', { name: 'New vehicle' }).click();
    await main.getByLabel('Year').fill('2022');
    await choose(lead, main, 'Body style', 'Van');
    await main.getByLabel('Make').fill('Halvard');
    await main.getByLabel('Model').fill('Longbay Heron');
    await main.getByRole('button', { name: 'Save vehicle' }).click();
    await main.locator('.ant-select-selection-item', { hasText: '2022 Halvard Longbay Heron' }).waitFor();

    await choose(lead, main, 'Lead technician', 'Dmitri Castellanos');
    const bookedFor = main.getByLabel('Booked for');
    await bookedFor.click();
    await bookedFor.fill('2026-06-18');
    await bookedFor.press('Enter');
    await main.getByRole('button', { name: 'Create build' }).click();

    const heading = lead.getByRole('heading', { level: 1, name: /^Build DEN-\d+$/ });
    await heading.waitFor();
    const number = (await heading.textContent())!.replace('Build ', '').trim();
    await expect.poll(() => lead.getByText('Oriel Fairbank').count()).toBeGreaterThan(0);
    await move(lead, 'Quoted');
    await move(lead, 'Booked');
    const buildPath = new URL(lead.url()).pathname;

    const tech = await e2e.newPage();
    await e2e.signIn(tech, 'tech@demo.busbar.test');
    await tech.goto(buildPath);
    await tech.getByRole('heading', { level: 1, name: `Build ${number}` }).waitFor();
    // The technician works in the bay; quoting, booking and cancelling stay with the lead.
    expect(await tech.getByRole('button', { name: 'Move to Cancelled' }).count()).toBe(0);
    await move(tech, 'In the bay');

    await addComponent(tech, 'HCW-LFP200', { serial: 'HCW24-000117' });
    await addComponent(tech, 'HCW-DC40', { serial: 'HDC24-5521' });
    await addComponent(tech, 'HCW-FB6', { quantity: 2 });

    await tech.getByLabel('Labor hours').fill('6.5');
    await tech.getByRole('button', { name: 'Save labor' }).click();
    await expect.poll(() => tech.getByText('Labor saved: 6.5 h').count()).toBeGreaterThan(0);
    // Technicians read prices but never purchase cost or margin.
    expect(await tech.getByText('Unit cost').count()).toBe(0);
    expect(await tech.locator('.line', { hasText: 'Margin' }).getByText('Not shown to your role').count()).toBe(1);

    await move(tech, 'Final check');
    await move(tech, 'Delivered');
    await expect.poll(() => tech.getByText('Final check → Delivered').count()).toBe(1);

    const saved = await e2e.harness.db
      .selectFrom('builds')
      .innerJoin('buildItems', 'buildItems.buildId', 'builds.id')
      .select(['builds.status', 'builds.laborHours', 'buildItems.sku', 'buildItems.quantity', 'buildItems.serialNumber'])
      .where('builds.number', '=', number)
      .orderBy('buildItems.id')
      .execute();
    expect(saved.map((r) => [r.sku, r.quantity, r.serialNumber])).toEqual([
      ['HCW-LFP200', 1, 'HCW24-000117'],
      ['HCW-DC40', 1, 'HDC24-5521'],
      ['HCW-FB6', 2, null],
    ]);
    expect(saved[0]).toMatchObject({ status: 'delivered', laborHours: 6.5 });

    await lead.getByRole('link', { name: 'All builds' }).click();
    await lead.getByLabel('Search').fill('HDC24-5521');
    await lead.getByLabel('Search').press('Enter');
    await expect.poll(() => new URL(lead.url()).searchParams.get('q')).toBe('HDC24-5521');
    const rows = lead.locator('.ant-table-row');
    await expect.poll(() => rows.count()).toBe(1);
    expect(await rows.first().textContent()).toContain(number);
    expect(await rows.first().textContent()).toContain('Delivered');

    await tech.context().close();
    await lead.context().close();
  });

  it("fits a phone: a delivered build's page, its components and its claims scroll only downwards", async () => {
    const db = e2e.harness.db;
    const unit = await addDeliveredUnit(db, (await demoIds(db)).location('DEN'));
    const api = await e2e.harness.signedIn('warranty@demo.busbar.test');
    const claim = await api.post('/api/claims').send({ buildItemId: unit.buildItemId, failedOn: '2026-06-10', failureMode: 'will_not_charge', coverage: 'vendor_defect', symptoms: 'No output' });
    expect(claim.status).toBe(201);
    const { vehicleId } = await db.selectFrom('builds').select('vehicleId').where('id', '=', unit.buildId).executeTakeFirstOrThrow();
    await db.updateTable('vehicles').set({ vin: '1M8GDM9AXKP042788', plate: 'WRN 42' }).where('id', '=', vehicleId).execute();

    const lead = await e2e.newPage();
    await lead.setViewportSize({ width: 390, height: 800 });
    await e2e.signIn(lead, 'lead@demo.busbar.test');
    await lead.goto(`/builds/${unit.buildId}`);
    await lead.getByRole('heading', { level: 1, name: /^Build DEN-\d+$/ }).waitFor();
    // The lead sees the most of it: prices and costs, corrections to the components, the claims.
    const row = lead.locator('.ant-table-row', { hasText: unit.item.sku });
    await row.getByRole('button', { name: `Edit ${unit.item.sku}` }).waitFor();
    await lead.getByRole('link', { name: `Claim ${claim.body.number}` }).waitFor();
    // The vehicle's VIN and plate, to tell it is the one in the bay.
    await lead.locator('.facts').getByText('1M8GDM9AXKP042788', { exact: true }).waitFor();
    await lead.locator('.facts').getByText('WRN 42', { exact: true }).waitFor();
    expect(await lead.evaluate(() => document.documentElement.scrollWidth <= document.documentElement.clientWidth)).toBe(true);
    // Each component stacks its facts, the figures named, so nothing is left out for the width.
    expect(await row.innerText()).toContain(`Unit cost $${(unit.item.unitCostCents / 100).toFixed(2)}`);
    await lead.context().close();
  });

  it("books on a phone: the pickers keep the row, the date its field, a new customer's form its buttons", async () => {
    const lead = await e2e.newPage();
    await lead.setViewportSize({ width: 390, height: 900 });
    await e2e.signIn(lead, 'lead@demo.busbar.test');
    await lead.goto('/builds/new');
    const form = (await lead.locator('form').first().boundingBox())!;
    const customer = lead.locator('.ant-form-item', { hasText: 'Customer' }).locator('.ant-select').first();
    await customer.waitFor();
    // Each takes (nearly) the form's width, the "New customer" button going under the picker.
    for (const field of [customer, lead.locator('.ant-picker').first()]) expect((await field.boundingBox())!.width).toBeGreaterThan(form.width * 0.6);
    await lead.getByRole('button', { name: 'New customer' }).click();
    const panel = (await lead.getByRole('region', { name: 'New customer' }).boundingBox())!;
    for (const name of ['Cancel', 'Save customer']) {
      const button = (await lead.getByRole('region', { name: 'New customer' }).getByRole('button', { name, exact: true }).boundingBox())!;
      expect(button.x).toBeGreaterThanOrEqual(panel.x);
      expect(button.x + button.width).toBeLessThanOrEqual(panel.x + panel.width);
    }
    expect(await lead.evaluate(() => document.documentElement.scrollWidth <= document.documentElement.clientWidth)).toBe(true);
    await lead.context().close();
  });
});
