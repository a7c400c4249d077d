import { SAFETY_CAUTION } from '@busbar/calc';
import type { BuildDetail, PlanView } from '@busbar/shared';
import type { Locator, Page } from 'playwright-core';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { demoIds } from '../support/api-harness.ts';
import { createBuild } from '../support/build-fixtures.ts';
import { choose, startE2e, type E2e } from '../support/e2e-harness.ts';

let e2e: E2e;
let build: BuildDetail;

beforeAll(async () => {
  e2e = await startE2e();
  // A Denver build booked by the lead with the demo technician leading it.
  const db = e2e.harness.db;
  const ids = await demoIds(db);
  const lead = await e2e.harness.signedIn('lead@demo.busbar.test');
  build = await createBuild(db, lead, ids.location('DEN'), { leadTechnicianId: ids.user('tech@demo.busbar.test') });
});
afterAll(async () => {
  await e2e?.close();
});

const card = (page: Page, title: string) => page.locator('.ant-card').filter({ has: page.locator('.ant-card-head-title', { hasText: new RegExp(`^${title}$`) }) });
const verdict = (page: Page) => page.getByRole('region', { name: 'Verdict' });
const findings = (page: Page) => page.getByRole('region', { name: 'Findings' }).locator('li');
const texts = (items: Locator) => items.evaluateAll((nodes) => nodes.map((n) => n.textContent!.replace(/\s+/g, ' ').trim()));

/** The verdict's headline once the live result has caught up with the typing (it follows after a short pause). */
async function headline(page: Page, pattern: RegExp): Promise<string> {
  await expect.poll(() => verdict(page).getAttribute('aria-busy'), { timeout: 5000 }).toBe('false');
  const line = verdict(page).locator('.headline');
  await expect.poll(() => line.textContent(), { timeout: 5000 }).toMatch(pattern);
  return (await line.textContent())!;
}

async function fill(field: Locator, value: string) {
  await field.fill(value);
  await field.blur();
}

describe('the power planner', () => {
  it('a technician plans the build, fixes an undersized circuit, saves and prints the sheet', async () => {
    const page = await e2e.newPage();
    // The print dialog is the browser's own; the page records that it was asked for.
    await page.addInitScript(() => {
      (window as unknown as { printCalls: number }).printCalls = 0;
      window.print = () => void (window as unknown as { printCalls: number }).printCalls++;
    });
    await e2e.signIn(page, 'tech@demo.busbar.test');
    await page.goto(`/builds/${build.id}`);
    await page.getByRole('tab', { name: 'Power plan' }).click();
    await page.getByText('Not saved yet', { exact: true }).waitFor();

    // A new plan starts with a fridge and lights; the satellite terminal comes from the presets.
    const loads = card(page, 'Loads');
    await choose(page, loads, 'Preset', 'Satellite internet terminal');
    await loads.getByRole('button', { name: 'Add load' }).click();
    const names = loads.getByLabel('Load name');
    await expect.poll(() => names.evaluateAll((inputs) => inputs.map((i) => (i as HTMLInputElement).value))).toEqual([
      'Compressor fridge',
      'LED lights',
      'Satellite internet terminal',
    ]);
    await fill(loads.getByLabel('Watts').nth(2), '55');
    await fill(loads.getByLabel('Hours per day', { exact: true }).nth(2), '10');
    await fill(page.getByLabel('Days parked'), '4');
    await fill(page.getByLabel('Days driving'), '1');
    await fill(page.getByLabel('Drive hours per day'), '4');

    // Four days parked on 100 Ah: the verdict says how big the bank must be, and the chart shows the trip.
    expect(await card(page, 'Batteries').locator('.ant-select').filter({ has: page.getByLabel('Chemistry') }).textContent()).toBe('LiFePO4');
    const tooSmall = await headline(page, /^The 100 Ah LiFePO4 bank is too small for this trip: at least \d+ Ah$/);
    const neededAh = tooSmall.match(/at least (\d+) Ah/)![1]!;
    const chart = page.getByRole('region', { name: 'State of charge over the trip' });
    await chart.locator('svg').first().waitFor();
    expect(await chart.getByText(/Lowest state of charge: \d+ %, first reached at day \d, \d\d:00 \((parked|driving)\)/).count()).toBe(1);
    expect(await verdict(page).getByText(SAFETY_CAUTION).count()).toBe(1);

    await fill(page.getByLabel('Capacity (Ah)'), neededAh);
    await headline(page, new RegExp(`^The ${neededAh} Ah LiFePO4 bank carries this trip$`));

    // A fridge run in thin wire: too much drop, and a fuse the wire cannot take.
    await page.getByRole('button', { name: 'Add circuit' }).click();
    const circuit = page.locator('.circuit').last();
    await fill(circuit.getByLabel('To', { exact: true }), 'Fridge');
    expect(await circuit.locator('.ant-input-number-group-addon').textContent()).toBe('ft');
    await fill(circuit.getByLabel('One-way length'), '20');
    await fill(circuit.getByLabel('Current (A)'), '5');
    await choose(page, circuit, 'Fitted size', '18 AWG');
    await fill(circuit.getByLabel('Fitted fuse (A)'), '40');
    const fridgeFindings = findings(page).filter({ hasText: 'Circuit Fuse block → Fridge' });
    await expect.poll(() => texts(fridgeFindings), { timeout: 5000 }).toEqual([
      expect.stringMatching(/^Critical\s*Circuit Fuse block → Fridge: a 40 A fuse does not protect 18 AWG: at most 30\.0 A/),
      expect.stringMatching(/^Warning\s*Circuit Fuse block → Fridge: 18 AWG drops 1\d\.\d %, over the 10 % allowed\. 1\d AWG keeps it within\.$/),
      expect.stringMatching(/^Warning\s*Circuit Fuse block → Fridge: 18 AWG run on its own is below the 16 AWG/),
    ]);

    // Leaving now would lose the plan: the planner asks first.
    await page.getByRole('link', { name: 'All builds' }).click();
    await page.getByRole('button', { name: 'Keep editing' }).click();
    expect(new URL(page.url()).pathname).toBe(`/builds/${build.id}`);

    await choose(page, circuit, 'Fitted size', '12 AWG');
    await expect.poll(() => fridgeFindings.count(), { timeout: 5000 }).toBe(0);
    expect(await circuit.getByText('Conductor and fuse pass every check.').count()).toBe(1);

    // The charger's two runs leave a battery each: their fuses are drawn by the terminals (in inches, as the units say).
    const points = page.getByRole('region', { name: 'Fuses at the batteries' }).locator('li');
    await expect.poll(() => texts(points)).toEqual([expect.stringMatching(/^No fuse/), expect.stringMatching(/^No fuse/)]);
    await fill(page.locator('.circuit').nth(0).getByLabel('Fuse from the start battery'), '4');
    await fill(page.locator('.circuit').nth(1).getByLabel('Fuse from the end battery'), '6');
    await expect.poll(() => texts(points), { timeout: 5000 }).toEqual([
      expect.stringMatching(/^Protected Circuit 1: Starter battery → DC-DC charger, where it leaves the starter battery Within 7 in \(178 mm\) · \d+ A fuse · drawn 4 in away$/),
      expect.stringMatching(/^Protected Circuit 2: DC-DC charger → House battery, where it reaches the house battery Within 7 in \(178 mm\) · \d+ A fuse · drawn 6 in away$/),
    ]);

    await page.getByRole('button', { name: 'Save plan' }).click();
    await page.getByText('Saved by Dmitri Castellanos', { exact: false }).waitFor();
    await page.getByText('Version 1', { exact: true }).waitFor();

    const lead = await e2e.harness.signedIn('lead@demo.busbar.test');
    const saved = (await lead.get(`/api/builds/${build.id}/plan`)).body as { plan: PlanView };
    expect(saved.plan.version).toBe(1);
    expect(saved.plan.input.loads.map((l) => [l.name, l.watts, l.hoursPerDay])).toEqual([
      ['Compressor fridge', 45, 24],
      ['LED lights', 20, 4],
      ['Satellite internet terminal', 55, 10],
    ]);
    expect(saved.plan.input.trip).toMatchObject({ daysParked: 4, daysDriving: 1, driveHoursPerDay: 4 });
    expect(saved.plan.input.bank).toEqual({ chemistry: 'lifepo4', capacityAh: Number(neededAh) });
    const fridgeRun = saved.plan.input.circuits.at(-1)!;
    expect(fridgeRun).toMatchObject({ from: 'Fuse block', to: 'Fridge', currentA: 5, size: { awg: '12' }, fuseA: 40 });
    // Lengths are kept in metres whatever the person types in.
    expect(fridgeRun.oneWayLengthM).toBeCloseTo(6.096, 6);
    // The charger's runs take their currents from the charger; fuse distances are kept in millimetres.
    const [chargerIn, chargerOut] = saved.plan.input.circuits;
    expect(chargerIn).toMatchObject({ link: 'dcdc-input', fromBattery: 'starter' });
    expect(chargerIn!.fuseFromBatteryMm).toBeCloseTo(101.6, 6);
    expect(chargerOut).toMatchObject({ link: 'dcdc-output', toBattery: 'house' });
    expect(chargerOut!.fuseToBatteryMm).toBeCloseTo(152.4, 6);
    expect(saved.plan.result.protectionPoints.map((p) => p.ok)).toEqual([true, true]);
    expect(saved.plan.result.verdict.kind).toBe('bank-ok');
    expect(saved.plan.result.findings.filter((f) => f.circuit !== undefined)).toEqual([]);

    // The printed sheet: the build, the verdict, the bank and charger to buy, every circuit's conductor and fuse, the fuses at the batteries, the caution.
    await page.getByRole('button', { name: 'Print sheet' }).click();
    await page.getByRole('heading', { level: 1, name: `Power plan · Build ${build.number}` }).waitFor();
    const sheet = page.locator('article.sheet');
    expect(await sheet.getByText(SAFETY_CAUTION).count()).toBeGreaterThan(0);
    expect(await sheet.getByText(`The ${neededAh} Ah LiFePO4 bank carries this trip`).count()).toBe(1);
    const rows = sheet.locator('table').last().locator('tbody tr');
    expect(await rows.count()).toBe(3);
    const fridgeRow = (await rows.last().innerText()).replace(/\s+/g, ' ');
    expect(fridgeRow).toContain('Fuse block → Fridge');
    expect(fridgeRow).toContain('20 ft');
    expect(fridgeRow).toContain('12 AWG');
    expect(fridgeRow).toContain('40 A');
    const recommended = sheet.getByRole('region', { name: 'Busbar recommends' });
    expect(await sheet.locator('[aria-labelledby="plan-recommended"] + [role="note"]').getByText(SAFETY_CAUTION).count()).toBe(1);
    expect(await recommended.getByText(/^At least \d+ Ah needed, rounded up to the next (common size|size in the shop's catalog)/).count()).toBe(1);
    const sheetPoints = await texts(sheet.getByRole('region', { name: 'Fuses at the batteries' }).locator('li'));
    expect(sheetPoints).toEqual([
      expect.stringMatching(/^Protected Circuit 1: Starter battery → DC-DC charger, .* 4 in away$/),
      expect.stringMatching(/^Protected Circuit 2: DC-DC charger → House battery, .* 6 in away$/),
    ]);
    await sheet.getByRole('region', { name: 'State of charge over the trip' }).locator('svg').first().waitFor();

    await page.emulateMedia({ media: 'print' });
    expect(await page.getByRole('navigation', { name: 'Main' }).isVisible()).toBe(false);
    expect(await sheet.isVisible()).toBe(true);
    await page.emulateMedia({ media: 'screen' });
    await page.getByRole('button', { name: /Print$/ }).click();
    expect(await page.evaluate(() => (window as unknown as { printCalls: number }).printCalls)).toBe(1);

    await page.context().close();
  });

  it('a warranty clerk reads the saved plan but cannot change it', async () => {
    const page = await e2e.newPage();
    await e2e.signIn(page, 'warranty@demo.busbar.test');
    await page.goto(`/builds/${build.id}?tab=plan`);
    await headline(page, /carries this trip$/);
    expect(await page.getByRole('button', { name: 'Save plan' }).count()).toBe(0);
    expect(await page.getByLabel('Watts').count()).toBe(0);
    expect(await card(page, 'Loads').getByText('Satellite internet terminal').count()).toBe(1);
    expect(await page.getByRole('button', { name: 'Print sheet' }).isEnabled()).toBe(true);
    await page.context().close();
  });
});
