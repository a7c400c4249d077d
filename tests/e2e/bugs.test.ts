import type { Page } from 'playwright-core';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { demoIds } from '../support/api-harness.ts';
import { addParts, createBuild, moveThrough } from '../support/build-fixtures.ts';
import { addCustomer } from '../support/catalog-fixtures.ts';
import { startE2e, type E2e } from '../support/e2e-harness.ts';
import { addPerson, addRole, SIGN_INS } from '../support/staff-fixtures.ts';

/** Screens people hit trouble on: each case fails on the screen as it was before its fix. */
let e2e: E2e;
let den: number;
let other: number;
let shopLabel: string;

beforeAll(async () => {
  e2e = await startE2e();
  const ids = await demoIds(e2e.harness.db);
  den = ids.location('DEN');
  other = ids.locations.find((l) => l.id !== den)!.id;
  const shop = await e2e.harness.db.selectFrom('locations').select(['code', 'name']).where('id', '=', den).executeTakeFirstOrThrow();
  shopLabel = `${shop.code} ${shop.name}`;
}, 60_000);
afterAll(async () => {
  await e2e?.close();
});

async function signedInPage(who: keyof typeof SIGN_INS): Promise<Page> {
  const page = await e2e.newPage();
  await e2e.signIn(page, SIGN_INS[who]);
  return page;
}

/** The page scrolls sideways by no more than a pixel of rounding. */
async function expectNoSidewaysScroll(page: Page) {
  expect(await page.evaluate(() => document.documentElement.scrollWidth - document.documentElement.clientWidth)).toBeLessThanOrEqual(1);
}

/** A lead's draft build at DEN with a serial-numbered battery not given its serial yet. */
async function buildWithUnrecordedSerial() {
  const lead = await e2e.harness.signedIn(SIGN_INS.lead);
  const build = await createBuild(e2e.harness.db, lead, den);
  const { battery } = await addParts(e2e.harness.db);
  await e2e.harness.db
    .insertInto('buildItems')
    .values({ buildId: build.id, catalogItemId: battery.id, sku: battery.sku, quantity: 1, serialNumber: null, unitPriceCents: battery.unitPriceCents, unitCostCents: battery.unitCostCents, createdAt: '2026-06-01T12:00:00.000Z' })
    .execute();
  return { lead, build };
}

describe('the invite form', () => {
  it('starts with the shop chosen after an invite is sent, and blank after Cancel', async () => {
    const page = await signedInPage('lead');
    await page.goto('/staff');
    const dialog = page.getByRole('dialog');
    const shopChoice = dialog.locator('.ant-select-selection-item', { hasText: shopLabel });

    await page.getByRole('button', { name: 'Invite a person' }).click();
    await shopChoice.waitFor();
    await dialog.getByLabel('Name').fill('Ines Dalgard');
    await dialog.getByLabel('E-mail').fill('ines.dalgard@example.test');
    await dialog.getByRole('button', { name: 'Send invite' }).click();
    await dialog.waitFor({ state: 'hidden' });

    await page.getByRole('button', { name: 'Invite a person' }).click();
    await shopChoice.waitFor();
    expect(await dialog.getByLabel('Name').inputValue()).toBe('');
    await dialog.getByLabel('Name').fill('Half typed');
    await dialog.getByRole('button', { name: 'Cancel' }).click();
    await dialog.waitFor({ state: 'hidden' });

    await page.getByRole('button', { name: 'Invite a person' }).click();
    await shopChoice.waitFor();
    expect(await dialog.getByLabel('Name').inputValue()).toBe('');
    await page.setViewportSize({ width: 390, height: 800 });
    await expectNoSidewaysScroll(page);
    await page.context().close();
  }, 120_000);
});

describe('serial number search', () => {
  it('finds a piece from the middle of a number, and says when it lists only some of the matches', async () => {
    const { build } = await buildWithUnrecordedSerial();
    const line = await e2e.harness.db.selectFrom('buildItems').select(['catalogItemId', 'sku']).where('buildId', '=', build.id).executeTakeFirstOrThrow();
    await e2e.harness.db
      .insertInto('buildItems')
      .values(Array.from({ length: 60 }, (_, i) => ({ buildId: build.id, catalogItemId: line.catalogItemId, sku: line.sku, quantity: 1, serialNumber: `UNIT-QJZ${String(i).padStart(3, '0')}-B`, unitPriceCents: 100, unitCostCents: 50, createdAt: '2026-06-01T12:00:00.000Z' })))
      .execute();

    const page = await signedInPage('owner');
    for (const width of [1280, 390]) {
      await page.setViewportSize({ width, height: 800 });
      await page.goto('/serials?q=qjz017');
      await page.getByText('UNIT-QJZ017-B').waitFor();
      await expectNoSidewaysScroll(page);

      await page.goto('/serials?q=QJZ');
      await page.getByText('Showing 50 of 60 units. Type more of the number to narrow them down.').waitFor();
      expect(await page.locator('tbody tr.ant-table-row').count()).toBe(50);
      await expectNoSidewaysScroll(page);
    }
    await page.context().close();
  }, 120_000);
});

describe('leaving a form with unsaved text', () => {
  async function expectAsked(page: Page, leave: () => Promise<void>, stayPath: string, title: string) {
    await leave();
    const question = page.getByRole('dialog').filter({ hasText: title });
    await question.getByRole('button', { name: 'Keep editing' }).click();
    await question.waitFor({ state: 'hidden' });
    expect(new URL(page.url()).pathname).toBe(stayPath);
    await leave();
    await question.getByRole('button', { name: 'Discard and leave' }).click();
    await page.waitForURL((url) => url.pathname !== stayPath);
  }

  it('asks on the new build, the import and the new customer forms, and not after saving', async () => {
    const page = await signedInPage('lead');
    const toCustomers = () => page.getByRole('navigation').getByText('Customers', { exact: true }).click();

    await page.goto('/builds/new');
    await page.getByLabel('Notes').fill('Fridge and lights, weekend trips');
    await expectAsked(page, toCustomers, '/builds/new', 'Discard this new build?');

    await page.goto('/builds/import');
    await page.getByLabel('CSV').fill('number,customer\n1,Someone');
    await expectAsked(page, toCustomers, '/builds/import', 'Discard this file?');

    // The form is a dialog over the page, so the way out is the browser's Back.
    await page.goto('/builds');
    await toCustomers();
    await page.getByRole('button', { name: 'New customer' }).click();
    await page.getByRole('dialog').getByLabel('Name').fill('Oskar Brenne');
    await expectAsked(page, async () => void (await page.goBack()), '/customers', 'Discard this new customer?');

    // Saved: the page moves on without a question.
    await page.goto('/customers');
    await page.getByRole('button', { name: 'New customer' }).click();
    await page.getByRole('dialog').getByLabel('Name').fill('Oskar Brenne');
    await page.getByRole('dialog').getByRole('button', { name: 'Save customer' }).click();
    await page.waitForURL(/\/customers\/\d+$/);
    await page.context().close();
  }, 120_000);
});

describe('a build', () => {
  it('asks no serial number of a cancelled build', async () => {
    const { lead, build } = await buildWithUnrecordedSerial();
    const page = await signedInPage('lead');
    await page.goto(`/builds/${build.id}`);
    await page.getByText('Serial needed').waitFor();
    await moveThrough(lead, build, ['cancelled']);
    await page.reload();
    await page.getByText('Not needed: build cancelled').waitFor();
    expect(await page.getByText('Serial needed').count()).toBe(0);
    await page.context().close();
  }, 120_000);

  it('says a figure is not shown to the role instead of leaving it blank', async () => {
    const { build } = await buildWithUnrecordedSerial();
    const page = await signedInPage('tech');
    await page.goto(`/builds/${build.id}`);
    const money = page.locator('.ant-card').filter({ hasText: 'Money' });
    await money.getByText('Parts cost').waitFor();
    expect(await money.getByText('Not shown to your role').count()).toBe(2);
    await page.context().close();
  }, 120_000);

  it('says in the list which totals are not shown to a person whose roles read prices at one shop only', async () => {
    const db = e2e.harness.db;
    const person = await addPerson(db, { role: 'location_lead', locationId: den });
    await addRole(db, person.id, { role: 'warranty_clerk', locationId: other });
    const { passwordHash } = await db.selectFrom('users').select('passwordHash').where('email', '=', SIGN_INS.owner).executeTakeFirstOrThrow();
    await db.updateTable('users').set({ passwordHash }).where('id', '=', person.id).execute();
    const owner = await e2e.harness.signedIn(SIGN_INS.owner);
    const [here, there] = [await createBuild(db, owner, den), await createBuild(db, owner, other)];

    const page = await e2e.newPage();
    await e2e.signIn(page, person.email);
    for (const [build, total] of [[here, '$0.00'], [there, 'Not shown to your role']] as const) {
      await page.goto(`/builds?q=${build.number}`);
      const row = page.locator('.ant-table-row', { hasText: build.number });
      await row.waitFor();
      const cell = row.locator('td').nth(await page.locator('th').filter({ hasText: 'Total' }).evaluate((th) => (th as HTMLTableCellElement).cellIndex));
      expect((await cell.textContent())?.trim(), build.number).toBe(total);
    }
    await page.context().close();
  }, 120_000);

  it('asks for the missing booked date in place when moved to Booked', async () => {
    const lead = await e2e.harness.signedIn(SIGN_INS.lead);
    const build = await moveThrough(lead, await createBuild(e2e.harness.db, lead, den), ['quoted']);
    // A phone only looks (no sideways scroll); the wide screen then books it.
    const page = await signedInPage('lead');
    for (const width of [390, 1280]) {
      await page.setViewportSize({ width, height: 800 });
      await page.goto(`/builds/${build.id}`);
      await page.getByRole('button', { name: 'Move to Booked' }).click();
      const asked = page.getByRole('region', { name: 'Before Booked' });
      await asked.getByLabel('Booked for').waitFor();
      expect(await page.locator('.ant-message-notice').count()).toBe(0);
      await expectNoSidewaysScroll(page);
      if (width === 390) continue;
      await asked.getByRole('button', { name: 'Save and move to Booked' }).click();
      await asked.getByText('Choose the day it is booked for').waitFor();
      await asked.getByLabel('Booked for').click();
      await asked.getByLabel('Booked for').fill('2026-07-14');
      await asked.getByLabel('Booked for').press('Enter');
      await asked.getByRole('button', { name: 'Save and move to Booked' }).click();
      await page.getByText(`Build ${build.number} is now Booked`).waitFor();
      await asked.waitFor({ state: 'detached' });
      const saved = await e2e.harness.db.selectFrom('builds').select(['status', 'bookedFor']).where('id', '=', build.id).executeTakeFirstOrThrow();
      expect(saved).toEqual({ status: 'booked', bookedFor: '2026-07-14' });
    }
    await page.context().close();
  }, 120_000);
});

describe('records a person cannot open', () => {
  it('say so with the way back, and offer no "Try again"', async () => {
    const elsewhere = await addCustomer(e2e.harness.db, other);
    const owner = await e2e.harness.signedIn(SIGN_INS.owner);
    const otherBuild = await createBuild(e2e.harness.db, owner, other);
    const page = await signedInPage('lead');
    for (const width of [1280, 390]) {
      await page.setViewportSize({ width, height: 800 });
      for (const [path, words, back] of [
        [`/builds/${otherBuild.id}`, 'This build does not exist, or it belongs to a shop you cannot see.', 'All builds'],
        [`/customers/${elsewhere.id}`, 'This customer does not exist, or it belongs to a shop you cannot see.', 'All customers'],
        ['/claims/987654', 'This claim does not exist, or it belongs to a shop you cannot see.', 'Warranty claims'],
      ] as const) {
        await page.goto(path);
        const alert = page.getByRole('alert').filter({ hasText: words });
        await alert.waitFor();
        expect(await page.getByRole('button', { name: 'Try again' }).count(), path).toBe(0);
        expect(await alert.getByRole('link', { name: back }).count(), path).toBe(1);
        await expectNoSidewaysScroll(page);
      }
    }
    await page.context().close();
  }, 120_000);

  it('say so for a person who does not exist or works at another shop, with the way back and no "Try again"', async () => {
    const elsewhere = await addPerson(e2e.harness.db, { role: 'technician', locationId: other });
    const words = 'This person does not exist, or works at a shop you cannot see.';
    const page = await signedInPage('lead');
    for (const width of [1280, 390]) {
      await page.setViewportSize({ width, height: 800 });
      for (const path of ['/staff/987654', `/staff/${elsewhere.id}`]) {
        await page.goto(path);
        const alert = page.getByRole('alert').filter({ hasText: words });
        await alert.waitFor();
        expect(await page.getByRole('button', { name: 'Try again' }).count(), path).toBe(0);
        expect(await alert.getByRole('link', { name: 'All staff' }).count(), path).toBe(1);
        await expectNoSidewaysScroll(page);
      }
    }
    await page.context().close();
  }, 120_000);

  it('show the accountant that a customer’s notes are not shown to their role', async () => {
    const customer = await addCustomer(e2e.harness.db, den);
    const page = await signedInPage('accountant');
    await page.goto(`/customers/${customer.id}`);
    await page.getByRole('heading', { name: customer.name }).waitFor();
    const notes = page.locator('.ant-descriptions-item', { has: page.getByText('Notes', { exact: true }) });
    expect(await notes.getByText('Not shown to your role').count()).toBe(1);
    await page.context().close();
  }, 120_000);
});
