import type { Page } from 'playwright-core';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { demoIds } from '../support/api-harness.ts';
import { addParts, createBuild } from '../support/build-fixtures.ts';
import { addCustomer } from '../support/catalog-fixtures.ts';
import { startE2e, type E2e } from '../support/e2e-harness.ts';
import { addPerson, addRole, SIGN_INS } from '../support/staff-fixtures.ts';

let e2e: E2e;
let buildPath: string;
let customerPath: string;
let contact: { email: string; phone: string; addressLine1: string; city: string };

beforeAll(async () => {
  e2e = await startE2e();
  // One Denver build with a battery on it, booked by the lead through the API.
  const db = e2e.harness.db;
  const lead = await e2e.harness.signedIn('lead@demo.busbar.test');
  const { battery } = await addParts(db);
  const build = await createBuild(db, lead, (await demoIds(db)).location('DEN'));
  const res = await lead
    .post(`/api/builds/${build.id}/items`)
    .send({ version: build.version, catalogItemId: battery.id, quantity: 1, serialNumber: 'ACC-0001' });
  expect(res.status).toBe(201);
  buildPath = `/builds/${build.id}`;
  customerPath = `/customers/${build.customerId}`;
  contact = await db.selectFrom('customers').select(['email', 'phone', 'addressLine1', 'city']).where('id', '=', build.customerId).executeTakeFirstOrThrow();
});
afterAll(async () => {
  await e2e?.close();
});

async function signedIn(email: string): Promise<Page> {
  const page = await e2e.newPage();
  await e2e.signIn(page, email);
  return page;
}

/** A table column by its header's text alone (a sortable header also holds the sorter's icons). */
const column = (page: Page, name: string) => page.locator('thead th').filter({ hasText: new RegExp(`^${name}$`) });

/**
 * How many buttons or table columns of this name a page shows once its heading is up. A button's
 * name ends with its text (after its icon's); a column is matched by its header's text alone.
 */
async function countOf(page: Page, path: string, kind: 'button' | 'column', name: string, heading: string) {
  await page.goto(path);
  await page.getByRole('heading', { level: 1, name: heading }).waitFor();
  if (kind === 'column') return column(page, name).count();
  return page.getByRole('button', { name: new RegExp(`(^|\\s)${name}$`) }).count();
}

describe('what each person is offered on the build screens', () => {
  const offers: Record<string, { newBuild: number; newItem: number; newVendor: number }> = {
    'owner@demo.busbar.test': { newBuild: 1, newItem: 1, newVendor: 1 },
    'lead@demo.busbar.test': { newBuild: 1, newItem: 0, newVendor: 0 },
    'tech@demo.busbar.test': { newBuild: 0, newItem: 0, newVendor: 0 },
    'warranty@demo.busbar.test': { newBuild: 0, newItem: 0, newVendor: 0 },
    'accountant@demo.busbar.test': { newBuild: 0, newItem: 0, newVendor: 0 },
  };
  for (const [email, expected] of Object.entries(offers)) {
    it(`offers ${email} only the commands their roles allow`, async () => {
      const page = await signedIn(email);
      const found = {
        newBuild: await countOf(page, '/builds', 'button', 'New build', 'Builds'),
        newItem: await countOf(page, '/catalog', 'button', 'New item', 'Catalog'),
        newVendor: await countOf(page, '/vendors', 'button', 'New vendor', 'Vendors'),
      };
      expect(found).toEqual(expected);
      await page.context().close();
    });
  }

  it('sends a technician who opens the booking form to the no-access page', async () => {
    const page = await signedIn('tech@demo.busbar.test');
    await page.goto('/builds/new');
    await expect.poll(() => page.getByText('No access to this page').count()).toBeGreaterThan(0);
    await page.context().close();
  });
});

describe('money and contact details only where the person reads them', () => {
  it('shows the warranty clerk the serial numbers of a build but no prices', async () => {
    const page = await signedIn('warranty@demo.busbar.test');
    expect(await countOf(page, '/builds', 'column', 'Total', 'Builds')).toBe(0);
    await page.goto(buildPath);
    await page.getByText('ACC-0001').first().waitFor();
    expect(await column(page, 'Unit price').count()).toBe(0);
    expect(await page.getByText('Money', { exact: true }).count()).toBe(0);
    expect(await page.getByText('$').count()).toBe(0);
    await page.context().close();
  });

  it('shows the technician prices and contact details but neither cost nor margin', async () => {
    const page = await signedIn('tech@demo.busbar.test');
    // The same look-ups that find nothing for the clerk and the accountant find the columns here.
    expect(await countOf(page, '/builds', 'column', 'Total', 'Builds')).toBe(1);
    expect(await countOf(page, '/customers', 'column', 'E-mail', 'Customers')).toBe(1);
    await page.goto(buildPath);
    await column(page, 'Unit price').waitFor();
    expect(await page.getByText('$899.00').count()).toBeGreaterThan(0);
    expect(await column(page, 'Unit cost').count()).toBe(0);
    // Cost and margin say they are not shown to the role, not a blank that reads as nothing.
    expect(await page.locator('.line', { hasText: 'Margin' }).getByText('Not shown to your role').count()).toBe(1);
    await page.context().close();
  });

  it('shows the accountant customers without e-mail, phone or address, saying they are not shown to the role', async () => {
    const page = await signedIn('accountant@demo.busbar.test');
    expect(await countOf(page, '/customers', 'column', 'E-mail', 'Customers')).toBe(0);
    await page.goto(customerPath);
    await page.getByText('Vehicles', { exact: true }).waitFor();
    for (const label of ['E-mail', 'Phone', 'Address']) {
      const item = page.locator('.ant-descriptions-item', { has: page.getByText(label, { exact: true }) });
      expect(await item.getByText('Not shown to your role').count(), label).toBe(1);
    }
    for (const value of [contact.email, contact.phone, contact.addressLine1, contact.city]) {
      expect(await page.getByText(value).count(), value).toBe(0);
    }
    await page.context().close();
  });

  it('marks contact details as not shown in the rows of shops where a second role does not read them', async () => {
    const db = e2e.harness.db;
    const ids = await demoIds(db);
    const person = await addPerson(db, { role: 'accountant' });
    await addRole(db, person.id, { role: 'location_lead', locationId: ids.location('AVL') });
    const { passwordHash } = await db.selectFrom('users').select('passwordHash').where('email', '=', SIGN_INS.lead2).executeTakeFirstOrThrow();
    await db.updateTable('users').set({ passwordHash }).where('id', '=', person.id).execute();
    await addCustomer(db, ids.location('DEN'), { name: 'Tamsin Quarrel' });
    const avl = await addCustomer(db, ids.location('AVL'), { name: 'Odile Quarrel' });
    const page = await e2e.newPage();
    await e2e.signIn(page, person.email);
    for (const width of [1280, 390]) {
      await page.setViewportSize({ width, height: 800 });
      await page.goto('/customers?q=Quarrel');
      const row = (name: string) => page.locator('tbody tr', { hasText: name });
      // Visible at both widths: on a phone the table scrolls in its box rather than squeezing columns to nothing.
      await row('Odile Quarrel').getByText(avl.email).waitFor();
      expect(await row('Odile Quarrel').getByText('Not shown to your role').count()).toBe(0);
      // E-mail, phone and city of the Denver customer, where only the accountant's role reaches.
      expect(await row('Tamsin Quarrel').getByText('Not shown to your role').count()).toBe(3);
      expect(await page.evaluate(() => document.documentElement.scrollWidth - document.documentElement.clientWidth)).toBeLessThanOrEqual(1);
    }
    await page.context().close();
  });
});
