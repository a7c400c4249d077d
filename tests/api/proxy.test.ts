import { mkdtempSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { DEMO_PASSWORD } from '@busbar/db';
import request from 'supertest';
import { afterEach, describe, expect, it, vi } from 'vitest';
import { configWarnings, loadConfig } from '../../apps/api/src/config.ts';
import { startHarness, type Harness } from '../support/api-harness.ts';
import { SIGN_INS } from '../support/staff-fixtures.ts';

const PUBLIC = 'https://busbar.example';

const cookiePair = (res: request.Response, name: string) =>
  ([] as string[]).concat(res.headers['set-cookie'] ?? []).find((c) => c.startsWith(`${name}=`))?.split(';')[0];

/** The forgery-protection cookie and token a page of this app holds before sign-in. */
async function pageToken(h: Harness): Promise<{ cookie: string; token: string }> {
  const cookie = cookiePair(await request(h.app).get('/api/health'), 'busbar.csrf')!;
  return { cookie, token: decodeURIComponent(cookie.split('=')[1]!) };
}

describe('behind a TLS proxy', () => {
  let h: Harness;
  afterEach(async () => {
    vi.restoreAllMocks();
    await h.close();
  });

  /** Sends a sign-in as the proxy passes it on: plain http to the app, the browser's Origin, an internal Host. */
  async function signIn(headers: Record<string, string>) {
    const { cookie, token } = await pageToken(h);
    return request(h.app)
      .post('/api/session')
      .set({ Cookie: cookie, 'x-csrf-token': token, Host: 'app-internal:3000', Origin: PUBLIC, ...headers })
      .send({ email: SIGN_INS.owner, password: DEMO_PASSWORD });
  }

  it('accepts a request whose Origin is the public address although the Host header is the internal one', async () => {
    h = await startHarness({ publicUrl: PUBLIC, publicOrigin: PUBLIC, trustProxy: true });
    const res = await signIn({ 'X-Forwarded-Proto': 'https' });
    expect(res.status).toBe(200);
    expect(([] as string[]).concat(res.headers['set-cookie'] ?? []).find((c) => c.startsWith('busbar.sid='))).toMatch(/; Secure/);
  });

  it.each([
    ['the internal address, even matching the Host header', { Origin: 'http://app-internal:3000' }],
    ['the public host over another scheme', { Origin: 'http://busbar.example' }],
    ['the public host on another port', { Origin: 'https://busbar.example:8443' }],
    ['a page of another site (Referer)', { Origin: '', Referer: 'https://busbar.example.evil.test/page' }],
  ])('refuses a request from %s', async (_label, headers) => {
    h = await startHarness({ publicUrl: PUBLIC, publicOrigin: PUBLIC, trustProxy: true });
    const sessions = await h.db.selectFrom('sessions').select('sid').execute();
    const res = await signIn({ 'X-Forwarded-Proto': 'https', ...headers });
    expect(res.status).toBe(403);
    expect(res.body.error.code).toBe('csrf');
    expect(await h.db.selectFrom('sessions').select('sid').execute()).toEqual(sessions);
  });

  it('accepts a Referer on the public address when the browser sends no Origin', async () => {
    h = await startHarness({ publicUrl: PUBLIC, publicOrigin: PUBLIC, trustProxy: true });
    const res = await signIn({ 'X-Forwarded-Proto': 'https', Origin: '', Referer: `${PUBLIC}/sign-in` });
    expect(res.status).toBe(200);
  });

  it('fails a sign-in loudly when its cookie could not be set: https public address, plain http, no trusted proxy', async () => {
    h = await startHarness({ publicUrl: PUBLIC, publicOrigin: PUBLIC, trustProxy: false });
    const logged = vi.spyOn(console, 'error').mockImplementation(() => undefined);
    const sessions = await h.db.selectFrom('sessions').select('sid').execute();
    const res = await signIn({ 'X-Forwarded-Proto': 'https' });
    expect(res.status).toBe(500);
    expect(res.body.error.code).toBe('session_cookie_not_sent');
    expect(res.body.error.message).toMatch(/TRUST_PROXY=true/);
    expect(res.body.error.message).toMatch(/PUBLIC_URL/);
    expect(cookiePair(res, 'busbar.sid')).toBeUndefined();
    expect(await h.db.selectFrom('sessions').select('sid').execute()).toEqual(sessions);
    expect(logged.mock.calls.flat().join(' ')).toMatch(/TRUST_PROXY/);
  });

  it('warns at start-up when the public address is https and no proxy is trusted', () => {
    const dataDir = mkdtempSync(join(tmpdir(), 'busbar-config-'));
    const env = { BUSBAR_DATA_DIR: dataDir, PUBLIC_URL: `${PUBLIC}/` };
    try {
      const config = loadConfig(env);
      expect(config.publicOrigin).toBe(PUBLIC);
      expect(configWarnings(config).join(' ')).toMatch(/TRUST_PROXY/);
      expect(configWarnings(loadConfig({ ...env, TRUST_PROXY: 'true' }))).toEqual([]);
      expect(configWarnings(loadConfig({ BUSBAR_DATA_DIR: dataDir }))).toEqual([]);
      expect(loadConfig({ BUSBAR_DATA_DIR: dataDir }).publicOrigin).toBeNull();
    } finally {
      rmSync(dataDir, { recursive: true, force: true });
    }
  });
});
