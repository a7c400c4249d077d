import type { Page } from 'playwright-core';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { startE2e, type E2e } from '../support/e2e-harness.ts';

let e2e: E2e;
beforeAll(async () => {
  e2e = await startE2e({ history: true });
});
afterAll(async () => {
  await e2e?.close();
});

const fitsWidth = (page: Page) => page.evaluate(() => document.documentElement.scrollWidth <= document.documentElement.clientWidth);

describe('month close', () => {
  it('the owner sets new royalty terms for Denver from May, and the accountant marks May final with them, on a phone too', async () => {
    const owner = await e2e.newPage();
    await e2e.signIn(owner, 'owner@demo.busbar.test');
    await owner.goto('/locations');
    await owner.getByRole('button', { name: 'Royalty terms of DEN' }).click();
    const dialog = owner.getByRole('dialog', { name: 'Royalty terms of DEN Denver' });
    await dialog.getByText('Jan 2020').waitFor();
    // The harness's clock stands at June 15, 2026; the form offers next month: pick May instead.
    await dialog.getByLabel('From the month of').click();
    await owner.locator('.ant-picker-dropdown:visible .ant-picker-cell', { hasText: 'May' }).click();
    await dialog.getByLabel('Royalty (%)').fill('7');
    await dialog.getByLabel('Marketing fund (%)').fill('95');
    await dialog.getByRole('button', { name: 'Save terms' }).click();
    await dialog.getByText('Royalty and marketing fund together can be at most 100 %').waitFor();
    await dialog.getByLabel('Marketing fund (%)').fill('2');
    await dialog.getByRole('button', { name: 'Save terms' }).click();
    await dialog.getByRole('cell', { name: 'May 2026' }).waitFor();
    expect(await dialog.locator('.ant-table-row').first().textContent()).toMatch(/May 2026\s*7 %\s*2 %/);
    await owner.context().close();

    const accountant = await e2e.newPage();
    await e2e.signIn(accountant, 'accountant@demo.busbar.test');
    await accountant.getByRole('heading', { level: 1, name: 'Month close' }).waitFor();
    const denver = accountant.locator('.ant-table-row', { hasText: 'DEN Denver' });
    await expect.poll(() => denver.textContent()).toMatch(/7 %.*2 %/);
    // May has ended everywhere: Denver's May is the next to close, and closing it asks first.
    await denver.getByText('Open · next to close').waitFor();
    await denver.getByRole('button', { name: 'Mark final' }).click();
    const asked = accountant.getByRole('dialog', { name: 'Mark May 2026 final at DEN Denver?' });
    await asked.getByText('Its figures will not change again.', { exact: false }).waitFor();
    await asked.getByRole('button', { name: 'Mark final' }).click();
    await denver.getByText('Final', { exact: true }).waitFor();
    expect(await denver.getByRole('button', { name: 'Mark final' }).count()).toBe(0);
    // The months to close: June at Denver now, any ended month at the seven others.
    await expect.poll(() => accountant.locator('.to-close').textContent()).toMatch(/Months to close: Jun 2026 at DEN · 7 shops have no month final yet/);
    await accountant.setViewportSize({ width: 390, height: 844 });
    await accountant.getByText('Royalty due (7 %)').waitFor();
    // The demo's shops have no sales tax rate: each card says so.
    expect(await accountant.getByText('Sales tax (No sales tax)').count()).toBe(8);
    // Once the menu has folded to its icons.
    await expect.poll(() => fitsWidth(accountant)).toBe(true);
    await accountant.context().close();
  });
});
