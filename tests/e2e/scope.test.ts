import type { Page } from 'playwright-core';
import { DEMO_LOCATIONS } from '../../db/demo/network.ts';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { startE2e, type E2e } from '../support/e2e-harness.ts';

let e2e: E2e;
beforeAll(async () => {
  e2e = await startE2e({ history: true });
});
afterAll(async () => {
  await e2e?.close();
});

const EAST: string[] = DEMO_LOCATIONS.filter((l) => l.region === 'EAST').map((l) => l.code);
const fitsWidth = (page: Page) => page.evaluate(() => document.documentElement.scrollWidth <= document.documentElement.clientWidth);
/** The shop codes that begin the build numbers listed. */
const shopsListed = async (page: Page) => new Set((await page.locator('.ant-table-row td:first-child').allTextContents()).map((n) => n.split('-')[0]));

/** The scope the header shows: the choice in its picker, or the one shop of a person who has one. */
const scopeShown = (page: Page) => page.locator('.scope .ant-select-selection-item, .scope__one').first().textContent();

async function look(page: Page, typed: string, chosen: string) {
  // The label names the picker's input, which the picker keeps out of sight: click the picker.
  await page.locator('.scope .ant-select-selector').click();
  await page.keyboard.type(typed);
  await page.keyboard.press('Enter');
  await expect.poll(() => scopeShown(page)).toBe(chosen);
}

describe('the scope in the header', () => {
  it('narrows the builds, the comparison and the claims to a region, then a shop, and outlasts a reload', async () => {
    const page = await e2e.newPage();
    await e2e.signIn(page, 'owner@demo.busbar.test');
    await page.goto('/builds');
    await expect.poll(() => scopeShown(page)).toBe('All 8 shops');
    await expect.poll(async () => (await shopsListed(page)).size).toBeGreaterThan(4);

    await look(page, 'Central', 'Central and Eastern region');
    await expect.poll(async () => [...(await shopsListed(page))].every((code) => EAST.includes(code!))).toBe(true);
    expect((await shopsListed(page)).size).toBeGreaterThan(1);

    await page.getByRole('navigation', { name: 'Main' }).getByRole('link', { name: 'Locations compared' }).click();
    await expect.poll(() => page.locator('.comparison .ant-table-row').count()).toBe(4);
    // A key figure opens the builds behind it, within the same scope: May's deliveries in the region.
    const figure = page.getByRole('link', { name: /^Builds delivered: .*, open the delivered builds of May 2026$/ });
    const delivered = (await figure.getAttribute('aria-label'))!.match(/^Builds delivered: ([\d,]+),/)![1]!;
    expect(Number(delivered.replace(/,/g, ''))).toBeGreaterThan(0);
    await figure.click();
    await page.getByRole('heading', { level: 1, name: 'Builds' }).waitFor();
    expect(Object.fromEntries(new URL(page.url()).searchParams)).toEqual({ status: 'delivered', deliveredFrom: '2026-05-01', deliveredTo: '2026-05-31' });
    await page.getByText(new RegExp(`^1–\\d+ of ${delivered}$`)).waitFor();
    await expect.poll(async () => [...(await shopsListed(page))].every((code) => EAST.includes(code!))).toBe(true);
    await page.goBack();

    await look(page, 'Austin', 'Austin (AUS)');
    await page.getByRole('heading', { level: 1, name: 'Your shop against the network' }).waitFor();
    await page.reload();
    await expect.poll(() => scopeShown(page)).toBe('Austin (AUS)');
    await page.getByRole('navigation', { name: 'Main' }).getByRole('link', { name: 'Claims' }).click();
    await page.getByRole('heading', { level: 1, name: 'Claims' }).waitFor();
    await expect.poll(async () => (await page.locator('.ant-table-row').count()) > 0).toBe(true);
    await expect.poll(async () => (await page.locator('.ant-table-row').allTextContents()).every((row) => !/\b(DEN|BOI|PDX|PHX|DLH|AVL|BTV)-\d/.test(row))).toBe(true);
    await page.context().close();
  });

  it('shows a one-shop person their shop, and fits a phone', async () => {
    const page = await e2e.newPage();
    await page.setViewportSize({ width: 390, height: 844 });
    await e2e.signIn(page, 'lead@demo.busbar.test');
    await page.goto('/builds');
    await expect.poll(() => scopeShown(page)).toBe('Denver (DEN)');
    expect(await page.getByLabel('Looking at').count()).toBe(0);
    expect(await fitsWidth(page)).toBe(true);
    await page.context().close();
  });
});
