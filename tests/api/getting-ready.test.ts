import { spawnSync } from 'node:child_process';
import { mkdtempSync, rmSync } from 'node:fs';
import { createServer } from 'node:net';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { freePort, startApp } from '../../bench/server.ts';
import { answerWhilePreparing } from '../../apps/api/src/start/ready.ts';

/**
 * What answers on the app's port while the first process prepares (migrations can hold it for
 * minutes on a network's database): asked from another process while this one is held busy, as a
 * migration holds it.
 */
let preparing: Awaited<ReturnType<typeof answerWhilePreparing>>;
let port: number;

beforeAll(async () => {
  preparing = await answerWhilePreparing(0);
  port = preparing.port!;
});
afterAll(() => preparing.done());

/** Asks `path` from another process while this thread is blocked until the answer comes. */
function askWhileBusy(path: string, accept: string): { status: number; retryAfter: string | null; type: string | null; body: string } {
  const script = `fetch('http://127.0.0.1:${port}${path}', { headers: { accept: '${accept}' } }).then(async (r) =>
    console.log(JSON.stringify({ status: r.status, retryAfter: r.headers.get('retry-after'), type: r.headers.get('content-type'), body: await r.text() })))`;
  const asked = spawnSync(process.execPath, ['-e', script], { encoding: 'utf8', timeout: 20_000 });
  return JSON.parse(asked.stdout);
}

describe('while Busbar gets ready', () => {
  it('shows a person opening it what is being done, and looks again by itself', () => {
    preparing.tell('Bringing the database up to date: <step> 2 of 3');
    const page = askWhileBusy('/builds/12', 'text/html,application/xhtml+xml');
    expect(page.status).toBe(503);
    expect(page.retryAfter).toBe('5');
    expect(page.type).toMatch(/^text\/html/);
    expect(page.body).toContain('<title>Busbar is getting ready</title>');
    expect(page.body).toContain('Bringing the database up to date: &#60;step&#62; 2 of 3');
    expect(page.body).toContain('<meta http-equiv="refresh" content="5">');
    expect(page.body).toContain('name="viewport"');
  });

  it("answers the API in the app's error shape, saying why", () => {
    preparing.tell('Filling the empty database with the demo network');
    const answer = askWhileBusy('/api/builds', 'text/html');
    expect(answer.status).toBe(503);
    expect(answer.retryAfter).toBe('5');
    expect(JSON.parse(answer.body)).toEqual({
      error: { code: 'starting', message: 'Busbar is getting ready (filling the empty database with the demo network). Try again in a minute.' },
    });
  });

  it('frees the port for the app when done, and a taken port does not stop the start', async () => {
    const other = await answerWhilePreparing(port);
    expect(other.port).toBeNull();
    await other.done();
    await preparing.done();
    const server = createServer();
    await new Promise<void>((resolve, reject) => server.once('error', reject).listen(port, () => resolve()));
    await new Promise((resolve) => server.close(resolve));
  });
});

describe('the app as `pnpm start` starts it, on an empty database', () => {
  it('answers the getting-ready page from the start until its processes answer', async () => {
    const dir = mkdtempSync(join(tmpdir(), 'busbar-ready-'));
    const port = await freePort();
    let up = false;
    const starting = startApp(dir, {}, port).finally(() => (up = true));
    const told = new Set<string>();
    while (!up) {
      const answer = await fetch(`http://127.0.0.1:${port}/`, { headers: { accept: 'text/html' } }).catch(() => null);
      if (answer?.status === 503) told.add(/role="status">([^<]*)</.exec(await answer.text())![1]!);
      await new Promise((resolve) => setTimeout(resolve, 20));
    }
    const app = await starting;
    try {
      expect([...told].some((words) => /^Bringing the database up to date: step \d+ of \d+$/.test(words))).toBe(true);
      expect(told).toContain('Filling the empty database with the demo network');
      expect((await fetch(`${app.baseUrl}/api/health`)).status).toBe(200);
    } finally {
      await app.stop();
      rmSync(dir, { recursive: true, force: true });
    }
  }, 120_000);
});
