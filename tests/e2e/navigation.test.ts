import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { startE2e, type E2e } from '../support/e2e-harness.ts';

let e2e: E2e;
beforeAll(async () => {
  e2e = await startE2e();
});
afterAll(async () => {
  await e2e?.close();
});

const NAV = ['Overview', 'This week', 'My bay today', 'Builds', 'Quick plans', 'Customers', 'Find a serial', 'Locations compared', 'Catalog', 'Vendors', 'Staff', 'Outbox', 'Audit log'] as const;
type Item = (typeof NAV)[number];
const WORK: Item[] = ['Overview', 'Builds', 'Customers', 'Find a serial', 'Catalog', 'Vendors'];

// What each demo person should find in the navigation, and nothing more.
const expected: Record<string, Item[]> = {
  // The owner opens every page but has no bay or shop week of their own.
  'owner@demo.busbar.test': NAV.filter((item) => item !== 'This week' && item !== 'My bay today'),
  'regional@demo.busbar.test': [...WORK, 'Locations compared', 'Staff'],
  // Quick plans are for those who plan systems with customers: leads and technicians.
  'lead@demo.busbar.test': [...WORK, 'This week', 'My bay today', 'Quick plans', 'Locations compared', 'Staff'],
  'lead2@demo.busbar.test': [...WORK, 'This week', 'My bay today', 'Quick plans', 'Locations compared', 'Staff'],
  'tech@demo.busbar.test': [...WORK, 'My bay today', 'Quick plans'],
  'warranty@demo.busbar.test': WORK,
  'accountant@demo.busbar.test': [...WORK, 'Locations compared'],
};

describe('navigation by role', () => {
  for (const [email, items] of Object.entries(expected)) {
    it(`shows ${email} only ${items.join(', ')}`, async () => {
      const page = await e2e.newPage();
      await e2e.signIn(page, email);
      const nav = page.getByRole('navigation');
      for (const item of NAV) {
        await expect.poll(() => nav.getByText(item, { exact: true }).count()).toBe(items.includes(item) ? 1 : 0);
      }
      await page.context().close();
    });
  }

  it('fits every list on a phone: filters one a line, wide tables scrolling in their own box', async () => {
    const page = await e2e.newPage();
    await e2e.signIn(page, 'owner@demo.busbar.test');
    await page.setViewportSize({ width: 390, height: 844 });
    for (const path of ['/builds', '/plans', '/customers', '/serials?q=KST', '/claims', '/catalog', '/vendors', '/locations', '/staff', '/outbox', '/audit']) {
      await page.goto(path);
      await page.locator('.ant-table').first().waitFor();
      const widths = await page.evaluate(() => [document.documentElement.scrollWidth, document.documentElement.clientWidth]);
      expect(widths[0], path).toBeLessThanOrEqual(widths[1]!);
    }
    await page.context().close();
  });

  it('sends a person without the right to a page to the forbidden page, and an unknown address to not found', async () => {
    const page = await e2e.newPage();
    await e2e.signIn(page, 'tech@demo.busbar.test');
    await page.goto('/outbox');
    await expect.poll(() => page.getByText('No access to this page').count()).toBeGreaterThan(0);
    await page.goto('/no-such-page');
    await expect.poll(() => page.getByText(/not found/i).count()).toBeGreaterThan(0);
    await page.context().close();
  });

  it('rejects a wrong password with a message and keeps the person on the sign-in page', async () => {
    const page = await e2e.newPage();
    await page.goto('/sign-in');
    await page.getByLabel('E-mail').fill('lead@demo.busbar.test');
    await page.getByLabel('Password').fill('not the password');
    await page.getByRole('button', { name: 'Sign in' }).click();
    await expect.poll(() => page.getByText('That e-mail and password do not match an active account').count()).toBeGreaterThan(0);
    expect(new URL(page.url()).pathname).toBe('/sign-in');
    await page.context().close();
  });
});
