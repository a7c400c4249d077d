import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { choose, startE2e, type E2e } from '../support/e2e-harness.ts';

let e2e: E2e;
beforeAll(async () => {
  e2e = await startE2e();
});
afterAll(async () => {
  await e2e?.close();
});

describe('the forgery-protection token follows the session', () => {
  it('sends a person whose session ended to sign in, not to a forgery refusal, when they next save', async () => {
    const lead = await e2e.newPage();
    await e2e.signIn(lead, 'lead@demo.busbar.test');
    await lead.getByRole('navigation').getByText('Staff', { exact: true }).click();
    await lead.getByRole('button', { name: 'Invite a person' }).click();
    const dialog = lead.getByRole('dialog');
    await dialog.getByLabel('Name').fill('Ines Valderrama');
    await dialog.getByLabel('E-mail').fill('ines.valderrama@example.test');
    await choose(lead, dialog, 'Role', 'Technician');
    // The session ends on the server while the page is open (expired, or ended elsewhere).
    await e2e.harness.db.deleteFrom('sessions').execute();
    await dialog.getByRole('button', { name: 'Send invite' }).click();
    await lead.getByRole('button', { name: 'Sign in' }).waitFor();
    expect(await lead.getByText('did not come from a Busbar page').count()).toBe(0);
    expect(new URL(lead.url()).pathname).toBe('/sign-in');
    const invited = await e2e.harness.db.selectFrom('users').select('id').where('email', '=', 'ines.valderrama@example.test').execute();
    expect(invited).toEqual([]);
    await lead.context().close();
  });
});

describe("the end-to-end harness's reused browser contexts", () => {
  it('open signed out even when the last page closed with answers on their way, which renew the session cookie', async () => {
    for (const email of ['lead@demo.busbar.test', 'regional@demo.busbar.test', 'lead@demo.busbar.test', 'regional@demo.busbar.test', 'lead@demo.busbar.test', 'regional@demo.busbar.test']) {
      const page = await e2e.newPage();
      await page.goto('/sign-in');
      // A person still signed in is sent on from the sign-in page to their home.
      await page.getByLabel('E-mail').or(page.getByRole('button', { name: 'Sign out' })).waitFor();
      expect(new URL(page.url()).pathname).toBe('/sign-in');
      await e2e.signIn(page, email);
      // Sent, not awaited: the page closes with them on their way.
      await page.evaluate(() => {
        for (let i = 0; i < 20; i++) void fetch('/api/session');
      });
      await page.context().close();
    }
  });
});
