import { simpleParser } from 'mailparser';
import type { Page } from 'playwright-core';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { demoIds } from '../support/api-harness.ts';
import { addDeliveredUnit, SMALL_PNG, uploadEvidence } from '../support/claim-fixtures.ts';
import { choose, startE2e, type E2e } from '../support/e2e-harness.ts';

let e2e: E2e;
beforeAll(async () => {
  e2e = await startE2e();
});
afterAll(async () => {
  await e2e?.close();
});

/** Waits until the claim's header shows the status. */
async function statusIs(page: Page, label: string) {
  await page.locator('.bb-page-header').getByText(label, { exact: true }).waitFor();
}

/** No sideways scrolling at the page's current width. */
const fitsWidth = (page: Page) => page.evaluate(() => document.documentElement.scrollWidth <= window.innerWidth);

describe('a failed unit from serial number to credit', () => {
  it('the clerk logs it with a photo and sends it to the vendor; the lead records approval and the credit, and sees it on the build', async () => {
    const db = e2e.harness.db;
    const unit = await addDeliveredUnit(db, (await demoIds(db)).location('DEN'));
    const { serialNumber } = await db.selectFrom('buildItems').select('serialNumber').where('id', '=', unit.buildItemId).executeTakeFirstOrThrow();

    const clerk = await e2e.newPage();
    await e2e.signIn(clerk, 'warranty@demo.busbar.test');
    await clerk.getByRole('navigation').getByText('Claims', { exact: true }).click();
    await clerk.getByText('No claims yet').waitFor();
    await clerk.getByRole('button', { name: 'Log a claim' }).click();

    const main = clerk.locator('#main');
    await main.getByLabel('Serial number of the failed unit').fill(serialNumber!);
    await main.getByRole('button', { name: 'Find' }).click();
    await main.getByRole('button', { name: `Choose ${serialNumber}` }).click();
    const form = main.locator('form').filter({ has: clerk.getByLabel('Failed on') });
    await form.waitFor();
    expect(await form.getByRole('radio', { name: new RegExp(serialNumber!) }).isChecked()).toBe(true);
    // The form speaks plainly about what is missing before anything is sent.
    await form.getByRole('button', { name: 'Log the claim' }).click();
    await form.getByText('Enter the day it failed').waitFor();
    expect(await form.getByText('Describe what the customer or the shop saw').count()).toBe(1);

    const failedOn = form.getByLabel('Failed on');
    await failedOn.click();
    await failedOn.fill('2026-06-02');
    await failedOn.press('Enter');
    await choose(clerk, form, 'How it failed', 'Cell or BMS fault');
    await form.getByLabel('What was seen').fill('BMS cuts out under a 40 A load');
    await form.getByLabel('How it was found').fill('Customer call');
    await form.getByRole('button', { name: 'Log the claim' }).click();
    await clerk.getByRole('heading', { level: 1, name: 'Claim DEN-W00001' }).waitFor();
    await statusIs(clerk, 'Logged');
    expect(await clerk.getByRole('button', { name: 'Mark evidence ready' }).isDisabled()).toBe(true);

    await clerk.locator('input[type="file"]').setInputFiles({ name: 'terminal.png', mimeType: 'image/png', buffer: SMALL_PNG });
    await clerk.getByRole('link', { name: 'terminal.png' }).waitFor();
    await expect.poll(() => clerk.locator('img[alt="terminal.png"]').evaluate((img: HTMLImageElement) => img.complete && img.naturalWidth > 0)).toBe(true);

    await clerk.getByRole('button', { name: 'Mark evidence ready' }).click();
    await statusIs(clerk, 'Evidence ready');
    await clerk.getByRole('button', { name: 'Send to vendor' }).click();
    await statusIs(clerk, 'Sent to vendor');
    await expect.poll(() => clerk.getByText(`Return request e-mailed to ${unit.vendor.rmaEmail} with 1 file`).count()).toBe(1);

    const sent = e2e.harness.mail.messages.filter((m) => m.to.includes(unit.vendor.rmaEmail));
    expect(sent).toHaveLength(1);
    const mail = await simpleParser(sent[0]!.raw);
    expect(mail.subject).toContain(`Return request DEN-W00001`);
    expect(mail.text).toContain(`Serial number: ${serialNumber}`);
    expect(mail.attachments.map((a) => [a.filename, a.contentType])).toEqual([['terminal.png', 'image/png']]);
    expect(Buffer.compare(mail.attachments[0]!.content, SMALL_PNG)).toBe(0);
    // The clerk prepares and sends; approving is the lead's.
    expect(await clerk.getByRole('button', { name: 'Record approval' }).count()).toBe(0);
    const claimPath = new URL(clerk.url()).pathname;

    const lead = await e2e.newPage();
    await e2e.signIn(lead, 'lead@demo.busbar.test');
    await lead.goto(claimPath);
    await statusIs(lead, 'Sent to vendor');
    await lead.getByRole('button', { name: 'Record approval' }).click();
    const approve = lead.getByRole('dialog');
    await approve.getByLabel('Credit the vendor approved ($)').fill('280');
    await approve.getByLabel('Note for the timeline (optional)').fill('RMA granted by phone');
    await approve.getByRole('button', { name: 'Record approval' }).click();
    await statusIs(lead, 'Approved');

    await lead.getByRole('button', { name: 'Record credit received' }).click();
    const credit = lead.getByRole('dialog');
    await expect.poll(() => credit.getByLabel('Credit received ($)').inputValue()).toBe('280.00');
    await credit.getByRole('button', { name: 'Record credit received' }).click();
    await statusIs(lead, 'Credited');
    expect(await lead.locator('[aria-current="step"]').textContent()).toContain('Credited');

    const saved = await db.selectFrom('warrantyClaims').select(['status', 'creditApprovedCents', 'creditReceivedCents']).where('number', '=', 'DEN-W00001').executeTakeFirstOrThrow();
    expect(saved).toEqual({ status: 'credited', creditApprovedCents: 28_000, creditReceivedCents: 28_000 });

    const history = lead.locator('.ant-card').filter({ has: lead.getByText("The unit's history", { exact: true }) });
    await history.getByText('this claim').waitFor();
    await lead.locator('#main').getByRole('link', { name: /^DEN-\d+$/ }).first().click();
    await lead.getByRole('heading', { level: 1, name: /^Build DEN-\d+$/ }).waitFor();
    const section = lead.locator('.ant-card').filter({ has: lead.getByText('Warranty claims', { exact: true }) });
    await section.getByRole('link', { name: 'Claim DEN-W00001' }).waitFor();
    expect(await section.getByText('Credited', { exact: true }).count()).toBe(1);
    // A claim can start from the build's line as well: the form opens with that unit chosen.
    await section.getByRole('button', { name: `Log a claim for ${unit.item.sku} ${serialNumber}` }).click();
    await expect.poll(() => lead.getByRole('radio', { name: new RegExp(serialNumber!) }).isChecked()).toBe(true);

    await clerk.context().close();
    await lead.context().close();
  });

  it('fits a phone: the queue and the claim scroll only downwards', async () => {
    const db = e2e.harness.db;
    const unit = await addDeliveredUnit(db, (await demoIds(db)).location('DEN'));
    const api = await e2e.harness.signedIn('warranty@demo.busbar.test');
    const logged = await api.post('/api/claims').send({ buildItemId: unit.buildItemId, failedOn: '2026-06-10', failureMode: 'water_ingress', coverage: 'workmanship', symptoms: 'Water in the terminal cover' });
    expect(logged.status).toBe(201);
    const page = await e2e.newPage();
    await page.setViewportSize({ width: 390, height: 800 });
    await e2e.signIn(page, 'warranty@demo.busbar.test');
    await page.goto('/claims');
    await page.locator('.ant-table-row').first().waitFor();
    expect(await fitsWidth(page)).toBe(true);
    await page.locator('.ant-table-row').first().getByRole('link').click();
    await page.getByRole('heading', { level: 1, name: /^Claim / }).waitFor();
    expect(await fitsWidth(page)).toBe(true);
    await page.context().close();
  });

  it('gives a technician no claims in the navigation and no way into the queue', async () => {
    const page = await e2e.newPage();
    await e2e.signIn(page, 'tech@demo.busbar.test');
    const nav = page.getByRole('navigation');
    await nav.getByText('Builds', { exact: true }).waitFor();
    expect(await nav.getByText('Claims', { exact: true }).count()).toBe(0);
    expect(await nav.getByText('Warranty', { exact: true }).count()).toBe(0);
    await page.goto('/claims');
    await expect.poll(() => page.getByText('No access to this page').count()).toBeGreaterThan(0);
    await page.context().close();
  });

  it('shows the accountant a claim to read, with no step, edit or upload to make', async () => {
    const db = e2e.harness.db;
    const unit = await addDeliveredUnit(db, (await demoIds(db)).location('DEN'));
    const api = await e2e.harness.signedIn('warranty@demo.busbar.test');
    const claim = (await api.post('/api/claims').send({ buildItemId: unit.buildItemId, failedOn: '2026-06-11', failureMode: 'firmware_fault', coverage: 'vendor_defect', symptoms: 'Charger stuck in float' })).body;
    await uploadEvidence(api, claim.id);

    const page = await e2e.newPage();
    await e2e.signIn(page, 'accountant@demo.busbar.test');
    await page.getByRole('navigation').getByText('Claims', { exact: true }).click();
    await page.getByRole('link', { name: claim.number }).click();
    await page.getByRole('heading', { level: 1, name: `Claim ${claim.number}` }).waitFor();
    await page.getByRole('link', { name: 'terminal.png' }).waitFor();
    expect(await page.getByRole('group', { name: 'Work on the claim' }).getByRole('button').count()).toBe(0);
    expect(await page.locator('input[type="file"]').count()).toBe(0);
    expect(await page.getByRole('button', { name: 'Delete terminal.png' }).count()).toBe(0);
    await page.goto('/claims');
    expect(await page.getByRole('button', { name: 'Log a claim' }).count()).toBe(0);
    await page.context().close();
  });
});
