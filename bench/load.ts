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

/** Seconds of the same load, untimed, before the timed seconds: the first seconds of 50 connections on a fresh start ran 20–25 % slower than the rest. */
export const LOAD_WARM_UP_SECONDS = 3;

/**
 * Runs of the load at each size. On this shared 2-core machine one run of 10 s on 200 shops gave
 * 477 req/s in a bench run and 560–696 in seven runs within the next quarter of an hour, the code
 * unchanged: the median run stands for the size, and every run's figure is listed beside it.
 */
export const LOAD_RUNS = 3;

/** The median run's figures (by req/s), the errors of every run, and each run's req/s in the order run. */
export type RepeatedLoad = LoadFigures & { perSecondOfRuns: number[] };

/** mixedLoad LOAD_RUNS times, one after another. */
export async function repeatedLoad(...args: Parameters<typeof mixedLoad>): Promise<RepeatedLoad> {
  const runs: LoadFigures[] = [];
  for (let i = 0; i < LOAD_RUNS; i++) runs.push(await mixedLoad(...args));
  const median = [...runs].sort((a, b) => a.perSecond - b.perSecond)[Math.floor(LOAD_RUNS / 2)]!;
  return { ...median, errors: runs.reduce((sum, run) => sum + run.errors, 0), perSecondOfRuns: runs.map((run) => run.perSecond) };
}

/**
 * `connections` clients at once for `seconds` (after LOAD_WARM_UP_SECONDS untimed), each sending
 * its next request as soon as the last is answered: a lead's and an owner's build list, the lead's
 * build detail, and one request in five a write (a new customer at the lead's shop, with its audit row).
 */
export async function mixedLoad(owner: Person, lead: Person, shop: { locationId: number; buildId: number }, connections: number, seconds: number): Promise<LoadFigures> {
  const times: number[] = [];
  let errors = 0;
  let writes = 0;
  // One count across warm-up and timed load: each new customer's e-mail address is its own.
  let n = 0;
  const next = () => {
    const turn = n++ % 10;
    if (turn < 3) return call(lead, 'GET', '/api/builds');
    if (turn < 5) return call(owner, 'GET', '/api/builds');
    if (turn < 8) return call(lead, 'GET', `/api/builds/${shop.buildId}`);
    writes++;
    return call(lead, 'POST', '/api/customers', { locationId: shop.locationId, name: `Load Customer ${n}`, email: `load.${n}@example.test` });
  };
  const run = (forSeconds: number, timed: boolean) => {
    const deadline = performance.now() + forSeconds * 1000;
    return Promise.all(
      Array.from({ length: connections }, async () => {
        while (performance.now() < deadline) {
          const answer = await next();
          if (!timed) continue;
          times.push(answer.ms);
          if (answer.status < 200 || answer.status >= 300) errors++;
        }
      }),
    );
  };
  await run(LOAD_WARM_UP_SECONDS, false);
  writes = 0;
  const started = performance.now();
  await run(seconds, true);
  const elapsed = (performance.now() - started) / 1000;
  return { connections, seconds: elapsed, requests: times.length, perSecond: times.length / elapsed, errors, writes, latency: latency(times) };
}
