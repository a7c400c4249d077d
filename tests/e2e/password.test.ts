import type { Page } from 'playwright-core';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { startE2e, type E2e } from '../support/e2e-harness.ts';

let e2e: E2e;
beforeAll(async () => {
  e2e = await startE2e();
});
afterAll(async () => {
  await e2e?.close();
});

/** True when the page scrolls sideways at its current width. */
const scrollsSideways = (page: Page) => page.evaluate(() => document.documentElement.scrollWidth > window.innerWidth);

describe('passwords', () => {
  it('a lead changes their password from their own menu, at desk and phone widths', async () => {
    const lead = await e2e.newPage();
    await e2e.signIn(lead, 'lead2@demo.busbar.test');
    // By keyboard: the person's menu opens with its link in focus.
    await lead.getByRole('button', { name: /Rosalind Achebe/ }).focus();
    await lead.keyboard.press('Enter');
    await expect.poll(() => lead.evaluate(() => document.activeElement?.textContent?.trim())).toBe('Change password');
    await lead.keyboard.press('Enter');
    await lead.getByRole('heading', { name: 'Change password' }).waitFor();
    expect(await scrollsSideways(lead)).toBe(false);

    await lead.getByLabel('Current password').fill('kestrel-demo-2026');
    await lead.getByLabel('New password', { exact: true }).fill('password1234');
    await lead.getByLabel('Repeat new password').fill('password1234');
    await lead.getByRole('button', { name: 'Change password' }).click();
    await lead.getByText('This password is too easy to guess.', { exact: false }).waitFor();

    await lead.setViewportSize({ width: 390, height: 800 });
    // The menu folds to its icons once the narrower width is seen.
    await expect.poll(() => scrollsSideways(lead)).toBe(false);
    await lead.getByLabel('New password', { exact: true }).fill('harbor lanterns glow at dusk');
    await lead.getByLabel('Repeat new password').fill('harbor lanterns glow at dusk');
    await lead.getByRole('button', { name: 'Change password' }).click();
    await lead.getByText('Your password is changed.', { exact: false }).waitFor();
    expect(await scrollsSideways(lead)).toBe(false);

    await lead.getByRole('button', { name: 'Sign out' }).click();
    await lead.getByRole('button', { name: 'Sign in' }).waitFor();
    await e2e.signIn(lead, 'lead2@demo.busbar.test', 'harbor lanterns glow at dusk');
    await lead.context().close();
  });

  it('a technician who forgot their password sets a new one from the e-mailed link, which then no longer works', async () => {
    const page = await e2e.newPage();
    await page.goto('/sign-in');
    await page.getByRole('link', { name: 'Forgot your password?' }).click();
    // The sign-in form has an E-mail field too: fill this page's, once it is there.
    await page.getByRole('button', { name: 'Send the link' }).waitFor();
    await page.getByLabel('E-mail').fill('tech@demo.busbar.test');
    await page.getByRole('button', { name: 'Send the link' }).click();
    await page.getByText('If that e-mail address has a Busbar account', { exact: false }).waitFor();

    const db = e2e.harness.db;
    await expect.poll(async () => (await db.selectFrom('mailLog').select('id').where('toAddress', '=', 'tech@demo.busbar.test').execute()).length).toBe(1);
    const mail = await e2e.harness.lastMailTo('tech@demo.busbar.test');
    expect(mail.link).toMatch(/\/reset-password\?token=/);
    const link = mail.link!;

    await page.setViewportSize({ width: 390, height: 800 });
    await page.goto(link);
    await page.getByRole('heading', { name: 'Choose a new password' }).waitFor();
    await expect.poll(() => scrollsSideways(page)).toBe(false);
    await page.getByLabel('New password', { exact: true }).fill('quiet maple ferry rides');
    await page.getByLabel('Repeat password').fill('quiet maple ferry rides');
    await page.getByRole('button', { name: 'Set password and sign in' }).click();
    await page.getByRole('button', { name: 'Sign out' }).waitFor();

    await page.getByRole('button', { name: 'Sign out' }).click();
    await page.getByRole('button', { name: 'Sign in' }).waitFor();
    await page.goto(link);
    await page.getByText('This link is not valid or has already been used.', { exact: false }).waitFor();
    await e2e.signIn(page, 'tech@demo.busbar.test', 'quiet maple ferry rides');
    await page.context().close();
  });
});
