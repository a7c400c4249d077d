/**
 * `pnpm bench`: speed and memory figures of the work that grows with a network — the demo seed,
 * the build list over two years of history, and plan evaluation. Prints figures; asserts nothing.
 */
import { mkdtempSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { evaluatePlan, type PlanInput } from '@busbar/calc';
import { migrateToLatest, openDatabase } from '@busbar/db';
import { buildQuery } from '@busbar/shared';
import { listBuilds } from '../apps/api/src/queries/builds.ts';
import { ensureDemoData } from '../apps/api/src/demo.ts';

const ms = (start: bigint) => Number(process.hrtime.bigint() - start) / 1e6;
const figure = (name: string, value: number, unit: string) => console.log(`${name.padEnd(56)} ${value.toFixed(1).padStart(9)} ${unit}`);

const dir = mkdtempSync(join(tmpdir(), 'busbar-bench-'));
const db = openDatabase(join(dir, 'busbar.sqlite'));
await migrateToLatest(db);
let start = process.hrtime.bigint();
await ensureDemoData(db, 17, new Date('2026-12-01T12:00:00Z'));
figure('demo seed (staff, scrypt 2^17, two years)', ms(start), 'ms');
const builds = Number((await db.selectFrom('builds').select((eb) => eb.fn.countAll<number>().as('n')).executeTakeFirstOrThrow()).n);
figure('builds in the demo network', builds, '');

const locations = (await db.selectFrom('locations').select('id').execute()).map((l) => l.id);
for (const [label, query] of [
  ['build list, first page, newest first', {}],
  ['build list, text search (customer/serial)', { q: 'ar' }],
  ['build list, delivered, sorted by total', { status: 'delivered', sort: 'totalCents' }],
] as const) {
  const parsed = buildQuery.parse(query);
  const runs = 20;
  start = process.hrtime.bigint();
  for (let i = 0; i < runs; i++) await listBuilds(db, locations, parsed);
  figure(`${label} (mean of ${runs})`, ms(start) / runs, 'ms');
}

const plan: PlanInput = {
  systemV: 12,
  gauge: 'awg',
  loads: [
    { name: 'Fridge', watts: 45, hoursPerDay: 24, dutyCycle: 0.4 },
    { name: 'Satellite internet terminal', watts: 60, hoursPerDay: 10, ac: true },
    { name: 'Lights', watts: 20, hoursPerDay: 5, activeHours: [18, 19, 20, 21, 22] },
  ],
  inverter: { ratedW: 600, efficiency: 0.9 },
  bank: { chemistry: 'lifepo4', capacityAh: 200 },
  starterBattery: { capacityAh: 70 },
  dcdcCharger: { outputA: 40 },
  solar: { arrayW: 200, peakSunHours: 5, controller: 'mppt' },
  trip: { daysParked: 4, daysDriving: 1, driveHoursPerDay: 4 },
  circuits: Array.from({ length: 12 }, (_, i) => ({ from: 'Bus', to: `Load ${i}`, oneWayLengthM: 2 + i, currentA: 5 + i * 3, critical: i % 2 === 0, insulationC: 105 as const })),
};
const runs = 200;
start = process.hrtime.bigint();
for (let i = 0; i < runs; i++) evaluatePlan(plan);
figure(`evaluatePlan, 3 loads, 12 circuits (mean of ${runs})`, ms(start) / runs, 'ms');
figure('resident memory after all of the above', process.memoryUsage().rss / 2 ** 20, 'MiB');

await db.destroy();
rmSync(dir, { recursive: true, force: true });
