import { mkdtempSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { DEMO_PASSWORD } from '@busbar/db';
import { afterEach, describe, expect, it } from 'vitest';
import { loadConfig } from '../../apps/api/src/config.ts';
import { signInDelayMs } from '../../apps/api/src/middleware/rate-limit.ts';
import { startHarness, type Agent, type Harness } from '../support/api-harness.ts';
import { SIGN_INS } from '../support/staff-fixtures.ts';

const LOCKED = { error: { code: 'too_many_attempts', message: 'Too many failed sign-ins from here. Try again in 15 minutes.' } };
const WINDOW_MS = 15 * 60 * 1000;
const limits = (perAccountAddress: number, perAddress: number) => ({ windowMs: WINDOW_MS, perAccountAddress, perAddress, slowAfter: 5, delayMs: 0, maxDelayMs: 0 });

const signIn = (agent: Agent, email: string, password: string) => agent.post('/api/session').send({ email, password });

it('defaults to 10 failures per account and address and 100 per address in 15 minutes, waiting up to 4 s after 5 on an account', () => {
  const dataDir = mkdtempSync(join(tmpdir(), 'busbar-config-'));
  const config = loadConfig({ BUSBAR_DATA_DIR: dataDir, SESSION_SECRET: 's'.repeat(32) });
  rmSync(dataDir, { recursive: true, force: true });
  expect(config.signInLimit).toEqual({ windowMs: WINDOW_MS, perAccountAddress: 10, perAddress: 100, slowAfter: 5, delayMs: 250, maxDelayMs: 4000 });
  const waits = Array.from({ length: 12 }, (_, failures) => signInDelayMs(failures, config.signInLimit));
  expect(waits).toEqual([0, 0, 0, 0, 0, 0, 250, 500, 1000, 2000, 4000, 4000]);
});

describe('sign-in rate limits', () => {
  let h: Harness;
  afterEach(() => h.close());

  it('locks an address out of an account after its limit of failures, even for the right password, and leaves other accounts alone', async () => {
    h = await startHarness({ signInLimit: limits(3, 1000) });
    const agent = await h.agent();
    for (const email of [SIGN_INS.lead, 'LEAD@demo.busbar.test', ` ${SIGN_INS.lead}`]) {
      expect((await signIn(agent, email, 'wrong-password')).status).toBe(401);
    }
    const locked = await signIn(agent, SIGN_INS.lead, 'wrong-password');
    expect(locked.status).toBe(429);
    expect(locked.body).toEqual(LOCKED);
    expect(locked.headers['retry-after']).toBe('900');

    const right = await signIn(await h.agent(), SIGN_INS.lead, DEMO_PASSWORD);
    expect(right.status).toBe(429);
    expect(right.body).toEqual(LOCKED);
    expect(await h.db.selectFrom('sessions').selectAll().execute()).toEqual([]);

    expect((await signIn(agent, SIGN_INS.tech, DEMO_PASSWORD)).status).toBe(200);
  });

  it('locks an address after its limit of failures across accounts', async () => {
    h = await startHarness({ signInLimit: limits(1000, 3) });
    const agent = await h.agent();
    for (const email of [SIGN_INS.tech, SIGN_INS.warranty, 'nobody@demo.busbar.test']) {
      expect((await signIn(agent, email, 'wrong-password')).status).toBe(401);
    }
    const locked = await signIn(await h.agent(), SIGN_INS.owner, DEMO_PASSWORD);
    expect(locked.status).toBe(429);
    expect(locked.body).toEqual(LOCKED);
  });

  it('does not let a forwarded-for header pose as another address', async () => {
    h = await startHarness({ signInLimit: limits(1000, 2) });
    const agent = await h.agent();
    for (const address of ['203.0.113.1', '203.0.113.2']) {
      expect((await signIn(agent, SIGN_INS.tech, 'wrong-password').set('X-Forwarded-For', address)).status).toBe(401);
    }
    const res = await signIn(agent, SIGN_INS.owner, DEMO_PASSWORD).set('X-Forwarded-For', '203.0.113.3');
    expect(res.status).toBe(429);
  });

  it("counts only failures, and a success forgives its own address's failures on that account", async () => {
    h = await startHarness({ signInLimit: limits(2, 1000) });
    const agent = await h.agent();
    for (let i = 0; i < 5; i++) expect((await signIn(agent, SIGN_INS.lead, DEMO_PASSWORD)).status).toBe(200);
    expect((await signIn(agent, SIGN_INS.lead, 'wrong-password')).status).toBe(401);
    expect((await signIn(agent, SIGN_INS.lead, DEMO_PASSWORD)).status).toBe(200);
    expect((await signIn(agent, SIGN_INS.lead, 'wrong-password')).status).toBe(401);
    expect((await signIn(agent, SIGN_INS.lead, 'wrong-password')).status).toBe(401);
    const locked = await signIn(agent, SIGN_INS.lead, DEMO_PASSWORD);
    expect(locked.status).toBe(429);
    expect(locked.body).toEqual(LOCKED);
  });
});
