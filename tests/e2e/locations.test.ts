import type { Page } from 'playwright-core';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { demoIds } from '../support/api-harness.ts';
import { addDeliveredUnit, sendWithEvidence } from '../support/claim-fixtures.ts';
import { startE2e, type E2e } from '../support/e2e-harness.ts';

let e2e: E2e;
beforeAll(async () => {
  e2e = await startE2e();
});
afterAll(async () => {
  await e2e?.close();
});

/** No sideways scrolling at the page's current width. */
const fitsWidth = (page: Page) => page.evaluate(() => document.documentElement.scrollWidth <= window.innerWidth);

const limitOf = async (code: string) =>
  (await e2e.harness.db.selectFrom('locations').select('claimApprovalLimitCents').where('code', '=', code).executeTakeFirstOrThrow()).claimApprovalLimitCents;

describe("a location's claim approval limit", () => {
  it('the owner sets it on the Locations page; a lead then sees that a claim above it goes to the regional manager', async () => {
    const owner = await e2e.newPage();
    await e2e.signIn(owner, 'owner@demo.busbar.test');
    await owner.getByRole('navigation').getByText('Locations', { exact: true }).click();
    await owner.getByRole('heading', { level: 1, name: 'Locations' }).waitFor();
    const denRow = owner.locator('.ant-table-row').filter({ hasText: 'Denver' });
    await denRow.getByText('$500.00').waitFor();
    expect(await owner.locator('.ant-table-row').count()).toBe(8);
    expect(await fitsWidth(owner)).toBe(true);

    await denRow.getByRole('button', { name: 'Change limit: the approval limit of DEN' }).click();
    const dialog = owner.getByRole('dialog');
    const amount = dialog.getByLabel('Lead approves claims up to ($)');
    await expect.poll(() => amount.inputValue()).toBe('500.00');
    // Plain words for what is wrong, and what was typed stays.
    await amount.fill('');
    await dialog.getByRole('button', { name: 'Save limit' }).click();
    await dialog.getByText('Enter the limit in dollars').waitFor();
    await amount.fill('-5');
    await dialog.getByRole('button', { name: 'Save limit' }).click();
    await dialog.getByText('The limit cannot be negative').waitFor();
    await amount.fill('2000000');
    await dialog.getByRole('button', { name: 'Save limit' }).click();
    await dialog.getByText('The limit can be at most $1,000,000').waitFor();
    expect(await amount.inputValue()).toBe('2000000.00');
    expect(await limitOf('DEN')).toBe(50_000);

    await amount.fill('200');
    await dialog.getByRole('button', { name: 'Save limit' }).click();
    await denRow.getByText('$200.00').waitFor();
    expect(await limitOf('DEN')).toBe(20_000);
    // Closed by saving, then by Cancel, the dialog opens again from the same button.
    for (let i = 0; i < 2; i++) {
      await denRow.getByRole('button', { name: 'Change limit: the approval limit of DEN' }).click();
      await dialog.waitFor();
      await expect.poll(() => amount.inputValue()).toBe('200.00');
      await dialog.getByRole('button', { name: 'Cancel' }).click();
      await dialog.waitFor({ state: 'hidden' });
    }
    await owner.setViewportSize({ width: 390, height: 800 });
    await owner.getByRole('columnheader', { name: 'Approval limit' }).waitFor();
    await expect.poll(() => fitsWidth(owner)).toBe(true);
    await owner.context().close();

    // A claim at Denver asking $300, sent to its vendor.
    const db = e2e.harness.db;
    const unit = await addDeliveredUnit(db, (await demoIds(db)).location('DEN'));
    const clerkApi = await e2e.harness.signedIn('warranty@demo.busbar.test');
    const logged = await clerkApi.post('/api/claims').send({ buildItemId: unit.buildItemId, failedOn: '2026-06-05', failureMode: 'cell_or_bms_fault', coverage: 'vendor_defect', symptoms: 'Cell drift', creditRequestedCents: 30_000 });
    const claim = await sendWithEvidence(clerkApi, logged.body);

    const lead = await e2e.newPage();
    await e2e.signIn(lead, 'lead@demo.busbar.test');
    await lead.goto(`/claims/${claim.id}`);
    await lead.getByRole('heading', { level: 1, name: `Claim ${claim.number}` }).waitFor();
    await lead.getByText("Credit asked: $300.00 is above this shop's approval limit of $200.00: the regional manager approves it.").waitFor();
    expect(await lead.getByRole('button', { name: 'Record approval' }).count()).toBe(0);
    expect(await lead.getByRole('button', { name: 'Deny' }).count()).toBe(1);
    expect(await fitsWidth(lead)).toBe(true);
    await lead.setViewportSize({ width: 390, height: 800 });
    await lead.getByText(/the regional manager approves it/).waitFor();
    // The layout settles on the phone's breakpoint after the resize.
    await expect.poll(() => fitsWidth(lead)).toBe(true);
    await lead.context().close();

    const regional = await e2e.newPage();
    await e2e.signIn(regional, 'regional@demo.busbar.test');
    await regional.goto(`/claims/${claim.id}`);
    await regional.getByRole('button', { name: 'Record approval' }).waitFor();
    expect(await regional.getByText(/the regional manager approves it/).count()).toBe(0);
    await regional.context().close();
  });

  it('shows Locations in the menu to the owner only, and refuses the page to a lead', async () => {
    const lead = await e2e.newPage();
    await e2e.signIn(lead, 'lead@demo.busbar.test');
    await lead.getByRole('navigation').getByText('Builds', { exact: true }).waitFor();
    expect(await lead.getByRole('navigation').getByText('Locations', { exact: true }).count()).toBe(0);
    await lead.goto('/locations');
    await lead.getByText('No access to this page').waitFor();
    await lead.context().close();
  });
});

describe("the warranty clerk's home and the claim filters", () => {
  it('lands the clerk on the claim queue, whose filters go to the address bar and fit a phone', async () => {
    const clerk = await e2e.newPage();
    await e2e.signIn(clerk, 'warranty@demo.busbar.test');
    await clerk.getByRole('heading', { level: 1, name: 'Warranty claims' }).waitFor();
    expect(new URL(clerk.url()).pathname).toBe('/claims');
    // The menu's Overview still opens the overview.
    await clerk.getByRole('navigation').getByText('Overview', { exact: true }).click();
    await clerk.getByRole('heading', { level: 1, name: /^Welcome/ }).waitFor();

    await clerk.goto('/claims?category=house_battery&failedFrom=2026-06-01&failedTo=2026-06-30');
    const filters = clerk.locator('#main form').filter({ has: clerk.getByText('Failed between') });
    await filters.getByText('House battery').waitFor();
    const failed = filters.locator('.ant-form-item').filter({ hasText: 'Failed between' });
    expect(await failed.locator('input').evaluateAll((inputs: HTMLInputElement[]) => inputs.map((i) => i.value))).toEqual(['Jun 1, 2026', 'Jun 30, 2026']);
    expect(await fitsWidth(clerk)).toBe(true);
    await clerk.setViewportSize({ width: 390, height: 800 });
    await filters.getByText('House battery').waitFor();
    await expect.poll(() => fitsWidth(clerk)).toBe(true);
    await clerk.context().close();
  });
});
