import { simpleParser } from 'mailparser';
import type { Page } from 'playwright-core';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { startMailCapture } from '../../apps/api/src/mail/capture.ts';
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

describe('claims off the straight path', () => {
  it('tells the clerk a unit past its warranty is for a lead to log as goodwill; the lead does and records the replacement unit', async () => {
    const db = e2e.harness.db;
    const old = await addDeliveredUnit(db, (await demoIds(db)).location('DEN'), { deliveredAt: '2023-01-10T18:00:00.000Z', warrantyMonths: 24 });
    const path = `/claims/new?buildId=${old.buildId}&buildItemId=${old.buildItemId}`;
    const fill = async (page: Page) => {
      await page.goto(path);
      const failedOn = page.getByLabel('Failed on');
      await failedOn.click();
      await failedOn.fill('2026-06-02');
      await failedOn.press('Enter');
      await choose(page, page.locator('#main'), 'How it failed', 'Will not charge');
      await page.getByLabel('What was seen').fill('No charge current from the alternator');
      await page.getByRole('button', { name: 'Log the claim' }).click();
      await page.getByText("The unit's warranty ended on 2025-01-10: only a goodwill claim is possible").waitFor();
      await page.getByText('This unit is out of its warranty period.').waitFor();
    };

    const clerk = await e2e.newPage();
    await e2e.signIn(clerk, 'warranty@demo.busbar.test');
    await fill(clerk);
    await clerk.getByText('Only a location lead may log it, as goodwill. Ask your lead.').waitFor();
    expect(await clerk.getByRole('button', { name: 'Log as goodwill' }).count()).toBe(0);

    const lead = await e2e.newPage();
    await e2e.signIn(lead, 'lead@demo.busbar.test');
    await fill(lead);
    await lead.getByRole('button', { name: 'Log as goodwill' }).click();
    await lead.getByRole('heading', { level: 1, name: /^Claim DEN-W\d{5}$/ }).waitFor();
    await lead.getByText('Out of warranty').waitFor();
    expect(await lead.getByText('Goodwill', { exact: true }).count()).toBe(1);

    await lead.getByRole('button', { name: 'Record replacement unit' }).click();
    const dialog = lead.getByRole('dialog');
    await dialog.getByLabel('Serial number of the new unit').fill('RPL-2026-0612');
    const putIn = dialog.getByLabel('Put in on');
    await putIn.click();
    await putIn.fill('2026-06-12');
    await putIn.press('Enter');
    await dialog.getByRole('button', { name: 'Record replacement' }).click();
    await lead.locator('.ant-descriptions').getByText('RPL-2026-0612').waitFor();
    // As laid out on screen, the word and the serial number keep their space.
    expect(await lead.locator('.ant-descriptions-item-content', { hasText: 'RPL-2026-0612' }).innerText()).toBe('Serial RPL-2026-0612');
    await lead.goto(`/builds/${old.buildId}`);
    const section = lead.locator('.ant-card').filter({ has: lead.getByText('Warranty claims', { exact: true }) });
    await section.getByText('Removed Jun 12, 2026, replaced under warranty').waitFor();
    await section.getByText('RPL-2026-0612').waitFor();
    // The new unit may fail in its turn; the removed one may not.
    expect(await section.getByRole('button', { name: /^Log a claim/ }).count()).toBe(1);
    await clerk.context().close();
    await lead.context().close();
  });

  it('keeps a file deleted with its reason, shows a failed send and sends it again, then takes the vendor\'s RMA number; a cancelled dialog opens again', async () => {
    const db = e2e.harness.db;
    const unit = await addDeliveredUnit(db, (await demoIds(db)).location('DEN'));
    const api = await e2e.harness.signedIn('warranty@demo.busbar.test');
    const claim = (await api.post('/api/claims').send({ buildItemId: unit.buildItemId, failedOn: '2026-06-10', failureMode: 'overheating', coverage: 'vendor_defect', symptoms: 'Case too hot to touch' })).body;
    await uploadEvidence(api, claim.id, SMALL_PNG, 'case.png');
    await uploadEvidence(api, claim.id, SMALL_PNG, 'blurred.png');

    const page = await e2e.newPage();
    await e2e.signIn(page, 'warranty@demo.busbar.test');
    await page.goto(`/claims/${claim.id}`);
    // A file that only claims to be a photo is refused, in words, and nothing is added.
    await page.locator('input[type="file"]').setInputFiles({ name: 'notes.png', mimeType: 'image/png', buffer: Buffer.from('not a photo at all') });
    await page.getByText('notes.png was not added: Upload a JPEG, PNG, WebP or HEIC photo, or a PDF').waitFor();
    expect(await page.getByRole('link', { name: 'notes.png' }).count()).toBe(0);

    // A dialog closed with Cancel opens again from the same button.
    await page.getByRole('button', { name: 'Delete blurred.png' }).click();
    const dialog = page.getByRole('dialog');
    await dialog.getByRole('button', { name: 'Cancel' }).click();
    await dialog.waitFor({ state: 'hidden' });
    await page.getByRole('button', { name: 'Delete blurred.png' }).click();
    await dialog.waitFor();
    await dialog.getByRole('button', { name: 'Delete file' }).click();
    await dialog.getByText('Say why the file is removed').waitFor();
    await dialog.getByLabel('Why is it removed?').fill('Too blurred to read');
    await dialog.getByRole('button', { name: 'Delete file' }).click();
    const deleted = page.getByRole('list', { name: 'Deleted files' });
    await deleted.getByText('Too blurred to read', { exact: false }).waitFor();
    expect(await deleted.locator('s', { hasText: 'blurred.png' }).count()).toBe(1);
    expect(await page.getByRole('link', { name: 'blurred.png' }).count()).toBe(0);

    await page.getByRole('button', { name: 'Mark evidence ready' }).click();
    await statusIs(page, 'Evidence ready');
    const port = e2e.harness.mail.port;
    await e2e.harness.mail.close();
    await page.getByRole('button', { name: 'Send to vendor' }).click();
    await page.getByText('The return request was not sent').waitFor();
    await page.getByText('The e-mail could not be sent, so nothing was changed. Try again later.').waitFor();
    await page.getByText(`E-mail to ${unit.vendor.rmaEmail} failed; not sent`).waitFor();
    await statusIs(page, 'Evidence ready');

    const back = await startMailCapture(port);
    try {
      await page.getByRole('button', { name: 'Send again' }).click();
      await statusIs(page, 'Sent to vendor');
      expect(await page.getByText('The return request was not sent').count()).toBe(0);
      const parsed = await simpleParser(back.messages.find((m) => m.to.includes(unit.vendor.rmaEmail))!.raw);
      expect(parsed.attachments.map((a) => a.filename)).toEqual(['case.png']);
    } finally {
      await back.close();
    }

    // Until the vendor answers, the clerk fills in what they send back.
    await page.getByRole('button', { name: 'Edit claim' }).click();
    const edit = page.getByRole('dialog');
    await edit.getByRole('button', { name: 'Cancel' }).click();
    await edit.waitFor({ state: 'hidden' });
    await page.getByRole('button', { name: 'Edit claim' }).click();
    await edit.waitFor();
    await edit.getByLabel("Vendor's RMA number").fill('RMA-55120');
    await edit.getByRole('button', { name: 'Save' }).click();
    await page.locator('.ant-descriptions').getByText('RMA-55120').waitFor();
    const saved = await e2e.harness.db.selectFrom('warrantyClaims').select('vendorRmaNumber').where('id', '=', claim.id).executeTakeFirstOrThrow();
    expect(saved.vendorRmaNumber).toBe('RMA-55120');
    await page.context().close();
  });
});
