import { join } from 'node:path';
import { openDatabase, type Db } from '@busbar/db';
import type { RollupQuery } from '@busbar/shared';
import { sql } from 'kysely';
import { loadViewer } from '../apps/api/src/access/viewer.ts';
import { askedPeriods, moneyScopes, rollupReport } from '../apps/api/src/queries/rollups-report.ts';
import { latency, ms, type Latency } from './stats.ts';

const isoDate = (d: Date) => d.toISOString().slice(0, 10);
/** The twelve months up to today, as the owner's network screen asks them. */
const today = new Date();
export const YEAR_BY_MONTH: RollupQuery = {
  from: isoDate(new Date(Date.UTC(today.getUTCFullYear() - 1, today.getUTCMonth() + 1, 1))),
  to: isoDate(today),
  grain: 'month',
};
/** The thirteen weeks up to today. */
export const QUARTER_BY_WEEK: RollupQuery = { from: isoDate(new Date(today.getTime() - 90 * 86_400_000)), to: isoDate(today), grain: 'week' };
/**
 * Last month, whole. The demo's first months hold a claim or two, so a span there would time an
 * empty page against the network's full one; last month has a full page of claims in both.
 */
export const LAST_MONTH = {
  from: isoDate(new Date(Date.UTC(today.getUTCFullYear(), today.getUTCMonth() - 1, 1))),
  to: isoDate(new Date(Date.UTC(today.getUTCFullYear(), today.getUTCMonth(), 0))),
};
/** The month before last (YYYY-MM): final at every shop of the demo and of a generated network. */
export const MONTH_BEFORE_LAST = isoDate(new Date(Date.UTC(today.getUTCFullYear(), today.getUTCMonth() - 2, 1))).slice(0, 7);
export const rollupPath = (q: RollupQuery) => `/api/rollups?from=${q.from}&to=${q.to}&grain=${q.grain}`;

/**
 * The same figures the summary tables answer, summed from builds, their lines and claims by
 * location and month for the same months (the network's totals from those rows).
 */
async function fromBaseTables(db: Db, query: RollupQuery) {
  const periods = askedPeriods(query);
  const months = [...new Set(periods.flatMap((p) => [p.period, p.previous, p.lastYear]))];
  const sorted = [...months].sort();
  const [first, last] = [`${sorted[0]}-01`, `${sorted.at(-1)}-31`];
  const month = (column: string) => sql<string>`substr(${sql.ref(column)}, 1, 7)`;
  const [delivered, booked, claims, mix] = await Promise.all([
    db.selectFrom('builds').where('status', '=', 'delivered').where('deliveredOn', '>=', first).where('deliveredOn', '<=', last)
      .select(['locationId', month('deliveredOn').as('period'), sql<number>`count(*)`.as('builds'), sql<number>`sum(total_cents)`.as('revenue'), sql<number>`sum(parts_cost_cents)`.as('cost'), sql<number>`sum(labor_hours)`.as('labor')])
      .groupBy(['locationId', 'period']).execute(),
    db.selectFrom('builds').where('status', 'in', ['booked', 'in_bay', 'quality_check', 'delivered']).where('bookedFor', '>=', first).where('bookedFor', '<=', last)
      .select(['locationId', month('bookedFor').as('period'), sql<number>`count(*)`.as('builds')]).groupBy(['locationId', 'period']).execute(),
    db.selectFrom('warrantyClaims as c').innerJoin('builds as b', 'b.id', 'c.buildId').where('c.loggedOn', '>=', first).where('c.loggedOn', '<=', last)
      .select(['c.locationId', month('c.loggedOn').as('period'), sql<number>`count(*)`.as('claims'), sql<number>`sum(c.labor_hours * b.labor_rate_cents)`.as('labor'), sql<number>`sum(coalesce(c.credit_received_cents, 0))`.as('credits')])
      .groupBy(['c.locationId', 'period']).execute(),
    db.selectFrom('builds as b').innerJoin('buildItems as i', 'i.buildId', 'b.id').innerJoin('catalogItems as ci', 'ci.id', 'i.catalogItemId')
      .where('b.status', '=', 'delivered').where('b.deliveredOn', '>=', first).where('b.deliveredOn', '<=', last)
      .select(['b.locationId', month('b.deliveredOn').as('period'), 'ci.category', sql<number>`count(distinct b.id)`.as('builds')])
      .groupBy(['b.locationId', 'period', 'ci.category']).execute(),
  ]);
  const network = new Map<string, number>();
  for (const row of delivered) network.set(row.period, (network.get(row.period) ?? 0) + row.revenue);
  return { delivered, booked, claims, mix, network };
}

/** The base tables take seconds a run at network size: a few runs tell their time. */
const BASE_SAMPLES = 5;

async function timed(samples: number, run: () => Promise<unknown>): Promise<Latency> {
  for (let i = 0; i < Math.min(2, samples); i++) await run();
  const times: number[] = [];
  for (let i = 0; i < samples; i++) {
    const started = performance.now();
    await run();
    times.push(performance.now() - started);
  }
  return latency(times);
}

export interface RollupComparison {
  summary: Latency;
  base: Latency;
}

/** The owner's year by month from the summary tables and from the base tables, one after the other on the same database file. */
export async function compareRollups(dir: string, samples: number): Promise<RollupComparison> {
  const db = openDatabase(join(dir, 'busbar.sqlite'));
  try {
    const owner = await db.selectFrom('users').select('id').where('email', '=', 'owner@demo.busbar.test').executeTakeFirstOrThrow();
    const viewer = (await loadViewer(db, owner.id))!;
    const summary = await timed(samples, () => rollupReport(db, YEAR_BY_MONTH, 'all', moneyScopes(viewer)));
    const base = await timed(Math.min(samples, BASE_SAMPLES), () => fromBaseTables(db, YEAR_BY_MONTH));
    return { summary, base };
  } finally {
    await db.destroy();
  }
}

/** The comparison as Markdown lines. */
export function rollupLines(runs: [label: string, RollupComparison][]): string[] {
  return [
    `The owner's roll-ups, a year by month (${YEAR_BY_MONTH.from} to ${YEAR_BY_MONTH.to}), in the process, from the summary table and summed from builds, lines and claims (at most ${BASE_SAMPLES} runs of the latter):`,
    '',
    '| data | summary table p50 / p95 ms | base tables p50 / p95 ms | p95 ratio |',
    '|---|---|---|---|',
    ...runs.map(([label, { summary, base }]) => `| ${label} | ${ms(summary.p50)} / ${ms(summary.p95)} | ${ms(base.p50)} / ${ms(base.p95)} | ${(summary.p95 / base.p95).toFixed(2)}× |`),
    '',
  ];
}
