import { cpSync, mkdirSync, mkdtempSync, readFileSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { brotliDecompressSync, gunzipSync } from 'node:zlib';
import { get, type IncomingHttpHeaders, type Server } from 'node:http';
import type { AddressInfo } from 'node:net';
import { DEMO_PASSWORD } from '@busbar/db';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { utf8Of } from '../../apps/api/src/utf8.ts';
import { encodedJson, INLINE_MAX_BYTES } from '../../apps/api/src/web/compress.ts';
import { precompressDir } from '../../scripts/precompress.ts';
import { startHarness, type Harness } from '../support/api-harness.ts';
import { SIGN_INS } from '../support/staff-fixtures.ts';

const dist = mkdtempSync(join(tmpdir(), 'busbar-dist-'));
const SCRIPT = `export const rows = [${Array.from({ length: 400 }, (_, i) => `{ id: ${i}, label: 'row ${i}' }`).join(', ')}];\n`;
const PAGE = `<!doctype html><html><head><title>Busbar</title><script type="module" src="/assets/index-Bq3x9Z1a.js"></script></head><body><div id="app"></div>${'<!-- padding -->'.repeat(80)}</body></html>`;
let h: Harness;
let server: Server;

beforeAll(async () => {
  // A built app as Vite and its precompress plugin leave it: hashed files under assets/, .br and .gz beside them.
  mkdirSync(join(dist, 'assets'));
  writeFileSync(join(dist, 'index.html'), PAGE);
  writeFileSync(join(dist, 'assets', 'index-Bq3x9Z1a.js'), SCRIPT);
  writeFileSync(join(dist, 'assets', 'small-C4d5E6f7.css'), 'body{margin:0}');
  cpSync('apps/web/public', dist, { recursive: true });
  precompressDir(dist);
  // With the demo's history, for an answer larger than what is compressed on the request's thread.
  h = await startHarness({ webDist: dist }, true, { history: true });
  server = h.app.listen(0, '127.0.0.1');
  await new Promise((resolve) => server.once('listening', resolve));
});
afterAll(async () => {
  await new Promise((resolve) => server.close(resolve));
  await h.close();
  rmSync(dist, { recursive: true, force: true });
});

/** Fetches raw bytes over a real connection, undecoded, so the test sees what went over the wire. */
function raw(path: string, acceptEncoding = 'identity', cookie = ''): Promise<{ status: number; headers: IncomingHttpHeaders; body: Buffer }> {
  return new Promise((resolve, reject) => {
    const { port } = server.address() as AddressInfo;
    get({ host: '127.0.0.1', port, path, headers: { 'Accept-Encoding': acceptEncoding, Cookie: cookie } }, (res) => {
      const chunks: Buffer[] = [];
      res.on('data', (c: Buffer) => chunks.push(c));
      res.on('end', () => resolve({ status: res.statusCode!, headers: res.headers, body: Buffer.concat(chunks) }));
    }).on('error', reject);
  });
}

describe('the built web app', () => {
  it('sends hashed assets brotli- or gzip-compressed as asked, cached for a year as immutable', async () => {
    const br = await raw('/assets/index-Bq3x9Z1a.js', 'gzip, deflate, br');
    expect(br.status).toBe(200);
    expect(br.headers['content-encoding']).toBe('br');
    expect(br.headers['content-type']).toMatch(/javascript/);
    expect(br.headers['cache-control']).toBe('public, max-age=31536000, immutable');
    expect(br.headers['vary']).toMatch(/Accept-Encoding/i);
    expect(brotliDecompressSync(br.body).toString()).toBe(SCRIPT);
    expect(br.body.length).toBeLessThan(SCRIPT.length / 3);

    const gz = await raw('/assets/index-Bq3x9Z1a.js', 'gzip');
    expect(gz.headers['content-encoding']).toBe('gzip');
    expect(gunzipSync(gz.body).toString()).toBe(SCRIPT);

    const plain = await raw('/assets/index-Bq3x9Z1a.js');
    expect(plain.headers['content-encoding']).toBeUndefined();
    expect(plain.body.toString()).toBe(SCRIPT);
    expect(plain.headers['cache-control']).toBe('public, max-age=31536000, immutable');
  });

  it('sends a tiny asset as it is, and answers 404 (not the page) for an asset that does not exist', async () => {
    const small = await raw('/assets/small-C4d5E6f7.css', 'br');
    expect(small.headers['content-encoding']).toBeUndefined();
    expect(small.headers['content-type']).toMatch(/text\/css/);
    expect(small.body.toString()).toBe('body{margin:0}');
    expect((await raw('/assets/index-OLDHASH1.js', 'br')).status).toBe(404);
    expect((await raw('/assets/..%2Findex.html', 'br')).status).toBe(404);
  });

  it('sends index.html for every screen with no-cache, compressed when asked', async () => {
    for (const path of ['/', '/builds/42', '/index.html']) {
      const page = await raw(path, 'br');
      expect(page.status).toBe(200);
      expect(page.headers['cache-control']).toBe('no-cache');
      expect(page.headers['content-type']).toMatch(/text\/html/);
      const body = page.headers['content-encoding'] === 'br' ? brotliDecompressSync(page.body).toString() : page.body.toString();
      expect(body).toBe(PAGE);
    }
    expect((await raw('/builds/42', 'br')).headers['content-encoding']).toBe('br');
    expect((await raw('/builds/42', 'gzip;q=1, br;q=0')).headers['content-encoding']).toBe('gzip');
  });
});

describe('the icon', () => {
  it('is linked from the page as an ICO and an SVG, both shipped with the app', () => {
    const page = readFileSync('index.html', 'utf8');
    expect(page).toContain('<link rel="icon" href="/favicon.ico" sizes="32x32" />');
    expect(page).toContain('<link rel="icon" type="image/svg+xml" href="/favicon.svg" />');
  });

  it('answers /favicon.ico with an icon of PNG images, and a build without one with 404, never the page', async () => {
    const icon = await raw('/favicon.ico');
    expect(icon.status).toBe(200);
    expect(icon.headers['content-type']).toMatch(/^image\/(x-icon|vnd\.microsoft\.icon)/);
    expect(icon.body.equals(readFileSync('apps/web/public/favicon.ico'))).toBe(true);
    // ICO header: reserved 0, type 1 (icon), then one 16-byte entry per image, each pointing at a PNG.
    expect([icon.body.readUInt16LE(0), icon.body.readUInt16LE(2)]).toEqual([0, 1]);
    const count = icon.body.readUInt16LE(4);
    expect(count).toBeGreaterThan(0);
    for (let i = 0; i < count; i++) {
      const at = icon.body.readUInt32LE(6 + 16 * i + 12);
      expect(icon.body.subarray(at + 1, at + 4).toString()).toBe('PNG');
    }
    const svg = await raw('/favicon.svg');
    expect(svg.status).toBe(200);
    expect(svg.headers['content-type']).toMatch(/^image\/svg\+xml/);

    rmSync(join(dist, 'favicon.ico'));
    const missing = await raw('/favicon.ico');
    expect(missing.status).toBe(404);
    expect(missing.body.toString()).not.toContain('<html');
  });
});

async function ownerCookie(): Promise<string> {
  const signIn = await (await h.agent()).post('/api/session').send({ email: SIGN_INS.owner, password: DEMO_PASSWORD });
  expect(signIn.status).toBe(200);
  return ([] as string[]).concat(signIn.headers['set-cookie'] ?? []).map((c) => c.split(';')[0]).join('; ');
}

const DECODERS = [['br', brotliDecompressSync], ['gzip', gunzipSync]] as const;

describe('API answers', () => {
  it('compresses a JSON answer with the encoding asked for, a page of 200 builds too, and leaves a small one alone', async () => {
    const cookie = await ownerCookie();
    const staff = await raw('/api/staff', 'br', cookie);
    expect(staff.status).toBe(200);
    expect(staff.headers['content-encoding']).toBe('br');
    expect(staff.headers['content-type']).toMatch(/application\/json/);
    // People's records are kept by no cache, nor is a refusal.
    expect(staff.headers['cache-control']).toBe('no-store');
    expect((await raw('/api/staff')).headers['cache-control']).toBe('no-store');
    const people = JSON.parse(brotliDecompressSync(staff.body).toString());
    // Compressed on the request's thread.
    expect(brotliDecompressSync(staff.body).length).toBeLessThanOrEqual(INLINE_MAX_BYTES);
    expect(people.items.length).toBeGreaterThan(10);

    const gz = await raw('/api/staff', 'gzip', cookie);
    expect(JSON.parse(gunzipSync(gz.body).toString())).toEqual(people);

    // A page of 200 builds is larger than what is compressed on the request's thread: zlib's pool does it, as well.
    const plain = await raw('/api/builds?pageSize=200', 'identity', cookie);
    expect(plain.body.length).toBeGreaterThan(INLINE_MAX_BYTES);
    for (const [encoding, decode] of DECODERS) {
      const large = await raw('/api/builds?pageSize=200', encoding, cookie);
      expect(large.headers['content-encoding']).toBe(encoding);
      expect(large.body.length).toBeLessThan(plain.body.length / 4);
      expect(decode(large.body).toString()).toBe(plain.body.toString());
    }

    const small = await raw('/api/health', 'br');
    expect(small.headers['content-encoding']).toBeUndefined();
    expect(JSON.parse(small.body.toString())).toBeTruthy();
  });

  it("sends the background thread's answers (roll-ups, reliability) with the encoding asked for, or none", async () => {
    const cookie = await ownerCookie();
    for (const path of ['/api/rollups?from=2025-01-01&to=2025-12-31&grain=month', '/api/reliability/category/house_battery', '/api/reliability']) {
      const plain = await raw(path, 'identity', cookie);
      expect(plain.status).toBe(200);
      expect(plain.headers['content-encoding']).toBeUndefined();
      expect(JSON.parse(plain.body.toString())).toBeTruthy();
      for (const [encoding, decode] of DECODERS) {
        const packed = await raw(path, encoding, cookie);
        expect(packed.headers['content-encoding']).toBe(encoding);
        expect(packed.headers['content-type']).toMatch(/application\/json/);
        expect(packed.headers['vary']).toMatch(/Accept-Encoding/i);
        expect(packed.body.length).toBeLessThan(plain.body.length / 2);
        expect(decode(packed.body).toString()).toBe(plain.body.toString());
      }
    }
  });

  it('leaves bytes too small to gain, or for a client that accepts no encoding, as they are, in memory a thread can hand over', () => {
    const json = utf8Of([JSON.stringify({ rows: Array.from({ length: 200 }, (_, i) => ({ id: i, name: `Shop ${i}` })) })]);
    const small = utf8Of(['{"rows":[]}']);
    expect(encodedJson(small, 'br')).toEqual({ body: small, encoding: null });
    expect(encodedJson(json, null)).toEqual({ body: json, encoding: null });
    const packed = encodedJson(json, 'gzip');
    expect(packed.encoding).toBe('gzip');
    expect(gunzipSync(packed.body).toString()).toBe(Buffer.from(json).toString());
    // Its own memory: a slice of Node's shared pool cannot be handed to another thread.
    expect(packed.body.byteOffset).toBe(0);
    expect(packed.body.buffer.byteLength).toBe(packed.body.byteLength);
  });
});
