import type { Rollups } from '@busbar/shared';
import { simpleParser } from 'mailparser';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { digestWeek, sendWeeklyDigests } from '../../apps/api/src/digest/weekly-digest.ts';
import { createMailer, type Mailer } from '../../apps/api/src/mail/mailer.ts';
import { demoIds, startHarness, type Harness } from '../support/api-harness.ts';

let h: Harness;
let mailer: Mailer;
let ids: Awaited<ReturnType<typeof demoIds>>;
beforeAll(async () => {
  h = await startHarness({}, true, { history: true });
  ids = await demoIds(h.db);
  // The app's own mail path, to the harness's real SMTP capture.
  mailer = createMailer(h.db, `smtp://127.0.0.1:${h.mail.port}`, 'Busbar <no-reply@busbar.test>', () => h.clock.now, true);
}, 60_000);
afterAll(async () => {
  mailer.close();
  await h.close();
});

// The harness's clock: Monday, June 15, 2026, 15:00 UTC.
const NOW = new Date('2026-06-15T15:00:00Z');
const mailTo = async (to: string) => {
  const found = h.mail.messages.filter((m) => m.to.includes(to));
  return Promise.all(found.map(async (m) => simpleParser(m.raw)));
};

describe('the weekly e-mail', () => {
  it('covers the last whole week from Monday noon UTC, when every shop has ended its Sunday', () => {
    expect(digestWeek(new Date('2026-06-15T11:59:00Z'))).toBeNull();
    expect(digestWeek(new Date('2026-06-15T12:00:00Z'))).toEqual({ key: '2026-06-08', start: '2026-06-08', end: '2026-06-14' });
    // Later in the week (and on Sunday) it is still the week before.
    expect(digestWeek(new Date('2026-06-21T23:00:00Z'))).toEqual({ key: '2026-06-08', start: '2026-06-08', end: '2026-06-14' });
  });

  it("goes once to every lead and regional manager who wants it, each with their own shops' week", async () => {
    // Asheville's lead turns it off for themselves.
    const lead2 = await h.signedIn('lead2@demo.busbar.test');
    const off = await lead2.patch('/api/session').send({ weeklyDigest: false });
    expect(off.status).toBe(200);
    expect(off.body.person.weeklyDigest).toBe(false);

    const wanting = await h.db
      .selectFrom('users as u')
      .innerJoin('roleAssignments as r', 'r.userId', 'u.id')
      .select('u.email')
      .distinct()
      .where('r.role', 'in', ['regional_manager', 'location_lead'])
      .where('u.status', '=', 'active')
      .where('u.weeklyDigest', '=', 1)
      .execute();
    expect(await sendWeeklyDigests(h.db, mailer, 'http://localhost:3000', NOW)).toBe(wanting.length);
    expect(await sendWeeklyDigests(h.db, mailer, 'http://localhost:3000', NOW)).toBe(0);
    expect(await mailTo('lead2@demo.busbar.test')).toEqual([]);

    const [lead] = await mailTo('lead@demo.busbar.test');
    expect(lead!.subject).toBe("Busbar: last week's figures (Mon, Jun 8, 2026 to Sun, Jun 14, 2026)");
    const week = (await (await h.signedIn('lead@demo.busbar.test')).get('/api/rollups?from=2026-06-08&to=2026-06-14&grain=week').expect(200)).body as Rollups;
    const den = week.rows.find((r) => r.locationId === ids.location('DEN') && r.period === '2026-06-08');
    const network = week.network.find((r) => r.period === '2026-06-08')!;
    const text = lead!.text!;
    expect(text).toContain(`Denver (DEN)\n  Builds delivered: ${den?.buildsDelivered ?? 0} (week before`);
    expect(text).toContain(`The whole network\n  Builds delivered: ${network.buildsDelivered} (`);
    expect(text).toContain('Open Busbar: http://localhost:3000/shop-week');
    for (const other of ['Boise', 'Austin', 'Asheville', 'Portland']) expect(text).not.toContain(other);

    const [regional] = await mailTo('regional@demo.busbar.test');
    for (const shop of ['Denver (DEN)', 'Boise (BOI)', 'Portland (PDX)', 'Phoenix (PHX)', 'Mountain and Pacific region']) expect(regional!.text).toContain(shop);
    expect(regional!.text).not.toContain('Austin');
    expect(regional!.text).toContain('http://localhost:3000/compare');

    // Each is in the Outbox like any other message.
    const outbox = await h.db.selectFrom('mailLog').select(['toAddress', 'subject', 'status']).where('subject', 'like', "Busbar: last week's figures%").execute();
    expect(outbox).toHaveLength(wanting.length);
    expect(outbox.every((m) => m.status === 'sent')).toBe(true);
  });

  it('is turned on and off by the person alone, with the choice said plainly', async () => {
    const tech = await h.signedIn('tech@demo.busbar.test');
    expect((await tech.get('/api/session').expect(200)).body.person.weeklyDigest).toBe(true);
    const bad = await tech.patch('/api/session').send({ weeklyDigest: 'no' }).expect(400);
    expect(bad.body.error.fields.weeklyDigest).toBe('Say whether you want the weekly e-mail');
    await tech.patch('/api/session').send({ weeklyDigest: true, email: 'x@example.test' }).expect(400);
    await (await h.agent()).patch('/api/session').send({ weeklyDigest: false }).expect(401);
  });
});
