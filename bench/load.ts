import { call, type Person } from './client.ts';
import { latency, type Latency } from './stats.ts';

export interface LoadFigures {
  connections: number;
  seconds: number;
  requests: number;
  perSecond: number;
  errors: number;
  writes: number;
  latency: Latency;
}

/**
 * `connections` clients at once for `seconds`, each sending its next request as soon as the last
 * is answered: a lead's and an owner's build list, the lead's build detail, and one request in
 * five a write (a new customer at the lead's shop, with its audit row).
 */
export async function mixedLoad(owner: Person, lead: Person, shop: { locationId: number; buildId: number }, connections: number, seconds: number): Promise<LoadFigures> {
  const deadline = performance.now() + seconds * 1000;
  const times: number[] = [];
  let errors = 0;
  let writes = 0;
  let n = 0;
  const next = () => {
    const turn = n++ % 10;
    if (turn < 3) return call(lead, 'GET', '/api/builds');
    if (turn < 5) return call(owner, 'GET', '/api/builds');
    if (turn < 8) return call(lead, 'GET', `/api/builds/${shop.buildId}`);
    writes++;
    return call(lead, 'POST', '/api/customers', { locationId: shop.locationId, name: `Load Customer ${n}`, email: `load.${n}@example.test` });
  };
  const started = performance.now();
  await Promise.all(
    Array.from({ length: connections }, async () => {
      while (performance.now() < deadline) {
        const answer = await next();
        times.push(answer.ms);
        if (answer.status < 200 || answer.status >= 300) errors++;
      }
    }),
  );
  const elapsed = (performance.now() - started) / 1000;
  return { connections, seconds: elapsed, requests: times.length, perSecond: times.length / elapsed, errors, writes, latency: latency(times) };
}
