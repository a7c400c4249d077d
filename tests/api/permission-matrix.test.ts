import type { Role } from '@busbar/shared';
import type request from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { demoIds, startHarness, type Agent, type Harness } from '../support/api-harness.ts';
import { addPerson, freshEmail, SIGN_INS, writtenRows, type SignIn } from '../support/staff-fixtures.ts';

const ROUTES = ['list', 'get', 'invite', 'resend', 'grant', 'remove', 'deactivate', 'reactivate'] as const;
type Route = (typeof ROUTES)[number];
type Cells = [number, number, number, number, number, number, number, number];

/** For each sign-in, a location inside what they may staff (own) and one outside it (other). */
const LOCATIONS: Record<SignIn, { own: string; other: string }> = {
  owner: { own: 'DEN', other: 'BTV' }, // the whole network is the owner's own
  regional: { own: 'PDX', other: 'AUS' }, // WEST
  lead: { own: 'DEN', other: 'AVL' },
  tech: { own: 'DEN', other: 'AVL' },
  warranty: { own: 'DEN', other: 'AVL' },
  accountant: { own: 'DEN', other: 'BTV' }, // network-wide, for money only
  lead2: { own: 'AVL', other: 'DEN' },
};

/**
 * Expected status of each staff route when it acts on the role at stake at the sign-in's own or
 * other location. Columns: list, get, invite, resend, grant, remove role, deactivate, reactivate.
 * A list answers 200 and holds the target exactly where `get` answers 200.
 */
const MATRIX: Record<'technician' | 'location_lead', Record<SignIn, { own: Cells; other: Cells }>> = {
  technician: {
    //          list get  invite resend grant remove deact react
    owner:      { own: [200, 200, 201, 204, 201, 200, 200, 200], other: [200, 200, 201, 204, 201, 200, 200, 200] },
    regional:   { own: [200, 200, 403, 403, 403, 403, 403, 403], other: [200, 404, 404, 404, 404, 404, 404, 404] },
    lead:       { own: [200, 200, 201, 204, 201, 200, 200, 200], other: [200, 404, 404, 404, 404, 404, 404, 404] },
    tech:       { own: [403, 403, 403, 403, 403, 403, 403, 403], other: [403, 403, 403, 403, 403, 403, 403, 403] },
    warranty:   { own: [403, 403, 403, 403, 403, 403, 403, 403], other: [403, 403, 403, 403, 403, 403, 403, 403] },
    accountant: { own: [403, 403, 403, 403, 403, 403, 403, 403], other: [403, 403, 403, 403, 403, 403, 403, 403] },
    lead2:      { own: [200, 200, 201, 204, 201, 200, 200, 200], other: [200, 404, 404, 404, 404, 404, 404, 404] },
  },
  location_lead: {
    //          list get  invite resend grant remove deact react
    owner:      { own: [200, 200, 201, 204, 201, 200, 200, 200], other: [200, 200, 201, 204, 201, 200, 200, 200] },
    regional:   { own: [200, 200, 201, 204, 201, 200, 200, 200], other: [200, 404, 404, 404, 404, 404, 404, 404] },
    lead:       { own: [200, 200, 403, 403, 403, 403, 403, 403], other: [200, 404, 404, 404, 404, 404, 404, 404] },
    tech:       { own: [403, 403, 403, 403, 403, 403, 403, 403], other: [403, 403, 403, 403, 403, 403, 403, 403] },
    warranty:   { own: [403, 403, 403, 403, 403, 403, 403, 403], other: [403, 403, 403, 403, 403, 403, 403, 403] },
    accountant: { own: [403, 403, 403, 403, 403, 403, 403, 403], other: [403, 403, 403, 403, 403, 403, 403, 403] },
    lead2:      { own: [200, 200, 403, 403, 403, 403, 403, 403], other: [200, 404, 404, 404, 404, 404, 404, 404] },
  },
};

describe('staff permission matrix', () => {
  let h: Harness;
  let ids: Awaited<ReturnType<typeof demoIds>>;
  const agents = {} as Record<SignIn, Agent>;

  beforeAll(async () => {
    h = await startHarness();
    ids = await demoIds(h.db);
    for (const name of Object.keys(SIGN_INS) as SignIn[]) agents[name] = await h.signedIn(SIGN_INS[name]);
  });
  afterAll(() => h.close());

  type Prepared = { targetId?: number; send: (agent: Agent) => request.Test };
  /** Each route gets a target of its own, made before the call, so no cell depends on another. */
  const PREPARE: Record<Route, (role: Role, locationId: number) => Promise<Prepared>> = {
    async list(role, locationId) {
      const target = await addPerson(h.db, { role, locationId });
      return { targetId: target.id, send: (agent) => agent.get('/api/staff').query({ locationId, q: target.email }) };
    },
    async get(role, locationId) {
      const target = await addPerson(h.db, { role, locationId });
      return { send: (agent) => agent.get(`/api/staff/${target.id}`) };
    },
    async invite(role, locationId) {
      const email = freshEmail();
      return { send: (agent) => agent.post('/api/staff/invites').send({ email, name: 'Matrix Invitee', role, locationId }) };
    },
    async resend(role, locationId) {
      const target = await addPerson(h.db, { role, locationId }, 'invited');
      return { send: (agent) => agent.post(`/api/staff/${target.id}/invite`) };
    },
    async grant(role, locationId) {
      const clerk = await addPerson(h.db, { role: 'warranty_clerk', locationId });
      return { send: (agent) => agent.post(`/api/staff/${clerk.id}/roles`).send({ role, locationId }) };
    },
    async remove(role, locationId) {
      const target = await addPerson(h.db, { role, locationId });
      return { send: (agent) => agent.delete(`/api/staff/${target.id}/roles/${target.assignmentId}`) };
    },
    async deactivate(role, locationId) {
      const target = await addPerson(h.db, { role, locationId });
      return { send: (agent) => agent.post(`/api/staff/${target.id}/deactivate`) };
    },
    async reactivate(role, locationId) {
      const target = await addPerson(h.db, { role, locationId }, 'inactive');
      return { send: (agent) => agent.post(`/api/staff/${target.id}/reactivate`) };
    },
  };

  /** Audit entries and e-mails a route writes when it succeeds; a refusal writes none. */
  const WRITES: Record<Route, { auditLog: number; mailLog: number }> = {
    list: { auditLog: 0, mailLog: 0 },
    get: { auditLog: 0, mailLog: 0 },
    invite: { auditLog: 2, mailLog: 1 },
    resend: { auditLog: 1, mailLog: 1 },
    grant: { auditLog: 1, mailLog: 0 },
    remove: { auditLog: 1, mailLog: 0 },
    deactivate: { auditLog: 1, mailLog: 0 },
    reactivate: { auditLog: 1, mailLog: 0 },
  };

  for (const [role, rows] of Object.entries(MATRIX) as [Role, (typeof MATRIX)['technician']][]) {
    for (const [signIn, row] of Object.entries(rows) as [SignIn, { own: Cells; other: Cells }][]) {
      for (const scope of ['own', 'other'] as const) {
        ROUTES.forEach((route, column) => {
          const expected = row[scope][column]!;
          const code = LOCATIONS[signIn][scope];
          it(`${signIn}: ${route} on a ${role} at ${code} (${scope}) answers ${expected}`, async () => {
            const { targetId, send } = await PREPARE[route](role, ids.location(code));
            const before = await writtenRows(h.db);
            const res = await send(agents[signIn]);
            expect(res.status, JSON.stringify(res.body)).toBe(expected);
            const after = await writtenRows(h.db);
            const writes = expected < 300 ? WRITES[route] : { auditLog: 0, mailLog: 0 };
            expect({ auditLog: after.auditLog - before.auditLog, mailLog: after.mailLog - before.mailLog }).toEqual(writes);
            if (route === 'list' && expected === 200) {
              expect(res.body.items.map((p: { id: number }) => p.id)).toEqual(row[scope][1] === 200 ? [targetId] : []);
            }
          });
        });
      }
    }
  }
});
