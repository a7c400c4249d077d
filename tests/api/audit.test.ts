import { afterAll, beforeAll, describe, expect, it } from 'vitest';
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
    expect((await (await h.agent()).post('/api/invites/accept').send({ token, password: 'audited-password' })).status).toBe(200);
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
    const rows = await h.db.selectFrom('auditLog').select(columns).orderBy('id').execute();
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
    expect(all.body).toMatchObject({ total: 8, page: 1, pageSize: 50 });
    expect(all.body.items.map((e: { action: string }) => e.action)).toEqual([
      'person.reactivate', 'person.deactivate', 'role.remove', 'role.grant', 'person.accept_invite', 'person.reinvite', 'role.grant', 'person.invite',
    ]);
    expect(all.body.items[0]).toMatchObject({ actorName: 'Priya Halvorsen', before: { status: 'inactive' }, after: { status: 'active' } });
    expect(all.body.items[4].actorName).toBe('Audra Vell');

    const roles = await owner.get('/api/audit').query({ entity: 'role_assignment', pageSize: 2, page: 2 });
    expect(roles.body.total).toBe(3);
    expect(roles.body.items.map((e: { entityId: number }) => e.entityId)).toEqual([story.technicianRoleId]);
  });

  it('keeps the log from everyone but the owner', async () => {
    for (const email of [SIGN_INS.regional, SIGN_INS.lead, SIGN_INS.tech, SIGN_INS.warranty, SIGN_INS.accountant, SIGN_INS.lead2]) {
      const res = await (await h.signedIn(email)).get('/api/audit');
      expect([email, res.status, res.body]).toEqual([email, 403, { error: { code: 'forbidden', message: 'You do not have permission to do that' } }]);
    }
  });
});
