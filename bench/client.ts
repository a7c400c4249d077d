import { Agent, request } from 'node:http';
import { brotliDecompressSync, gunzipSync } from 'node:zlib';

/** One keep-alive connection pool for the whole benchmark, as a browser keeps its connections open. */
export const agent = new Agent({ keepAlive: true, maxSockets: 64 });

export interface Answer {
  status: number;
  ms: number;
  /** The body, decompressed when first read (the load test never reads it, so its client stays light). */
  readonly body: string;
}

export interface Person {
  baseUrl: string;
  cookie: string;
  csrf: string;
  /** Connections to use instead of the shared keep-alive pool (one per request, to reach every app process). */
  agent?: Agent;
}

/** One request; resolves with the status, the time to the last byte and the body. Network errors answer status 0. */
export function call(person: Pick<Person, 'baseUrl'> & Partial<Person>, method: string, path: string, body?: unknown): Promise<Answer> {
  const started = performance.now();
  const payload = body === undefined ? undefined : JSON.stringify(body);
  // As a browser asks; the time is taken at the last byte, before the body is decompressed.
  const headers: Record<string, string> = { Accept: 'application/json', 'Accept-Encoding': 'br, gzip' };
  if (person.cookie) headers['Cookie'] = person.cookie;
  if (method !== 'GET') Object.assign(headers, { 'X-CSRF-Token': person.csrf ?? '', 'Content-Type': 'application/json' });
  return new Promise((resolve) => {
    const req = request(`${person.baseUrl}${path}`, { method, agent: person.agent ?? agent, headers }, (res) => {
      const chunks: Buffer[] = [];
      res.on('data', (c: Buffer) => chunks.push(c));
      res.on('end', () => {
        const cookies = res.headers['set-cookie'];
        if (cookies && person.cookie !== undefined) person.cookie = mergeCookies(person.cookie, cookies);
        // The forgery-protection token changes with the session (sign-in, sign-out): echo the newest.
        const token = /busbar\.csrf=([^;]+)/.exec(person.cookie ?? '')?.[1];
        if (token) person.csrf = decodeURIComponent(token);
        const ms = performance.now() - started;
        const raw = Buffer.concat(chunks);
        const encoding = res.headers['content-encoding'];
        const decode = () => (encoding === 'br' ? brotliDecompressSync(raw) : encoding === 'gzip' ? gunzipSync(raw) : raw).toString();
        resolve({ status: res.statusCode ?? 0, ms, get body() {
          return decode();
        } });
      });
    });
    req.on('error', (error) => resolve({ status: 0, ms: performance.now() - started, body: String(error) }));
    req.end(payload);
  });
}

function mergeCookies(current: string, set: string[]): string {
  const jar = new Map(current.split('; ').filter(Boolean).map((c) => [c.split('=')[0]!, c] as const));
  for (const line of set) {
    const pair = line.split(';')[0]!;
    jar.set(pair.split('=')[0]!, pair);
  }
  return [...jar.values()].join('; ');
}

/** Signs a demo person in and answers their session cookie and forgery-protection token. */
export async function signIn(baseUrl: string, email: string, password: string, connections?: Agent): Promise<Person> {
  const person: Person = { baseUrl, cookie: '', csrf: '', agent: connections };
  await call(person, 'GET', '/api/health');
  if (!person.csrf) throw new Error('no forgery-protection cookie from /api/health');
  const answer = await call(person, 'POST', '/api/session', { email, password });
  if (answer.status !== 200) throw new Error(`sign-in of ${email} answered ${answer.status}: ${answer.body}`);
  return person;
}
