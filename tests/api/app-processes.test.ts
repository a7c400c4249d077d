import { existsSync, readFileSync } from 'node:fs';
import { Agent } from 'node:http';
import { DEMO_PASSWORD } from '@busbar/db';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { call, signIn, type Person } from '../../bench/client.ts';
import { startApp, type RunningApp } from '../../bench/server.ts';
import { SEMI_SPACE_MB } from '../../apps/api/src/start/workers.ts';
import { demoIds, startHarness, type Harness } from '../support/api-harness.ts';
import { SIGN_INS } from '../support/staff-fixtures.ts';

/**
 * The real app started as `pnpm start` starts it (built to JavaScript), with two processes sharing the port. Every
 * request goes on a new connection, so requests are dealt out to both processes in turn.
 */
let h: Harness;
let app: RunningApp;
const fresh = new Agent({ keepAlive: false });
const person = (email: string) => signIn(app.baseUrl, email, DEMO_PASSWORD, fresh);
/** Whether a process was started with the young generation the app sets for its processes. */
const youngGenerationSet = (pid: number) => readFileSync(`/proc/${pid}/cmdline`, 'utf8').split('\0').includes(`--max-semi-space-size=${SEMI_SPACE_MB}`);
const roles = async (who: Person) => (JSON.parse((await call(who, 'GET', '/api/session')).body) as { assignments: { id: number; locationCode: string }[] }).assignments;

beforeAll(async () => {
  h = await startHarness();
  app = await startApp(h.dataDir, { BUSBAR_PROCESSES: '2', DEMO_DATA: 'false' });
}, 60_000);
afterAll(async () => {
  await app?.stop();
  await h.close();
});

describe('the app on two processes', () => {
  it('takes a role away on every process at the requests that follow its removal', async () => {
    expect(app.processes()).toHaveLength(2);
    const lead = await person(SIGN_INS.lead2);
    for (let i = 0; i < 4; i++) expect((await roles(lead)).map((a) => a.locationCode)).toEqual(['AVL']);
    const [role] = await roles(lead);
    const owner = await person(SIGN_INS.owner);
    const ids = await demoIds(h.db);
    expect((await call(owner, 'DELETE', `/api/staff/${ids.user(SIGN_INS.lead2)}/roles/${role!.id}`)).status).toBe(200);
    for (let i = 0; i < 6; i++) expect(await roles(lead)).toEqual([]);
  });

  it('locks one address out of an account after ten failed sign-ins from it, whichever processes they reach', async () => {
    const stranger = { baseUrl: app.baseUrl, agent: fresh, cookie: '', csrf: '' };
    await call(stranger, 'GET', '/api/health');
    stranger.csrf = decodeURIComponent(/busbar\.csrf=([^;]+)/.exec(stranger.cookie)![1]!);
    const attempt = (password: string) => call(stranger, 'POST', '/api/session', { email: SIGN_INS.warranty, password });
    for (let i = 0; i < 10; i++) expect((await attempt('not-the-password')).status).toBe(401);
    // The right password now, on each process in turn.
    for (let i = 0; i < 2; i++) expect((await attempt(DEMO_PASSWORD)).status).toBe(429);
  });

  it('sends mail through the local capture the first process runs, and lists it in the Outbox', async () => {
    const owner = await person(SIGN_INS.owner);
    const ids = await demoIds(h.db);
    const invited = await call(owner, 'POST', '/api/staff/invites', { email: 'nell.brightwater@example.test', name: 'Nell Brightwater', role: 'technician', locationId: ids.location('DEN') });
    expect(invited.status).toBe(201);
    const outbox = JSON.parse((await call(owner, 'GET', '/api/outbox')).body) as { items: { to: string; status: string }[] };
    expect(outbox.items.find((m) => m.to === 'nell.brightwater@example.test')?.status).toBe('sent');
  });

  it('runs long reads on the background thread of each process, built as the app is', async () => {
    const owner = await person(SIGN_INS.owner);
    for (let i = 0; i < 2; i++) {
      const answer = await call(owner, 'GET', '/api/rollups?from=2026-01-01&to=2026-03-31&grain=month');
      expect(answer.status).toBe(200);
      expect((JSON.parse(answer.body) as { periods: { period: string }[] }).periods.map((p) => p.period)).toEqual(['2026-01', '2026-02', '2026-03']);
      expect((await call(owner, 'GET', '/api/reliability?groupBy=vendor')).status).toBe(200);
    }
  });

  it('keeps answering on the other process when one stops, and starts another in its place', async () => {
    const tech = await person(SIGN_INS.tech);
    const [first, second] = app.processes();
    process.kill(first!, 'SIGKILL');
    const pause = (ms: number) => new Promise((r) => setTimeout(r, ms));
    const until = async (done: () => boolean | Promise<boolean>) => {
      for (let tries = 0; tries < 200 && !(await done()); tries++) await pause(50);
    };
    // Gone from the process table once the first process has reaped it, and so seen it stop.
    await until(() => !existsSync(`/proc/${first}`));
    for (let i = 0; i < 6; i++) expect((await call(tech, 'GET', '/api/session')).status).toBe(200);
    // Two reads a little apart: a process seen only while it is being started does not count.
    const pair = () => app.processes().length === 2 && !app.processes().includes(first!);
    await until(async () => {
      if (!pair()) return false;
      await pause(250);
      return pair();
    });
    expect(app.processes()).toContain(second);
    expect(app.processes()).not.toContain(first);
    expect(app.processes()).toHaveLength(2);
    expect(app.processes().every(youngGenerationSet)).toBe(true);
  });
});

describe('the app on one process', () => {
  it('answers from a process of its own, started with the same young generation as several', async () => {
    const single = await startApp(h.dataDir, { BUSBAR_PROCESSES: '1', DEMO_DATA: 'false' });
    try {
      // The first process started it, so the one answering is another, with the app's heap settings.
      expect(single.processes()).toHaveLength(1);
      expect(youngGenerationSet(single.processes()[0]!)).toBe(true);
      const owner = await signIn(single.baseUrl, SIGN_INS.owner, DEMO_PASSWORD);
      expect((await call(owner, 'GET', '/api/builds?pageSize=1')).status).toBe(200);
    } finally {
      await single.stop();
    }
  }, 60_000);
});
