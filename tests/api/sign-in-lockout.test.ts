import { join } from 'node:path';
import { createApp } from '@busbar/api';
import { DEMO_PASSWORD, openDatabase } from '@busbar/db';
import request from 'supertest';
import { afterEach, describe, expect, it } from 'vitest';
import type { Config } from '../../apps/api/src/config.ts';
import { loadConfig } from '../../apps/api/src/config.ts';
import { createMailer } from '../../apps/api/src/mail/mailer.ts';
import { startHarness, type Agent, type Harness } from '../support/api-harness.ts';
import { SIGN_INS } from '../support/staff-fixtures.ts';

const LOCKED = { error: { code: 'too_many_attempts', message: 'Too many failed sign-ins from here. Try again in 15 minutes.' } };
const STRANGER = '203.0.113.7';
const OWNER_DESK = '198.51.100.2';

/** A sign-in from an address: the harness trusts one proxy, so the forwarded-for header is the client's address. */
const from = (agent: Agent | request.Agent, address: string, email: string, password: string) =>
  agent.post('/api/session').set('X-Forwarded-For', address).send({ email, password });
const attempts = (h: Harness) => h.db.selectFrom('signInAttempts').select(['email', 'address', 'at']).orderBy('id').execute();

describe('sign-in lock-out per account and address', () => {
  let h: Harness;
  afterEach(() => h.close());

  it("locks a stranger's address out after ten failures, and the owner still signs in from theirs", async () => {
    h = await startHarness({ trustProxy: true });
    const stranger = await h.agent();
    for (let i = 0; i < 10; i++) expect((await from(stranger, STRANGER, SIGN_INS.owner, `guess number ${i}`)).status).toBe(401);
    const refused = await from(stranger, STRANGER, SIGN_INS.owner, DEMO_PASSWORD);
    expect([refused.status, refused.body, refused.headers['retry-after']]).toEqual([429, LOCKED, '900']);

    const owner = await from(await h.agent(), OWNER_DESK, SIGN_INS.owner, DEMO_PASSWORD);
    expect(owner.status).toBe(200);
    expect(owner.body.person.email).toBe(SIGN_INS.owner);
    // The stranger's address is locked out of that account only.
    expect((await from(stranger, STRANGER, SIGN_INS.tech, DEMO_PASSWORD)).status).toBe(200);
  });

  it('keeps the address locked for 15 minutes, then lets it in, and deletes failures older than that', async () => {
    h = await startHarness({ trustProxy: true });
    const agent = await h.agent();
    for (let i = 0; i < 10; i++) expect((await from(agent, STRANGER, SIGN_INS.lead, 'not the password')).status).toBe(401);
    h.clock.now = new Date(h.clock.now.getTime() + 15 * 60_000 - 1000);
    const late = await from(agent, STRANGER, SIGN_INS.lead, DEMO_PASSWORD);
    expect([late.status, late.headers['retry-after'], late.body.error.message]).toEqual([429, '1', 'Too many failed sign-ins from here. Try again in 1 minute.']);
    expect(await h.db.selectFrom('sessions').select('sid').execute()).toEqual([]);

    h.clock.now = new Date(h.clock.now.getTime() + 1000);
    expect((await from(agent, STRANGER, SIGN_INS.lead, DEMO_PASSWORD)).status).toBe(200);
    expect((await from(agent, STRANGER, SIGN_INS.tech, 'a later mistake')).status).toBe(401);
    expect(await attempts(h)).toEqual([{ email: SIGN_INS.tech, address: STRANGER, at: h.clock.now.toISOString() }]);
  });

  it('never counts a request that fails validation', async () => {
    h = await startHarness({ trustProxy: true, signInLimit: { windowMs: 15 * 60_000, perAccountAddress: 2, perAddress: 2, slowAfter: 0, delayMs: 5000, maxDelayMs: 5000 } });
    const agent = await h.agent();
    const malformed = [
      { email: SIGN_INS.lead, password: '' },
      { email: SIGN_INS.lead },
      { email: SIGN_INS.lead, password: 'wrong-password', remember: true },
      { email: 'lead at demo', password: 'wrong-password' },
      { email: SIGN_INS.lead, password: 'p'.repeat(201) },
    ];
    for (const body of malformed) expect((await agent.post('/api/session').set('X-Forwarded-For', STRANGER).send(body)).status).toBe(400);
    const unreadable = await agent.post('/api/session').set('X-Forwarded-For', STRANGER).set('Content-Type', 'application/json').send('{"email":');
    expect(unreadable.status).toBe(400);
    expect(await attempts(h)).toEqual([]);
    const started = Date.now();
    expect((await from(agent, STRANGER, SIGN_INS.lead, DEMO_PASSWORD)).status).toBe(200);
    expect(Date.now() - started).toBeLessThan(5000);
  });

  it('slows every answer on an account failing from many addresses, yet lets its right password in', async () => {
    h = await startHarness({ trustProxy: true, signInLimit: { windowMs: 15 * 60_000, perAccountAddress: 10, perAddress: 1000, slowAfter: 2, delayMs: 300, maxDelayMs: 600 } });
    const agent = await h.agent();
    for (const last of [1, 2, 3, 4]) expect((await from(agent, `203.0.113.${last}`, SIGN_INS.lead, 'wrong-password')).status).toBe(401);
    // Four failures: past two, 300 ms doubled once, which is also the cap.
    let started = Date.now();
    const slowed = await from(agent, OWNER_DESK, SIGN_INS.lead, DEMO_PASSWORD);
    const slowedMs = Date.now() - started;
    expect(slowed.status).toBe(200);
    expect(slowedMs).toBeGreaterThanOrEqual(600);
    // Another account from the same address answers at once.
    started = Date.now();
    expect((await from(agent, OWNER_DESK, SIGN_INS.tech, DEMO_PASSWORD)).status).toBe(200);
    expect(Date.now() - started).toBeLessThan(600);
  });

  it('shares the counts between two app instances on one database file', async () => {
    h = await startHarness({ trustProxy: true });
    const db = openDatabase(join(h.dataDir, 'busbar.sqlite'));
    const mailer = createMailer(db, `smtp://127.0.0.1:${h.mail.port}`, 'Busbar <no-reply@busbar.test>', () => h.clock.now, true);
    const loaded = loadConfig({ BUSBAR_DATA_DIR: h.dataDir, SESSION_SECRET: 'test-secret-test-secret-test-secret-0123', TRUST_PROXY: 'true', DEMO_DATA: 'false' });
    const config: Config = { ...loaded, scryptLogN: 10, webDist: null, signInLimit: { ...loaded.signInLimit, delayMs: 0, maxDelayMs: 0 } };
    const second = createApp({ db, config, mailer, now: () => h.clock.now });
    try {
      const other = request.agent(second);
      const health = await other.get('/api/health');
      const csrf = decodeURIComponent(/busbar\.csrf=([^;]+)/.exec(String(health.headers['set-cookie']))![1]!);
      other.set('x-csrf-token', csrf);
      const first = await h.agent();
      for (let i = 0; i < 10; i++) {
        const res = await from(i % 2 === 0 ? first : other, STRANGER, SIGN_INS.warranty, 'wrong-password');
        expect(res.status).toBe(401);
      }
      expect((await from(first, STRANGER, SIGN_INS.warranty, DEMO_PASSWORD)).status).toBe(429);
      expect((await from(other, STRANGER, SIGN_INS.warranty, DEMO_PASSWORD)).status).toBe(429);
      expect((await from(other, OWNER_DESK, SIGN_INS.warranty, DEMO_PASSWORD)).status).toBe(200);
    } finally {
      mailer.close();
      await db.destroy();
    }
  });
});
