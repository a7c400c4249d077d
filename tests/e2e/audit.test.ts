import type { BuildDetail } from '@busbar/shared';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { demoIds } from '../support/api-harness.ts';
import { createBuild, moveThrough } from '../support/build-fixtures.ts';
import { addCatalogItem, addVendor } from '../support/catalog-fixtures.ts';
import { startE2e, type E2e } from '../support/e2e-harness.ts';
import { SIGN_INS } from '../support/staff-fixtures.ts';

let e2e: E2e;
/** A delivered DEN build with one house battery, and another DEN build the filter must leave out. */
let build: BuildDetail;
let other: BuildDetail;

beforeAll(async () => {
  e2e = await startE2e();
  const db = e2e.harness.db;
  const ids = await demoIds(db);
  const vendor = await addVendor(db, { name: 'Quillon Cells' });
  const battery = await addCatalogItem(db, { vendorId: vendor.id, sku: 'QC-LFP200', name: 'Quillon 200 Ah house battery' });
  const lead = await e2e.harness.signedIn(SIGN_INS.lead);
  build = await createBuild(db, lead, ids.location('DEN'), { leadTechnicianId: ids.user(SIGN_INS.tech), bookedFor: '2026-06-20' });
  build = (await lead.post(`/api/builds/${build.id}/items`).send({ version: build.version, catalogItemId: battery.id, quantity: 1, serialNumber: 'QC-1001' })).body;
  build = await moveThrough(lead, build, ['quoted', 'booked', 'in_bay', 'quality_check', 'delivered']);
  other = await createBuild(db, lead, ids.location('DEN'));
}, 60_000);
afterAll(async () => {
  await e2e?.close();
});

/** Whether the page scrolls sideways at its current width. */
const scrollsSideways = (page: Awaited<ReturnType<E2e['newPage']>>) => page.evaluate(() => document.documentElement.scrollWidth > window.innerWidth);

describe('the record of changes', () => {
  it("the lead corrects a delivered unit's serial with a reason; the history says it in words", async () => {
    const page = await e2e.newPage();
    await e2e.signIn(page, SIGN_INS.lead);
    await page.goto(`/builds/${build.id}`);
    await page.getByRole('button', { name: 'Edit QC-LFP200' }).click();
    // The dialog says what it does in its title.
    const dialog = page.locator('.ant-modal-content').filter({ has: page.locator('.ant-modal-title', { hasText: 'Serial number of Quillon 200 Ah house battery (QC-LFP200)' }) });
    await dialog.getByLabel('Serial number').fill('QC-1002');
    await dialog.getByRole('button', { name: 'Save' }).click();
    await expect.poll(() => dialog.getByText('Say why the delivered build is corrected').count()).toBe(1);
    // Closing the dialog takes its message with it.
    await dialog.getByRole('button', { name: 'Cancel' }).click();
    await dialog.waitFor({ state: 'detached' });
    await page.getByRole('button', { name: 'Edit QC-LFP200' }).click();
    await expect.poll(() => dialog.getByText('Say why the delivered build is corrected').count()).toBe(0);
    await dialog.getByLabel('Serial number').fill('QC-1002');
    await dialog.getByLabel('Reason for the correction').fill('Label was misread at delivery');
    await dialog.getByRole('button', { name: 'Save' }).click();
    await dialog.waitFor({ state: 'hidden' });

    const history = page.getByRole('region', { name: `History of build ${build.number}` });
    await history.getByText('Serial of Quillon 200 Ah house battery (SKU QC-LFP200) changed from QC-1001 to QC-1002').waitFor();
    await history.getByText('Reason: Label was misread at delivery').waitFor();
    await history.getByText('Status: Final check → Delivered').waitFor();
    await page.getByText(`History of build ${build.number}`).waitFor();
  }, 180_000);

  it('the owner reads the audit log in words and narrows it to one build by its number, at office and phone widths', async () => {
    const page = await e2e.newPage();
    await e2e.signIn(page, SIGN_INS.owner);
    await page.goto('/audit');
    const table = page.locator('.ant-table');
    await table.getByText(`Serial of Quillon 200 Ah house battery (SKU QC-LFP200) changed from QC-1001 to QC-1002 on build ${build.number}`).waitFor();
    await table.getByText('Reason: Label was misread at delivery').waitFor();
    await table.getByText(`Created build ${other.number}`).waitFor();
    expect(await scrollsSideways(page)).toBe(false);

    await page.getByLabel('Build number').fill(build.number);
    await page.getByLabel('Build number').press('Enter');
    await expect.poll(() => page.url()).toContain(`buildNumber=${build.number}`);
    await expect.poll(() => table.getByText(`Created build ${other.number}`).count()).toBe(0);
    await table.getByText(`Created build ${build.number}`).waitFor();
    const records = await table.locator('.ant-table-row').allInnerTexts();
    expect(records.length).toBe(8);
    for (const row of records) expect(row).toContain(`uild ${build.number}`);

    await page.setViewportSize({ width: 390, height: 800 });
    await table.getByText('Priya Halvorsen').first().waitFor();
    expect(await scrollsSideways(page)).toBe(false);
  }, 180_000);
});
