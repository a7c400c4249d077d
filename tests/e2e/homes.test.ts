import type { Page } from 'playwright-core';
import { DEMO_SIGN_INS } from '../../db/demo/network.ts';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { createBuild, moveThrough } from '../support/build-fixtures.ts';
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
const fitsWidth = (page: Page) => page.evaluate(() => document.documentElement.scrollWidth <= document.documentElement.clientWidth);
const shopRows = (page: Page) => page.locator('.comparison .ant-table-row');

describe('homes: locations compared and my bay', () => {
  it("the regional manager lands on their shops, sorts by claims per 100 builds, and opens the outlier's delivered builds", async () => {
    const page = await e2e.newPage();
    await e2e.signIn(page, EAST_MANAGER);
    await page.getByRole('heading', { level: 1, name: 'Locations compared' }).waitFor();
    // The harness's clock stands at June 15, 2026: the last 12 whole months.
    await page.getByText('Jun 2025 – May 2026', { exact: false }).waitFor();
    // The span's picker is named by the label around it, on the input a screen reader reaches.
    expect(await page.getByRole('combobox', { name: 'Months' }).count()).toBe(1);
    // The last whole month's figures for the region's shops together, against April and May 2025.
    const key = page.getByRole('region', { name: 'May 2026' });
    await key.getByText('Builds delivered').waitFor();
    expect(await key.locator('.tile-change').allTextContents()).toEqual(expect.arrayContaining([expect.stringMatching(/(on Apr 2026|= Apr 2026)$/)]));
    await expect.poll(() => shopRows(page).count()).toBe(4);
    expect(await page.locator('.ant-table-summary').textContent()).toMatch(/^Network median of 8 shops/);

    await page.getByRole('columnheader', { name: /Claims per 100 builds/ }).click();
    await expect.poll(() => new URL(page.url()).searchParams.get('sort')).toBe('claimsPer100Builds');
    const top = shopRows(page).first();
    await expect.poll(() => top.locator('td').first().textContent()).toBe('AUS Austin');
    await top.getByText('▲ Above the funnel').waitFor();
    // Failure highlights of the region's shops: the components failing more than their peers.
    await page.locator('.watch').getByText('Components to watch').waitFor();
    const delivered = Number((await top.locator('td').nth(1).textContent())!.replace(/,/g, ''));

    await top.getByRole('link', { name: 'Austin: its delivered builds of these months' }).click();
    await page.getByRole('heading', { level: 1, name: 'Builds' }).waitFor();
    const asked = new URL(page.url()).searchParams;
    expect(Object.fromEntries(asked)).toMatchObject({ status: 'delivered', deliveredFrom: '2025-06-01', deliveredTo: '2026-05-31' });
    await page.getByText(`1–50 of ${delivered.toLocaleString('en-US')}`).waitFor();
    expect(await page.locator('.ant-table-row').first().textContent()).toContain('AUS');
    // A list of deliveries shows the day of delivery where others show the booking, the latest day first.
    const heads = await page.locator('.ant-table-thead th').allTextContents();
    expect(heads).not.toContain('Booked for');
    const deliveredHead = page.locator('.ant-table-thead th').nth(heads.indexOf('Delivered'));
    expect(await deliveredHead.getAttribute('aria-sort')).toBe('descending');
    const dayCells = page.locator(`.ant-table-row td:nth-child(${heads.indexOf('Delivered') + 1})`);
    const aus = (await e2e.harness.db.selectFrom('locations').select('id').where('code', '=', 'AUS').executeTakeFirstOrThrow()).id;
    const { latest } = await e2e.harness.db
      .selectFrom('builds')
      .select((eb) => eb.fn.max('deliveredOn').as('latest'))
      .where('locationId', '=', aus)
      .where('deliveredOn', '>=', '2025-06-01')
      .where('deliveredOn', '<=', '2026-05-31')
      .executeTakeFirstOrThrow();
    const shown = (day: string) => new Date(`${day}T00:00:00Z`).toLocaleDateString('en-US', { month: 'short', day: 'numeric', year: 'numeric', timeZone: 'UTC' });
    expect(await dayCells.first().textContent()).toBe(shown(latest!));
    const days = (await dayCells.allTextContents()).map((text) => Date.parse(text));
    expect(days).toEqual([...days].sort((a, b) => b - a));
    await page.context().close();
  });

  it("the lead lands on the shop's week, then sees the shop against the network without other shops, on a phone too", async () => {
    const page = await e2e.newPage();
    await e2e.signIn(page, 'lead@demo.busbar.test');
    await page.getByRole('heading', { level: 1, name: 'Denver this week' }).waitFor();
    const den = (await e2e.harness.db.selectFrom('locations').select('id').where('code', '=', 'DEN').executeTakeFirstOrThrow()).id;
    const inBay = await e2e.harness.db.selectFrom('builds').select('number').where('locationId', '=', den).where('status', 'in', ['in_bay', 'quality_check']).execute();
    const counts = page.getByRole('list', { name: 'The week in numbers' });
    await expect.poll(() => counts.locator('li').first().textContent()).toBe(`${inBay.length} in the bay`);
    const cards = page.getByRole('region', { name: 'In the bay' }).locator('.bay-card-number');
    expect((await cards.allTextContents()).sort()).toEqual(inBay.map((b) => b.number).sort());
    await page.getByRole('navigation').getByText('Locations compared', { exact: true }).click();
    await page.getByRole('heading', { level: 1, name: 'Your shop against the network' }).waitFor();
    await expect.poll(() => shopRows(page).count()).toBe(1);
    expect(await shopRows(page).first().locator('td').first().textContent()).toBe('DEN Denver');
    const text = await page.locator('main').textContent();
    for (const name of ['Austin', 'Boise', 'Portland', 'Asheville']) expect(text).not.toContain(name);
    await page.setViewportSize({ width: 390, height: 844 });
    await page.getByText('Shop and figures').waitFor();
    await expect.poll(() => fitsWidth(page)).toBe(true);
    await page.context().close();
  });

  it("lands the technician on their bay today, work in hand first, usable on a phone", async () => {
    const page = await e2e.newPage();
    await page.setViewportSize({ width: 390, height: 844 });
    await e2e.signIn(page, 'tech@demo.busbar.test');
    await page.getByRole('heading', { level: 1, name: 'My bay today' }).waitFor();
    await page.getByText('Jun 15, 2026 · the builds you lead').waitFor();
    // Whatever the demo's draws left in the bay, the lead books one build into it and one for today.
    const lead = await e2e.harness.signedIn('lead@demo.busbar.test');
    const { id: techId } = await e2e.harness.db.selectFrom('users').select('id').where('email', '=', 'tech@demo.busbar.test').executeTakeFirstOrThrow();
    const den = (await e2e.harness.db.selectFrom('locations').select('id').where('code', '=', 'DEN').executeTakeFirstOrThrow()).id;
    for (const stages of [['quoted', 'booked', 'in_bay'], ['quoted', 'booked']]) {
      await moveThrough(lead, await createBuild(e2e.harness.db, lead, den, { leadTechnicianId: techId, bookedFor: '2026-06-15' }), stages);
    }
    const open = await e2e.harness.db
      .selectFrom('builds')
      .select(['number', 'status'])
      .where('leadTechnicianId', '=', techId)
      .where((eb) => eb.or([eb('status', 'in', ['in_bay', 'quality_check']), eb.and([eb('status', '=', 'booked'), eb('bookedFor', '<=', '2026-06-15')])]))
      .execute();
    expect(open.length).toBeGreaterThanOrEqual(2);
    await page.reload();
    const cards = page.locator('.bay-card');
    await expect.poll(() => cards.count()).toBe(open.length);
    const numbers = await page.locator('.bay-card-number').allTextContents();
    expect(numbers.sort()).toEqual(open.map((b) => b.number).sort());
    const inBay = page.getByRole('region', { name: 'In the bay' });
    expect(await inBay.locator('.bay-card').count()).toBe(open.filter((b) => b.status !== 'booked').length);
    expect(await page.getByRole('region', { name: 'Booked for today' }).locator('.bay-card').count()).toBe(open.filter((b) => b.status === 'booked').length);
    await expect.poll(() => fitsWidth(page)).toBe(true);
    // Every card is a large target that opens its build.
    const box = (await cards.first().boundingBox())!;
    expect(box.height).toBeGreaterThanOrEqual(72);
    expect(box.width).toBeGreaterThan(250);
    await cards.first().click();
    await page.getByRole('heading', { level: 1, name: new RegExp(numbers[0]!.replace(/[-]/g, '\\-')) }).waitFor();
    // The build says where it stands along its stages, in words, and the tab names it.
    const track = page.getByRole('list', { name: 'Where the build stands' });
    expect(await track.locator('[aria-current="step"]').textContent()).toMatch(/^(In the bay|Final check)\s*\(now\)$/);
    await expect.poll(() => page.title()).toBe(`Build ${numbers[0]} · Builds · Busbar`);
    await page.context().close();
  });

  it('a lead turns the weekly e-mail off on the overview, and it stays off', async () => {
    const page = await e2e.newPage();
    await e2e.signIn(page, 'lead2@demo.busbar.test');
    await page.getByRole('navigation').getByText('Overview', { exact: true }).click();
    const choice = page.getByRole('switch');
    await choice.waitFor();
    expect(await choice.getAttribute('aria-checked')).toBe('true');
    await choice.click();
    await expect.poll(async () => (await e2e.harness.db.selectFrom('users').select('weeklyDigest').where('email', '=', 'lead2@demo.busbar.test').executeTakeFirstOrThrow()).weeklyDigest).toBe(0);
    // Opening Busbar again lands on the shop's week; the overview keeps the choice.
    await page.reload();
    await page.getByRole('heading', { level: 1, name: 'Asheville this week' }).waitFor();
    await page.getByRole('navigation').getByText('Overview', { exact: true }).click();
    await expect.poll(() => page.getByRole('switch').getAttribute('aria-checked')).toBe('false');
    await page.context().close();
  });

  it('the accountant lands on the month close, opens a shop’s delivered builds, and compares every shop without failure highlights', async () => {
    const page = await e2e.newPage();
    await e2e.signIn(page, 'accountant@demo.busbar.test');
    // The harness's clock stands at June 15, 2026: last month is May.
    await page.getByRole('heading', { level: 1, name: 'Month close' }).waitFor();
    await expect.poll(() => page.locator('.ant-table-row').count()).toBe(8);
    const austin = page.locator('.ant-table-row', { hasText: 'AUS Austin' });
    // The shop, its close, then its builds delivered.
    const delivered = Number(await austin.locator('td').nth(2).textContent());
    expect(delivered).toBeGreaterThan(0);
    expect(await page.locator('.ant-table-summary').textContent()).toMatch(/^All these shops/);
    await austin.locator('td').nth(2).getByRole('link').click();
    await page.getByRole('heading', { level: 1, name: 'Builds' }).waitFor();
    expect(Object.fromEntries(new URL(page.url()).searchParams)).toMatchObject({ status: 'delivered', deliveredFrom: '2026-05-01', deliveredTo: '2026-05-31' });
    await page.getByText(`1–${Math.min(delivered, 50)} of ${delivered}`).waitFor();
    await page.getByRole('navigation').getByText('Locations compared', { exact: true }).click();
    await expect.poll(() => shopRows(page).count()).toBe(8);
    expect(await page.getByText('Failure highlights').count()).toBe(0);
    expect(await page.locator('.ant-alert').count()).toBe(0);
    await page.context().close();
  });
});
