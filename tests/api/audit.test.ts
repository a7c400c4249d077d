import { auditQuery, type AuditEntry } from '@busbar/shared';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { listAudit, writeAudit } from '../../apps/api/src/queries/audit.ts';
import { demoIds, startHarness, type Harness } from '../support/api-harness.ts';
import { freshEmail, SIGN_INS, tokenOf } from '../support/staff-fixtures.ts';

describe('audit log', () => {
  let h: Harness;
  let ids: Awaited<ReturnType<typeof demoIds>>;
  /** Every change of one person's life, each at its own time, with the ids the answers gave. */
  const story = { personId: 0, technicianRoleId: 0, clerkRoleId: 0, email: freshEmail('audited') };

  beforeAll(async () => {
    h = await startHarness();
    ids = await demoIds(h.db);
    const lead = await h.signedIn(SIGN_INS.lead);
    const den = ids.location('DEN');
    const at = (iso: string) => (h.clock.now = new Date(iso));

    at('2026-06-15T15:00:00Z');
    const invited = await lead.post('/api/staff/invites').send({ email: story.email, name: 'Audra Vell', role: 'technician', locationId: den });
    story.personId = invited.body.id;
    story.technicianRoleId = invited.body.assignments[0].id;
    at('2026-06-15T16:05:00Z');
    expect((await lead.post(`/api/staff/${story.personId}/invite`)).status).toBe(204);
    at('2026-06-15T17:10:00Z');
    const token = tokenOf((await h.lastMailTo(story.email)).link);
    expect((await (await h.agent()).post('/api/invites/accept').send({ token, password: 'amp-hours-all-day' })).status).toBe(200);
    at('2026-06-15T18:15:00Z');
    const granted = await lead.post(`/api/staff/${story.personId}/roles`).send({ role: 'warranty_clerk', locationId: den });
    story.clerkRoleId = granted.body.assignments.find((a: { role: string }) => a.role === 'warranty_clerk').id;
    at('2026-06-15T19:20:00Z');
    expect((await lead.delete(`/api/staff/${story.personId}/roles/${story.clerkRoleId}`)).status).toBe(200);
    at('2026-06-15T20:25:00Z');
    expect((await lead.post(`/api/staff/${story.personId}/deactivate`)).status).toBe(200);
    at('2026-06-15T21:30:00Z');
    expect((await lead.post(`/api/staff/${story.personId}/reactivate`)).status).toBe(200);
  });
  afterAll(() => h.close());

  it('records every change with actor, action, entity, before, after and the time of the clock', async () => {
    const lead = ids.user(SIGN_INS.lead);
    const den = ids.location('DEN');
    const { personId, technicianRoleId, clerkRoleId, email } = story;
    const columns = ['at', 'actorId', 'action', 'entity', 'entityId', 'before', 'after'] as const;
    // Sign-ins are audited too (sign-in-audit.test.ts); this story is about the changes.
    const rows = await h.db.selectFrom('auditLog').select(columns).where('action', 'not like', 'session.%').orderBy('id').execute();
    const parsed = rows.map((r) => ({ ...r, before: r.before && JSON.parse(r.before), after: r.after && JSON.parse(r.after) }));
    const clerkRole = { role: 'warranty_clerk', scope: 'location', regionId: null, locationId: den };
    const technicianRole = { role: 'technician', scope: 'location', regionId: null, locationId: den };
    const onPerson = { entity: 'user', entityId: personId };
    expect(parsed).toEqual([
      { at: '2026-06-15T15:00:00.000Z', actorId: lead, action: 'person.invite', ...onPerson, before: null, after: { email, name: 'Audra Vell', status: 'invited' } },
      {
        at: '2026-06-15T15:00:00.000Z', actorId: lead, action: 'role.grant', entity: 'role_assignment', entityId: technicianRoleId,
        before: null, after: { userId: personId, ...technicianRole },
      },
      { at: '2026-06-15T16:05:00.000Z', actorId: lead, action: 'person.reinvite', ...onPerson, before: null, after: null },
      { at: '2026-06-15T17:10:00.000Z', actorId: personId, action: 'person.accept_invite', ...onPerson, before: { status: 'invited' }, after: { status: 'active' } },
      {
        at: '2026-06-15T18:15:00.000Z', actorId: lead, action: 'role.grant', entity: 'role_assignment', entityId: clerkRoleId,
        before: null, after: { userId: personId, ...clerkRole },
      },
      {
        at: '2026-06-15T19:20:00.000Z', actorId: lead, action: 'role.remove', entity: 'role_assignment', entityId: clerkRoleId,
        before: { id: clerkRoleId, userId: personId, ...clerkRole, regionName: null, locationCode: 'DEN', locationName: 'Denver' }, after: null,
      },
      { at: '2026-06-15T20:25:00.000Z', actorId: lead, action: 'person.deactivate', ...onPerson, before: { status: 'active' }, after: { status: 'inactive' } },
      { at: '2026-06-15T21:30:00.000Z', actorId: lead, action: 'person.reactivate', ...onPerson, before: { status: 'inactive' }, after: { status: 'active' } },
    ]);
  });

  it('shows the log to the owner, newest first with the actor named, filtered by entity', async () => {
    const owner = await h.signedIn(SIGN_INS.owner);
    const all = await owner.get('/api/audit');
    expect(all.status).toBe(200);
    expect(all.body).toMatchObject({ total: 10, page: 1, pageSize: 50 });
    expect(all.body.items.map((e: { action: string }) => e.action)).toEqual([
      'session.sign_in', 'person.reactivate', 'person.deactivate', 'role.remove', 'role.grant', 'person.accept_invite', 'person.reinvite', 'role.grant', 'person.invite', 'session.sign_in',
    ]);
    expect(all.body.items[1]).toMatchObject({ actorName: 'Priya Halvorsen', before: { status: 'inactive' }, after: { status: 'active' } });
    expect(all.body.items[5].actorName).toBe('Audra Vell');

    const roles = await owner.get('/api/audit').query({ entity: 'role_assignment', pageSize: 2, page: 2 });
    expect(roles.body.total).toBe(3);
    expect(roles.body.items.map((e: { entityId: number }) => e.entityId)).toEqual([story.technicianRoleId]);
  });

  it('says each row in words: who by name, what, and which record by its name', async () => {
    const owner = await h.signedIn(SIGN_INS.owner);
    // Sign-ins are in the log too: this story is everything else.
    const items = ((await owner.get('/api/audit')).body.items as AuditEntry[]).filter((e) => !e.action.startsWith('session.'));
    expect(items.map((e) => [e.summary, e.record])).toEqual([
      ['Reactivated Audra Vell', 'Person Audra Vell'],
      ['Deactivated Audra Vell', 'Person Audra Vell'],
      ['Took the role Warranty clerk at Denver (DEN) from Audra Vell', 'Role of Audra Vell'],
      ['Made Audra Vell Warranty clerk at Denver (DEN)', 'Role of Audra Vell'],
      ['Audra Vell accepted the invitation', 'Person Audra Vell'],
      ['Sent Audra Vell a new invitation', 'Person Audra Vell'],
      ['Made Audra Vell Technician at Denver (DEN)', 'Role of Audra Vell'],
      ['Invited Audra Vell', 'Person Audra Vell'],
    ]);
    expect(items.at(-1)!.details).toEqual([`Email: ${story.email}`, 'Name: Audra Vell', 'Status: invited']);
  });

  it('says sign-in, sign-out and password rows in words with their address and browser, and any unknown action plainly', async () => {
    const person = story.personId;
    const origin = { address: '203.0.113.7', userAgent: 'TestBrowser/1.0' };
    const rows = [
      { action: 'session.sign_in', entityId: person, after: origin },
      { action: 'session.sign_in_failed', entityId: null, after: { ...origin, email: 'nobody@example.test' } },
      { action: 'session.locked', entityId: person, after: origin },
      { action: 'session.sign_out', entityId: person, after: origin },
      { action: 'person.password_change', entityId: person, after: origin },
      { action: 'person.password_reset_link', entityId: person, after: origin },
      { action: 'person.password_reset', entityId: person, after: origin },
      { action: 'gadget.recalibrate', entityId: 42, after: { dial: 3 } },
    ];
    const at = '2026-06-16T09:00:00.000Z';
    for (const row of rows) await writeAudit(h.db, { at, actorId: row.entityId, entity: row.action.startsWith('gadget') ? 'gadget' : 'user', ...row });
    const owner = await h.signedIn(SIGN_INS.owner);
    const page = (await owner.get('/api/audit').query({ from: '2026-06-16', to: '2026-06-17' })).body;
    const said = new Map((page.items as AuditEntry[]).map((e) => [e.action, [e.summary, ...e.details]]));
    const where = ['From address 203.0.113.7', 'Browser: TestBrowser/1.0'];
    expect(Object.fromEntries(said)).toEqual({
      'session.sign_in': ['Audra Vell signed in', ...where],
      'session.sign_in_failed': ['Failed sign-in as nobody@example.test', ...where],
      'session.locked': ['Sign-in locked for Audra Vell after repeated failures', ...where],
      'session.sign_out': ['Audra Vell signed out', ...where],
      'person.password_change': ['Audra Vell changed their password', ...where],
      'person.password_reset_link': ['A link to choose a new password was sent to Audra Vell', ...where],
      'person.password_reset': ['Password of Audra Vell was reset', ...where],
      'gadget.recalibrate': ['Gadget recalibrate: Gadget 42', 'Dial: 3'],
    });
    await h.db.deleteFrom('auditLog').where('at', '=', at).execute();
  });

  it("names no record or person outside the reader's shops, and shows them no stored record", async () => {
    const elsewhere = await listAudit(h.db, { scope: [ids.location('AVL')], money: false }, auditQuery.parse({}));
    const text = JSON.stringify(elsewhere.items.map((e) => [e.actorName, e.summary, e.record, e.details]));
    expect(text).not.toMatch(/Audra Vell|Priya Halvorsen|Denver/);
    const reactivated = elsewhere.items.find((e) => e.action === 'person.reactivate');
    expect(reactivated).toMatchObject({ actorName: 'A person outside your shops', summary: 'Reactivated a person', record: 'A person', details: [], before: null, after: null });
  });

  it('keeps the log from everyone but the owner', async () => {
    for (const email of [SIGN_INS.regional, SIGN_INS.lead, SIGN_INS.tech, SIGN_INS.warranty, SIGN_INS.accountant, SIGN_INS.lead2]) {
      const res = await (await h.signedIn(email)).get('/api/audit');
      expect([email, res.status, res.body]).toEqual([email, 403, { error: { code: 'forbidden', message: 'You do not have permission to do that' } }]);
    }
  });
});
