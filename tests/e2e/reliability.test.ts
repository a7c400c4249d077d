import type { Locator, Page } from 'playwright-core';
import { DEMO_SIGN_INS } from '../../db/demo/network.ts';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { startE2e, type E2e } from '../support/e2e-harness.ts';

let e2e: E2e;
beforeAll(async () => {
  e2e = await startE2e({ history: true });
});
afterAll(async () => {
  await e2e?.close();
});

/** The demo's manager of the EAST region, Austin's. */
const EAST_MANAGER = DEMO_SIGN_INS.find((p) => p.role === 'regional_manager' && 'region' in p && p.region === 'EAST')!.email;

/** No sideways scrolling at the page's current width. */
const fitsWidth = (page: Page) => page.evaluate(() => document.documentElement.scrollWidth <= document.documentElement.clientWidth);
const figure = (page: Page, label: string) =>
  page.locator('.figure-card').filter({ has: page.getByText(label, { exact: true }) }).locator('.figure-value').textContent();
const funnelRow = (page: Page, text: string): Locator => page.locator('.ant-table-row').filter({ hasText: text });

describe('component reliability', () => {
  it("the regional manager sees the funnel flag Austin's house batteries and opens Austin's own survival curve", async () => {
    const page = await e2e.newPage();
    await e2e.signIn(page, EAST_MANAGER);
    await page.getByRole('navigation').getByText('Reliability', { exact: true }).click();
    await page.getByRole('heading', { level: 1, name: 'Component reliability' }).waitFor();
    await page.locator('.ant-segmented').getByText('Category', { exact: true }).click();
    await expect.poll(() => new URL(page.url()).searchParams.get('groupBy')).toBe('category');
    await page.getByRole('link', { name: 'House battery', exact: true }).click();

    await page.getByRole('heading', { level: 1, name: 'House battery' }).waitFor();
    const austin = funnelRow(page, 'AUS Austin');
    await austin.getByText('Above the 99.8 % limit').waitFor();
    // The region's other shops are named and within the limits; shops of other regions stay unnamed.
    for (const code of ['DLH', 'AVL']) expect(await funnelRow(page, code).count(), code).toBe(1);
    expect(await funnelRow(page, 'Another shop').count()).toBeGreaterThan(0);
    expect(await funnelRow(page, 'DEN Denver').count()).toBe(0);
    expect(await austin.locator('td').nth(5).textContent()).toMatch(/^\d+ of \d+ \(\d+ %\)$/);
    const [unitMonths, failures] = await Promise.all([austin.locator('td').nth(1).textContent(), austin.locator('td').nth(2).textContent()]);
    const allUnits = await figure(page, 'Units installed');
    // Units on builds with a power plan, by how close their design came to its limits.
    const margins = page.locator('.ant-card').filter({ has: page.getByText('Design margins', { exact: true }) });
    await margins.getByText(/^[\d,]+ of [\d,]+ units are on builds with a power plan/).waitFor();
    expect(await margins.getByRole('table', { name: "Tightest circuit's voltage drop against its limit" }).locator('tbody tr').count()).toBe(4);

    await austin.getByRole('button', { name: 'Show AUS only' }).click();
    await page.getByText('Showing units at AUS Austin.').waitFor();
    const { id: austinId } = await e2e.harness.db.selectFrom('locations').select('id').where('code', '=', 'AUS').executeTakeFirstOrThrow();
    expect(new URL(page.url()).searchParams.get('locations')).toBe(String(austinId));
    // The figures and the curve are now Austin's: its unit-months and failures are the funnel's.
    await expect.poll(() => figure(page, 'Unit-months in service')).toBe(unitMonths);
    expect(await figure(page, 'Failures')).toBe(failures);
    expect(await figure(page, 'Units installed')).not.toBe(allUnits);
    const curve = page.locator('.survival-frame[role="img"]');
    expect(await curve.getAttribute('aria-label')).toMatch(/^Share of units at AUS Austin still working by months in service\. After [\d.]+ months, [\d.]+ % still work/);
    expect(await curve.locator('svg path').count()).toBeGreaterThan(2);
    // Austin's own claims: most of them its workmanship.
    const paid = page.locator('.ant-card').filter({ has: page.getByText('Who paid', { exact: true }) });
    expect(await paid.locator('tbody th').first().textContent()).toContain("Shop's workmanship");

    // The way back keeps the grouping and the shop.
    await page.getByRole('link', { name: /Component reliability$/ }).click();
    await page.getByRole('heading', { level: 1, name: 'Component reliability' }).waitFor();
    const query = new URL(page.url()).searchParams;
    expect([query.get('groupBy'), query.get('locations')]).toEqual(['category', String(austinId)]);
    await page.locator('.ant-select-selection-item').getByText('AUS Austin').waitFor();
    await page.context().close();
  });

  it("lists the bad batch of DC-DC chargers to watch, and opens the item at that quarter's install months", async () => {
    const page = await e2e.newPage();
    await e2e.signIn(page, 'owner@demo.busbar.test');
    await page.goto('/reliability');
    const watch = page.locator('.ant-card').filter({ has: page.getByText('Components to watch', { exact: true }) });
    const batch = watch.locator('li').filter({ has: page.getByRole('link', { name: /^TDW-DC40 .*, installed \w{3} 2025 – \w{3} 2025$/ }) }).first();
    await batch.waitFor();
    expect(await batch.textContent()).toMatch(/Installed 2025-\d\d to 2025-\d\d: \d+ failures where [\d.]+ were expected/);
    await batch.getByRole('link').click();
    await page.getByRole('heading', { level: 1, name: /^TDW-DC40 / }).waitFor();
    const query = new URL(page.url()).searchParams;
    expect([query.get('from'), query.get('to')].every((month) => /^2025-\d\d$/.test(month ?? ''))).toBe(true);
    expect(await page.getByPlaceholder('First month').inputValue()).toMatch(/^\w{3} 2025$/);
    await page.locator('.figure-card').first().waitFor();
    await page.context().close();
  });

  it('fits a phone: the list and a detail scroll only downwards', async () => {
    const page = await e2e.newPage();
    await e2e.signIn(page, EAST_MANAGER);
    await page.setViewportSize({ width: 390, height: 844 });
    await page.goto('/reliability');
    await page.getByText('Components to watch').waitFor();
    await page.locator('.ant-table-row').first().waitFor();
    expect(await fitsWidth(page)).toBe(true);
    await page.goto('/reliability/category/house_battery');
    await funnelRow(page, 'AUS Austin').waitFor();
    await page.locator('.survival-frame svg').waitFor();
    expect(await fitsWidth(page)).toBe(true);
    await page.context().close();
  });

  it('shows a lead their shop against the network without naming other shops', async () => {
    const page = await e2e.newPage();
    await e2e.signIn(page, 'lead@demo.busbar.test');
    await page.getByRole('navigation').getByText('Reliability', { exact: true }).click();
    await page.locator('.ant-table-row').first().waitFor();
    // The shop's rates read beside the network's.
    await page.getByRole('columnheader', { name: /Network, per 1,000 unit-months/ }).waitFor();
    // A link naming another shop (Austin) drops that shop: the page shows the lead's own.
    const { id: austinId } = await e2e.harness.db.selectFrom('locations').select('id').where('code', '=', 'AUS').executeTakeFirstOrThrow();
    await page.goto(`/reliability/category/house_battery?locations=${austinId}`);
    await funnelRow(page, 'DEN Denver').waitFor();
    await expect.poll(() => new URL(page.url()).searchParams.has('locations')).toBe(false);
    expect(await page.locator('.survival-frame').getAttribute('aria-label')).toMatch(/^Share of units at DEN Denver still working/);
    // The page knows the lead's one shop by now: one shop needs no shop picker.
    expect(await page.getByText('Shops', { exact: true }).count()).toBe(0);
    const rows = await page.locator('.ant-table-row').allTextContents();
    expect(rows.filter((text) => text.includes('Another shop')).length).toBe(rows.length - 1);
    // The lead's own shop leads the funnel's table, wherever its exposure places it among the others.
    expect(rows[0]).toContain('DEN Denver');
    const others = await e2e.harness.db.selectFrom('locations').select(['code', 'name']).where('code', '!=', 'DEN').execute();
    expect(others.length).toBe(7);
    for (const { code, name } of others) {
      expect(await page.locator('#main').getByText(new RegExp(`\\b(${code}|${name})\\b`)).count(), code).toBe(0);
    }
    // The page is already the lead's one shop: nothing to narrow to.
    expect(await page.getByRole('button', { name: /^Show .* only$/ }).count()).toBe(0);
    await page.context().close();
  });

  it('leaves reliability out of the menu of those who may not read it', async () => {
    const page = await e2e.newPage();
    await e2e.signIn(page, 'tech@demo.busbar.test');
    await page.getByRole('navigation').getByText('Builds', { exact: true }).waitFor();
    expect(await page.getByRole('navigation').getByText('Reliability', { exact: true }).count()).toBe(0);
    await page.goto('/reliability/category/house_battery');
    await expect.poll(() => page.getByText('No access to this page').count()).toBeGreaterThan(0);
    await page.context().close();
  });
});
