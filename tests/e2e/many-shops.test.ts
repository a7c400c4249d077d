import type { Page } from 'playwright-core';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { startE2e, type E2e } from '../support/e2e-harness.ts';

/** Shops added to the demo's 8 in a region of their own: more than a report shows on one page. */
const ADDED = 30;
const SHOPS = 8 + ADDED;

let e2e: E2e;
beforeAll(async () => {
  e2e = await startE2e();
  const db = e2e.harness.db;
  const { id: regionId } = await db.insertInto('regions').values({ code: 'NRT', name: 'Northern' }).returning('id').executeTakeFirstOrThrow();
  await db
    .insertInto('locations')
    .values(Array.from({ length: ADDED }, (_, i) => ({ regionId, code: `N${String(i + 1).padStart(2, '0')}`, name: `Northfield ${i + 1}`, timeZone: 'America/Chicago', laborRateCents: 11000 })))
    .execute();
});
afterAll(async () => {
  await e2e?.close();
});

async function ownerAt(width: number): Promise<Page> {
  const page = await e2e.newPage();
  await page.setViewportSize({ width, height: 900 });
  await e2e.signIn(page, 'owner@demo.busbar.test');
  return page;
}
const fitsWidth = (page: Page) => page.evaluate(() => document.documentElement.scrollWidth <= document.documentElement.clientWidth);

describe('reports with a row per shop, on a network of more shops than a page', () => {
  it('close status shows 25 shops a page, on a phone too, and the next page the rest', async () => {
    for (const width of [1280, 390]) {
      const owner = await ownerAt(width);
      await owner.goto('/month-close/status');
      const rows = owner.locator(width === 1280 ? '#main .ant-table-row' : '#main .ant-card');
      await owner.getByText(`Shops 1–25 of ${SHOPS}`).waitFor();
      expect(await rows.count()).toBe(25);
      await owner.locator('.ant-pagination-item', { hasText: '2' }).click();
      await owner.getByText(`Shops 26–${SHOPS} of ${SHOPS}`).waitFor();
      expect(await rows.count()).toBe(SHOPS - 25);
      expect(await fitsWidth(owner)).toBe(true);
      await owner.context().close();
    }
  });

  it('month close pages its shops and keeps the total of them all on every page', async () => {
    const owner = await ownerAt(1280);
    await owner.goto('/month-close?month=2026-05');
    await owner.getByText(`Shops 1–25 of ${SHOPS}`).waitFor();
    const rows = owner.locator('#main .ant-table-row');
    expect(await rows.count()).toBe(25);
    const total = await owner.locator('#main .total').textContent();
    await owner.locator('.ant-pagination-item', { hasText: '2' }).click();
    await owner.getByText(`Shops 26–${SHOPS} of ${SHOPS}`).waitFor();
    expect(await rows.count()).toBe(SHOPS - 25);
    expect(await owner.locator('#main .total').textContent()).toBe(total);
    await owner.context().close();
  });

  it('month close counts the shops a month is next at, past a few, instead of naming each', async () => {
    const accountant = await e2e.harness.signedIn('accountant@demo.busbar.test');
    const added = await e2e.harness.db.selectFrom('locations').select('id').where('code', 'like', 'N%').where('name', 'like', 'Northfield%').execute();
    for (const { id } of added) expect((await accountant.post(`/api/closes/${id}/2026-05/final`)).status).toBe(201);
    const owner = await ownerAt(1280);
    await owner.goto('/month-close?month=2026-05');
    await expect.poll(() => owner.locator('.to-close').textContent()).toMatch(`Months to close: Jun 2026 at ${ADDED} shops · 8 shops have no month final yet`);
    await owner.context().close();
  });

  it('marks a month final at every shop it is next at, after asking, and names a shop it could not mark with why', async () => {
    const owner = await ownerAt(1280);
    await owner.goto('/month-close?month=2026-05');
    // The demo's 8 shops: the added ones' May is final (above).
    await owner.getByRole('button', { name: 'Mark final at 8 shops…' }).click();
    const dialog = owner.locator('.ant-modal');
    await dialog.getByText('Mark May 2026 final at 8 shops?').waitFor();
    // None of the demo's shops has a month final yet: the dialog says May becomes their first.
    await dialog.getByText('8 shops have no month final yet: May 2026 becomes their first', { exact: false }).waitFor();
    // Meanwhile the accountant marks Denver's May final.
    const denver = await e2e.harness.db.selectFrom('locations').select('id').where('code', '=', 'DEN').executeTakeFirstOrThrow();
    expect((await (await e2e.harness.signedIn('accountant@demo.busbar.test')).post(`/api/closes/${denver.id}/2026-05/final`)).status).toBe(201);
    await dialog.getByRole('button', { name: 'Mark final' }).click();
    await owner.getByText('1 shop not marked final').waitFor();
    expect(await owner.locator('.mark-all li').allTextContents()).toEqual(['DEN Denver: May 2026 is already final at Denver']);
    const finals = await e2e.harness.db.selectFrom('monthCloses').select('locationId').where('month', '=', '2026-05').execute();
    expect(finals).toHaveLength(SHOPS);
    await expect.poll(() => owner.locator('.to-close').textContent()).toMatch(`Months to close: Jun 2026 at all ${SHOPS} shops`);
    // Nothing left to mark, once the dialog has gone.
    await dialog.waitFor({ state: 'hidden' });
    expect(await owner.getByRole('button', { name: /^Mark final/ }).count()).toBe(0);
    await owner.context().close();
  });

  it('shops compared keep their order from page to page', async () => {
    const owner = await ownerAt(1280);
    await owner.goto('/compare?sort=shop&order=ascend');
    await owner.getByText(`Shops 1–25 of ${SHOPS}`).waitFor();
    const names = () => owner.locator('#main .comparison .ant-table-row td:first-child a').allTextContents();
    const first = await names();
    expect(first).toHaveLength(25);
    await owner.locator('.ant-pagination-item', { hasText: '2' }).click();
    await owner.getByText(`Shops 26–${SHOPS} of ${SHOPS}`).waitFor();
    const second = await names();
    expect(new URL(owner.url()).searchParams.get('order')).toBe('ascend');
    const byName = (text: string) => text.replace(/^\S+\s+/, '').trim();
    const all = [...first, ...second].map(byName);
    expect(all).toEqual([...all].sort((a, b) => a.localeCompare(b)));
    await owner.context().close();
  });

  it('the overview counts the shops by region instead of listing each', async () => {
    const owner = await ownerAt(1280);
    await owner.getByRole('link', { name: 'Overview' }).click();
    await owner.getByText(`${SHOPS} shops in 3 regions`).waitFor();
    expect(await owner.getByText(`${ADDED} shops`, { exact: true }).count()).toBe(1);
    await owner.getByRole('link', { name: 'Every shop and its settings' }).waitFor();
    await owner.setViewportSize({ width: 390, height: 900 });
    expect(await fitsWidth(owner)).toBe(true);
    await owner.context().close();
  });
});

describe("the build list's lead technician filter over many shops", () => {
  it('finds a person by name in one request, never one per shop, and keeps their name when the list opens again', async () => {
    const owner = await ownerAt(1280);
    const perShop: string[] = [];
    owner.on('request', (r) => {
      if (/\/api\/locations\/\d+\/technicians/.test(r.url())) perShop.push(r.url());
    });
    await owner.goto('/builds');
    const filter = owner.locator('.ant-form-item', { hasText: 'Lead technician' }).locator('.ant-select');
    await filter.click();
    await owner.keyboard.type('castel');
    await owner.locator('.ant-select-dropdown:visible .ant-select-item-option', { hasText: 'Dmitri Castellanos' }).click();
    await expect.poll(() => new URL(owner.url()).searchParams.get('technicianId')).not.toBeNull();
    await owner.reload();
    await owner.locator('.ant-form-item', { hasText: 'Lead technician' }).locator('.ant-select-selection-item', { hasText: 'Dmitri Castellanos' }).waitFor();
    expect(perShop).toEqual([]);
    await owner.context().close();
  });

  it('says so of a person a link names who leads no builds in these shops, over many shops and in one', async () => {
    const owner = await ownerAt(1280);
    await owner.goto('/builds?technicianId=999999');
    const chosen = (page: Page) => page.locator('.ant-form-item', { hasText: 'Lead technician' }).locator('.ant-select-selection-item');
    await chosen(owner).filter({ hasText: 'Not at these shops' }).waitFor();
    await owner.context().close();
    // Asheville's technician, named in a link Denver's lead opens.
    const db = e2e.harness.db;
    const { userId } = await db
      .selectFrom('roleAssignments as r')
      .innerJoin('locations as l', 'l.id', 'r.locationId')
      .select('r.userId')
      .where('l.code', '=', 'AVL')
      .where('r.role', '=', 'technician')
      .executeTakeFirstOrThrow();
    const lead = await e2e.newPage();
    await e2e.signIn(lead, 'lead@demo.busbar.test');
    await lead.goto(`/builds?technicianId=${userId}`);
    await chosen(lead).filter({ hasText: 'Not at these shops' }).waitFor();
    expect(await chosen(lead).textContent()).not.toMatch(/\d/);
    await lead.context().close();
  });
});
