import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { choose, startE2e, type E2e } from '../support/e2e-harness.ts';

let e2e: E2e;
beforeAll(async () => {
  e2e = await startE2e();
});
afterAll(async () => {
  await e2e?.close();
});

describe('a lead brings a new technician on board', () => {
  it('invites by e-mail; the invitee sets a password from the mail, signs in, and signs out', async () => {
    const lead = await e2e.newPage();
    await e2e.signIn(lead, 'lead@demo.busbar.test');
    await lead.getByRole('navigation').getByText('Staff', { exact: true }).click();
    await lead.getByRole('button', { name: 'Invite a person' }).click();
    const dialog = lead.getByRole('dialog');
    await dialog.getByLabel('Name').fill('Noor Abernathy');
    await dialog.getByLabel('E-mail').fill('noor.abernathy@example.test');
    await choose(lead, dialog, 'Role', 'Technician');
    await dialog.getByRole('button', { name: 'Send invite' }).click();
    await expect.poll(() => lead.getByText('Noor Abernathy').count()).toBeGreaterThan(0);

    const mail = await e2e.harness.lastMailTo('noor.abernathy@example.test');
    expect(mail.link).toMatch(/\/set-password\?token=/);

    const invitee = await e2e.newPage();
    await invitee.goto(mail.link!);
    await invitee.getByLabel('New password', { exact: true }).fill('a long new password 42');
    await invitee.getByLabel('Repeat password').fill('a long new password 42');
    await invitee.getByRole('button', { name: 'Set password and sign in' }).click();
    await invitee.getByRole('button', { name: 'Sign out' }).waitFor();
    await expect.poll(() => invitee.getByText('Noor Abernathy').count()).toBeGreaterThan(0);

    await invitee.getByRole('button', { name: 'Sign out' }).click();
    await invitee.getByRole('button', { name: 'Sign in' }).waitFor();

    // The new password works for a later sign-in too.
    await e2e.signIn(invitee, 'noor.abernathy@example.test', 'a long new password 42');
    await invitee.context().close();
    await lead.context().close();
  });
});
