import type { BuildDetail } from '@busbar/shared';
import type { Page } from 'playwright-core';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { demoIds } from '../support/api-harness.ts';
import { createBuild } from '../support/build-fixtures.ts';
import { choose, startE2e, type E2e } from '../support/e2e-harness.ts';

let e2e: E2e;
let build: BuildDetail;

beforeAll(async () => {
  e2e = await startE2e();
  const db = e2e.harness.db;
  const ids = await demoIds(db);
  const lead = await e2e.harness.signedIn('lead@demo.busbar.test');
  build = await createBuild(db, lead, ids.location('DEN'), { leadTechnicianId: ids.user('tech@demo.busbar.test') });
});
afterAll(async () => {
  await e2e?.close();
});

async function signedIn(email: string): Promise<Page> {
  const page = await e2e.newPage();
  await e2e.signIn(page, email);
  return page;
}

describe('quick plans', () => {
  // Who finds Quick plans in the menu is checked for every role in navigation.test.ts.
  it('a technician plans with a customer, then attaches the plan to the booked build', async () => {
    const page = await signedIn('tech@demo.busbar.test');
    await page.getByRole('navigation').getByText('Quick plans', { exact: true }).click();
    await page.getByText('No quick plans yet', { exact: false }).waitFor();
    await page.getByRole('button', { name: 'New quick plan' }).click();

    // The name is asked for before anything is saved; the plan stays as it was.
    await page.getByRole('button', { name: 'Save plan' }).click();
    await page.getByText('Name the plan', { exact: true }).waitFor();
    const loads = page.locator('.ant-card').filter({ has: page.locator('.ant-card-head-title', { hasText: /^Loads$/ }) });
    await choose(page, loads, 'Preset', 'CPAP');
    await loads.getByRole('button', { name: 'Add load' }).click();
    await page.getByLabel('Plan name').fill('Okonkwo, 2019 van');
    await page.getByRole('button', { name: 'Save plan' }).click();
    await page.getByRole('heading', { level: 1, name: 'Okonkwo, 2019 van' }).waitFor();
    await expect.poll(() => new URL(page.url()).pathname).toMatch(/^\/plans\/\d+$/);

    // Listed with its verdict beside the safety caution, then opened again.
    await page.getByRole('navigation').getByText('Quick plans', { exact: true }).click();
    await page.getByRole('note', { name: 'Safety caution' }).waitFor();
    await page.getByRole('link', { name: 'Okonkwo, 2019 van' }).click();
    await page.getByRole('heading', { level: 1, name: 'Okonkwo, 2019 van' }).waitFor();

    await page.getByRole('button', { name: 'Attach to a build' }).click();
    const dialog = page.getByRole('dialog');
    await choose(page, dialog, 'Build', build.number);
    await dialog.getByRole('button', { name: 'Attach' }).click();

    await page.getByRole('heading', { level: 1, name: `Build ${build.number}` }).waitFor();
    await page.getByRole('tab', { name: 'Power plan', selected: true }).waitFor();
    const names = loads.getByLabel('Load name');
    await expect.poll(() => names.evaluateAll((inputs) => inputs.map((i) => (i as HTMLInputElement).value))).toContain('CPAP');

    const plan = await e2e.harness.db.selectFrom('powerPlans').select(['buildId', 'name', 'version']).where('name', '=', 'Okonkwo, 2019 van').executeTakeFirstOrThrow();
    expect(plan).toEqual({ buildId: build.id, name: 'Okonkwo, 2019 van', version: 2 });

    // Attached, it leaves the list of quick plans.
    await page.getByRole('navigation').getByText('Quick plans', { exact: true }).click();
    await page.getByText('No quick plans yet', { exact: false }).waitFor();
    expect(await page.getByRole('note', { name: 'Safety caution' }).count()).toBe(0);
    await page.context().close();
  });
});
