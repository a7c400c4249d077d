import { DEMO_PASSWORD } from '@busbar/db';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { demoIds, startHarness, type Agent, type Harness } from '../support/api-harness.ts';
import { SIGN_INS } from '../support/staff-fixtures.ts';

const AGENT = 'Mozilla/5.0 (test bench)';
const ADDRESS = '192.0.2.44';

describe('sign-in events in the audit log', () => {
  let h: Harness;
  let ids: Awaited<ReturnType<typeof demoIds>>;
  beforeAll(async () => {
    h = await startHarness({ trustProxy: true });
    ids = await demoIds(h.db);
  });
  afterAll(() => h.close());

  const signIn = (agent: Agent, email: string, password: string, address = ADDRESS) =>
    agent.post('/api/session').set('X-Forwarded-For', address).set('User-Agent', AGENT).send({ email, password });
  /** The audit rows written since `afterId`, parsed. */
  async function rowsAfter(afterId: number) {
    const rows = await h.db.selectFrom('auditLog').select(['id', 'at', 'actorId', 'action', 'entity', 'entityId', 'before', 'after']).where('id', '>', afterId).orderBy('id').execute();
    return rows.map(({ id: _id, ...r }) => ({ ...r, after: r.after && JSON.parse(r.after) }));
  }
  const lastId = async () => (await h.db.selectFrom('auditLog').select((eb) => eb.fn.max('id').as('id')).executeTakeFirstOrThrow()).id ?? 0;
  const at = () => h.clock.now.toISOString();

  it('records a sign-in and a sign-out with the address and user agent', async () => {
    const before = await lastId();
    const agent = await h.agent();
    expect((await signIn(agent, SIGN_INS.lead, DEMO_PASSWORD)).status).toBe(200);
    expect((await agent.delete('/api/session').set('X-Forwarded-For', ADDRESS).set('User-Agent', AGENT)).status).toBe(204);
    const lead = ids.user(SIGN_INS.lead);
    const origin = { address: ADDRESS, userAgent: AGENT };
    expect(await rowsAfter(before)).toEqual([
      { at: at(), actorId: lead, action: 'session.sign_in', entity: 'user', entityId: lead, before: null, after: origin },
      { at: at(), actorId: lead, action: 'session.sign_out', entity: 'user', entityId: lead, before: null, after: origin },
    ]);
  });

  it('records failures with the e-mail typed, naming no one as actor, and answers an unknown e-mail as a known one', async () => {
    const before = await lastId();
    const agent = await h.agent();
    const known = await signIn(agent, SIGN_INS.tech, 'not the password', '192.0.2.50');
    const unknown = await signIn(agent, 'nobody.here@demo.busbar.test', 'not the password', '192.0.2.50');
    expect([known.status, unknown.status]).toEqual([401, 401]);
    expect(unknown.body).toEqual(known.body);
    const origin = { address: '192.0.2.50', userAgent: AGENT };
    expect(await rowsAfter(before)).toEqual([
      { at: at(), actorId: null, action: 'session.sign_in_failed', entity: 'user', entityId: ids.user(SIGN_INS.tech), before: null, after: { email: SIGN_INS.tech, ...origin } },
      { at: at(), actorId: null, action: 'session.sign_in_failed', entity: 'user', entityId: null, before: null, after: { email: 'nobody.here@demo.busbar.test', ...origin } },
    ]);
  });

  it('records the lock-out once, when the tenth failure locks the address out of the account', async () => {
    const before = await lastId();
    const agent = await h.agent();
    for (let i = 0; i < 10; i++) expect((await signIn(agent, SIGN_INS.warranty, 'wrong-password', '192.0.2.60')).status).toBe(401);
    for (let i = 0; i < 2; i++) expect((await signIn(agent, SIGN_INS.warranty, DEMO_PASSWORD, '192.0.2.60')).status).toBe(429);
    const rows = await rowsAfter(before);
    expect(rows.map((r) => r.action)).toEqual([...Array(10).fill('session.sign_in_failed'), 'session.locked']);
    expect(rows.at(-1)).toEqual({
      at: at(), actorId: null, action: 'session.locked', entity: 'user', entityId: ids.user(SIGN_INS.warranty), before: null,
      after: { email: SIGN_INS.warranty, locked: 'account_address', address: '192.0.2.60', userAgent: AGENT },
    });
  });

  it('lists the events to the owner under their action names', async () => {
    const owner = await h.agent();
    expect((await signIn(owner, SIGN_INS.owner, DEMO_PASSWORD)).status).toBe(200);
    const log = await owner.get('/api/audit').query({ entity: 'user', pageSize: 3 });
    expect(log.status).toBe(200);
    expect(log.body.items.map((e: { action: string; actorName: string | null }) => [e.action, e.actorName])).toEqual([
      ['session.sign_in', 'Marguerite Okafor'],
      ['session.locked', null],
      ['session.sign_in_failed', null],
    ]);
  });
});
