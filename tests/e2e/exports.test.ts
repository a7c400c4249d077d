import { createHash } from 'node:crypto';
import { readFile } from 'node:fs/promises';
import type { Page } from 'playwright-core';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { startE2e, type E2e } from '../support/e2e-harness.ts';

let e2e: E2e;
beforeAll(async () => {
  e2e = await startE2e({ history: true });
});
afterAll(async () => {
  await e2e?.close();
});

const fitsWidth = (page: Page) => page.evaluate(() => document.documentElement.scrollWidth <= document.documentElement.clientWidth);

describe('exports and the close status', () => {
  it('the accountant exports May as a workbook, downloads it, and marks May final at Denver from the status grid', async () => {
    const page = await e2e.newPage();
    await e2e.signIn(page, 'accountant@demo.busbar.test');
    // The harness's clock stands at June 15, 2026: the month close opens on May.
    await page.getByRole('heading', { level: 1, name: 'Month close' }).waitFor();
    await page.getByRole('button', { name: 'Export this month' }).click();
    await page.getByRole('heading', { level: 1, name: 'Exports' }).waitFor();
    expect(new URL(page.url()).search).toBe('?month=2026-05');
    await page.getByText('No exports yet.').waitFor();
    expect(await page.getByLabel('First month').inputValue()).toBe('May 2026');
    expect(await page.getByLabel('Last month').inputValue()).toBe('May 2026');

    await page.getByRole('button', { name: 'Export', exact: true }).click();
    const row = page.locator('.ant-table-row').first();
    await expect.poll(() => row.textContent()).toMatch(/May 2026.*Whole network.*Workbook \(xlsx\)/);
    await row.getByText('Done', { exact: true }).waitFor({ timeout: 30_000 });
    expect(await row.textContent()).toMatch(/Felix Moreau/);
    const checksum = (await row.locator('code').getAttribute('title'))!.replace('SHA-256 ', '');
    expect(checksum).toMatch(/^[0-9a-f]{64}$/);
    expect(await row.locator('code').textContent()).toBe(checksum.slice(0, 12));

    const [download] = await Promise.all([page.waitForEvent('download'), row.getByRole('link', { name: /^Download / }).click()]);
    expect(download.suggestedFilename()).toMatch(/\.xlsx$/);
    const file = await readFile((await download.path())!);
    expect(file.subarray(0, 2).toString('latin1')).toBe('PK');
    expect(createHash('sha256').update(file).digest('hex')).toBe(checksum);

    // The grid: no month is final anywhere yet, so any ended month can be Denver's first.
    await page.getByRole('navigation', { name: 'Main' }).getByRole('link', { name: 'Close status' }).click();
    await page.getByRole('heading', { level: 1, name: 'Close status' }).waitFor();
    const denverMay = page.getByRole('link', { name: 'May 2026 at DEN Denver: Next to close' });
    await denverMay.waitFor();
    expect(await page.getByRole('link', { name: 'Apr 2026 at DEN Denver: Next to close' }).count()).toBe(1);
    await denverMay.click();
    await page.getByRole('heading', { level: 1, name: 'Month close' }).waitFor();
    expect(new URL(page.url()).search).toBe('?month=2026-05');
    const denver = page.locator('.ant-table-row', { hasText: 'DEN Denver' });
    await denver.getByRole('button', { name: 'Mark final' }).click();
    await page.getByRole('dialog', { name: 'Mark May 2026 final at DEN Denver?' }).getByRole('button', { name: 'Mark final' }).click();
    await denver.getByText('Final', { exact: true }).waitFor();

    await page.getByRole('link', { name: 'All months' }).click();
    await page.getByRole('link', { name: 'May 2026 at DEN Denver: Final' }).waitFor();
    // April can no longer be closed at Denver: its months close in order from May on.
    expect(await page.getByRole('link', { name: 'Apr 2026 at DEN Denver: Open' }).count()).toBe(1);
    expect(await page.getByRole('link', { name: 'May 2026 at BOI Boise: Next to close' }).count()).toBe(1);

    await page.setViewportSize({ width: 390, height: 844 });
    await page.locator('.ant-card', { hasText: 'DEN Denver' }).getByRole('link', { name: 'May 2026 Final at DEN Denver' }).waitFor();
    await expect.poll(() => fitsWidth(page)).toBe(true);
    await page.goto('/exports');
    await page.locator('.ant-card', { hasText: 'Whole network' }).getByText('Done', { exact: true }).waitFor();
    await expect.poll(() => fitsWidth(page)).toBe(true);
    await page.context().close();
  });
});
