import { SAFETY_CAUTION, type PlanInput } from '@busbar/calc';
import type { Locator, Page } from 'playwright-core';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { addCatalogItem, addVendor } from '../support/catalog-fixtures.ts';
import { choose, startE2e, type E2e } from '../support/e2e-harness.ts';

let e2e: E2e;

beforeAll(async () => {
  e2e = await startE2e();
  // A bank size no common step has, so a recommendation rounded to it can only come from the catalog.
  const vendor = await addVendor(e2e.harness.db);
  await addCatalogItem(e2e.harness.db, { vendorId: vendor.id, specs: { chemistry: 'lifepo4', capacityAh: 180, nominalV: 12.8 } });
});
afterAll(async () => {
  await e2e?.close();
});

const card = (page: Page, title: string) => page.locator('.ant-card').filter({ has: page.locator('.ant-card-head-title', { hasText: new RegExp(`^${title}$`) }) });
const verdict = (page: Page) => page.getByRole('region', { name: 'Verdict' });
const findings = (page: Page) => page.getByRole('region', { name: 'Findings' }).locator('li');
const points = (within: Page | Locator) => within.getByRole('region', { name: 'Fuses at the batteries' }).locator('li');
const texts = (items: Locator) => items.evaluateAll((nodes) => nodes.map((n) => n.textContent!.replace(/\s+/g, ' ').trim()));

async function fill(field: Locator, value: string) {
  await field.fill(value);
  await field.blur();
}

async function newQuickPlan(): Promise<Page> {
  const page = await e2e.newPage();
  await e2e.signIn(page, 'tech@demo.busbar.test');
  await page.getByRole('navigation').getByText('Quick plans', { exact: true }).click();
  await page.getByRole('button', { name: 'New quick plan' }).click();
  await page.getByText('Not saved yet', { exact: true }).waitFor();
  return page;
}

async function savedInput(name: string): Promise<PlanInput> {
  const row = await e2e.harness.db.selectFrom('powerPlans').select('input').where('name', '=', name).executeTakeFirstOrThrow();
  return JSON.parse(row.input) as PlanInput;
}

describe('the planner on unsafe plans', () => {
  it('an inverter without a feed is critical until the feed is added in one click; the sheet lists the fuses at the batteries', async () => {
    const page = await newQuickPlan();
    const loads = card(page, 'Loads');
    await choose(page, loads, 'Preset', 'Induction cooktop (through the inverter)');
    await loads.getByRole('button', { name: 'Add load' }).click();

    // The AC load brings an inverter, and nothing feeds it yet.
    const feedMissing = findings(page).filter({ hasText: /No circuit feeds the 2,?000 W inverter/ });
    await expect.poll(() => texts(feedMissing), { timeout: 5000 }).toEqual([expect.stringMatching(/^Critical\s*No circuit feeds the 2,?000 W inverter: add the inverter feed/)]);
    expect(await verdict(page).getByText(SAFETY_CAUTION).count()).toBe(1);
    expect(await card(page, 'Circuits').getByText(SAFETY_CAUTION).count()).toBe(1);

    await card(page, 'Circuits').getByRole('button', { name: 'Add the inverter feed' }).click();
    await expect.poll(() => feedMissing.count(), { timeout: 5000 }).toBe(0);
    expect(await page.getByRole('button', { name: 'Add the inverter feed' }).count()).toBe(0);

    // The feed's current is the inverter's draw at its cutoff voltage, not a typed figure.
    const feed = page.locator('.circuit').nth(2);
    await feed.getByRole('heading', { name: 'Circuit 3: House battery → Inverter' }).waitFor();
    expect(await feed.getByLabel('Current (A)').count()).toBe(0);
    const draw = (await page.locator('.tile', { hasText: 'Inverter draw' }).locator('.value').textContent())!;
    expect(draw).toMatch(/^\d{3}(\.\d)? A$/);
    expect(await feed.locator('output').textContent()).toBe(draw);

    // Sheathed, its fuse may sit up to 40 in from the house battery.
    await feed.getByText('Sheathed along its length').click();
    await fill(feed.getByLabel('Fuse from the start battery'), '30');
    await expect
      .poll(() => texts(points(page).filter({ hasText: 'House battery → Inverter' })), { timeout: 5000 })
      .toEqual([expect.stringMatching(/^Protected Circuit 3: House battery → Inverter, where it leaves the house battery Within 40 in \(1,016 mm\) · \d+ A fuse · drawn 30 in away$/)]);
    expect(await findings(page).filter({ hasText: 'Circuit House battery → Inverter' }).count()).toBe(0);
    // The charger's runs still have no fuse drawn at their batteries: critical, each named.
    expect(await texts(findings(page).filter({ hasText: 'needs a fuse or breaker' }))).toEqual([
      expect.stringMatching(/^Critical\s*Circuit Starter battery → DC-DC charger: it needs a fuse or breaker within 178 mm \(7 in\) of the starter battery/),
      expect.stringMatching(/^Critical\s*Circuit DC-DC charger → House battery: it needs a fuse or breaker within 178 mm \(7 in\) of the house battery/),
    ]);

    // A limit reads in the units the person types in.
    const lowest = page.getByLabel('Lowest temperature');
    await fill(lowest, '-70');
    await page.getByText('Lowest temperature must be at least -58 °F', { exact: true }).first().waitFor();
    await fill(lowest, '');
    await expect.poll(() => page.getByText('Lowest temperature must be at least', { exact: false }).count(), { timeout: 5000 }).toBe(0);

    await page.getByLabel('Plan name').fill('Adeyemi, cooktop van');
    await page.getByRole('button', { name: 'Save plan' }).click();
    await page.getByRole('heading', { level: 1, name: 'Adeyemi, cooktop van' }).waitFor();
    const saved = await savedInput('Adeyemi, cooktop van');
    expect(saved.circuits[2]).toMatchObject({ from: 'House battery', to: 'Inverter', link: 'inverter-feed', fromBattery: 'house', sheathed: true, critical: true });
    expect(saved.circuits[2]!.currentA).toBeUndefined();
    expect(saved.circuits[2]!.fuseFromBatteryMm).toBeCloseTo(762, 6);

    await page.getByRole('button', { name: 'Print sheet' }).click();
    await page.getByRole('heading', { level: 1, name: 'Quick plan · Adeyemi, cooktop van' }).waitFor();
    const sheet = page.locator('article.sheet');
    expect(await texts(points(sheet))).toEqual([
      expect.stringMatching(/^No fuse Circuit 1: Starter battery → DC-DC charger, where it leaves the starter battery Within 7 in \(178 mm\) · \d+ A fuse · none drawn$/),
      expect.stringMatching(/^No fuse Circuit 2: DC-DC charger → House battery, where it reaches the house battery Within 7 in \(178 mm\) · \d+ A fuse · none drawn$/),
      expect.stringMatching(/^Protected Circuit 3: House battery → Inverter, .* 30 in away$/),
    ]);
    expect(await sheet.locator('[aria-labelledby="protection-points"] + [role="note"]').getByText(SAFETY_CAUTION).count()).toBe(1);
    await page.context().close();
  });

  it('a LiFePO4 bank on a trip below freezing is critical until it heats itself; temperatures follow the units', async () => {
    const page = await newQuickPlan();
    await page.getByRole('group', { name: 'Units' }).getByText('Metric', { exact: true }).click();
    const lowest = page.getByLabel('Lowest temperature');
    await fill(lowest, '-10');

    const cold = findings(page).filter({ hasText: 'below 0 °C' });
    await expect.poll(() => texts(cold), { timeout: 5000 }).toEqual([expect.stringMatching(/^Critical\s*The trip goes down to -10 °C: charging the 100 Ah LiFePO4 bank below 0 °C/)]);
    const recommended = page.getByRole('region', { name: 'Busbar recommends' });
    // Rounded up to the LiFePO4 size the catalog sells, as the server does.
    await expect
      .poll(async () => (await recommended.locator('dd').first().innerText()).replace(/\s+/g, ' '), { timeout: 5000 })
      .toMatch(/^180 Ah LiFePO4, self-heating At least 1[2-7]\d Ah needed, rounded up to the next size in the shop's catalog\./);
    // The caution stands beside the recommendation in a quick plan as in a build's plan.
    expect(await page.locator('[role="note"] + div [aria-labelledby="plan-recommended"]').count()).toBe(1);
    expect(await verdict(page).getByText(SAFETY_CAUTION).count()).toBe(1);

    // In metric units the fuses' limits read in millimetres first.
    expect(await texts(points(page))).toEqual([
      expect.stringMatching(/^No fuse Circuit 1: .* Within 178 mm \(7 in\) · \d+ A fuse · none drawn$/),
      expect.stringMatching(/^No fuse Circuit 2: .* Within 178 mm \(7 in\) · \d+ A fuse · none drawn$/),
    ]);

    await card(page, 'Batteries').getByText('Self-heating', { exact: false }).click();
    await expect.poll(() => cold.count(), { timeout: 5000 }).toBe(0);

    // Stored in °C, shown in °F with imperial units.
    await page.getByRole('group', { name: 'Units' }).getByText('Imperial', { exact: true }).click();
    await expect.poll(() => lowest.inputValue()).toBe('14');
    await page.getByLabel('Plan name').fill('Lindqvist, winter van');
    await page.getByRole('button', { name: 'Save plan' }).click();
    await page.getByRole('heading', { level: 1, name: 'Lindqvist, winter van' }).waitFor();
    const saved = await savedInput('Lindqvist, winter van');
    expect(saved.trip.lowestC).toBe(-10);
    expect(saved.bank).toEqual({ chemistry: 'lifepo4', capacityAh: 100, selfHeating: true });

    // The server rounds to the same catalog: the sheet recommends what the live planner did.
    const live = await recommended.innerText();
    expect(live).toContain('180 Ah LiFePO4, self-heating');
    await page.getByRole('button', { name: 'Print sheet' }).click();
    const onSheet = page.locator('article.sheet').getByRole('region', { name: 'Busbar recommends' });
    await onSheet.waitFor();
    expect(await onSheet.innerText()).toBe(live);
    await page.context().close();
  });
});
