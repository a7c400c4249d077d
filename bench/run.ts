/**
 * `pnpm bench [-- --locations 200 --years 5]`: the real app, started as its own process, measured
 * through HTTP at the demo's size and at a generated network's size in the same run: every list
 * and search screen for the owner, a regional manager and a location lead (also on a generated
 * network of the demo's shops over the same years, to tell growth with shops from growth with
 * history), 50 connections mixing reads and writes,
 * the owner's largest screens drawn in Chromium at a desktop's and a phone's width,
 * a lead's build detail while the owner imports and reads, the app's peak memory, and the
 * accountant's workbook of twelve months (rows a second, peak memory, a lead's reads meanwhile). Prints the
 * figures and writes them to bench/RESULTS.md; asserts nothing. What it wrote it takes out again.
 */
import { rmSync } from 'node:fs';
import { loadavg } from 'node:os';
import { DEMO_PASSWORD } from '@busbar/db';
import { drawnTable, measureDrawn } from './browser.ts';
import { call, signIn, type Person } from './client.ts';
import { detailDuringOwnerWork } from './contention.ts';
import { exportLine, exportTable, measureExport } from './exports.ts';
import { mixedLoad } from './load.ts';
import { demoData, networkData, sizeOf } from './network-data.ts';
import { benchOptions, type BenchOptions } from './options.ts';
import { PEOPLE, report, writeReport, type ScreensRun, type SizeRun, type Who } from './results.ts';
import { compareRollups, rollupLines, type RollupComparison } from './rollups.ts';
import { idsFor, measureScreens } from './screens.ts';
import { startApp } from './server.ts';
import { targetLines } from './targets.ts';
import { forgetBenchWrites } from './tidy.ts';

const log = (text: string) => process.stderr.write(`${text}\n`);

/** The people of the demo signed in to `baseUrl`. */
async function peopleOf(baseUrl: string): Promise<Record<Who, Person>> {
  return {
    owner: await signIn(baseUrl, 'owner@demo.busbar.test', DEMO_PASSWORD),
    'regional manager': await signIn(baseUrl, 'regional@demo.busbar.test', DEMO_PASSWORD),
    lead: await signIn(baseUrl, 'lead@demo.busbar.test', DEMO_PASSWORD),
  };
}

/** Every screen for every person (a list shorter than the demo's page timed once more with pages of the demo's rows). */
async function screensOf(people: Record<Who, Person>, label: string, options: BenchOptions, demo?: SizeRun): Promise<SizeRun['screens']> {
  const screens = {} as SizeRun['screens'];
  for (const who of PEOPLE) screens[who] = await measureScreens(people[who], options.samples, (s) => log(`${label}: ${who}, ${s}`), demo?.screens[who]);
  return screens;
}

/** Only the screens, on a network of the demo's shops over the network's years. */
async function measureScreensOnly(dir: string, label: string, generatedSeconds: number | null, options: BenchOptions): Promise<ScreensRun> {
  log(`\n${label}: starting the app`);
  const app = await startApp(dir);
  try {
    return { size: await sizeOf(dir, label, generatedSeconds), screens: await screensOf(await peopleOf(app.baseUrl), label, options) };
  } finally {
    await app.stop();
  }
}

async function measure(dir: string, label: string, generatedSeconds: number | null, options: BenchOptions, demo?: SizeRun): Promise<SizeRun & { rollups: RollupComparison }> {
  log(`\n${label}: starting the app`);
  const app = await startApp(dir);
  try {
    const size = await sizeOf(dir, label, generatedSeconds);
    const people = await peopleOf(app.baseUrl);
    const { owner, lead } = people;
    const session = JSON.parse((await call(lead, 'GET', '/api/session')).body) as { assignments: { locationId: number }[] };
    const shop = { locationId: session.assignments[0]!.locationId, buildId: (await idsFor(lead)).buildId };
    const screens = await screensOf(people, label, options, demo);
    const drawn = await measureDrawn(app.baseUrl, (screen) => log(`${label}: drawn in Chromium, ${screen}`));
    log(`${label}: 50 connections for ${options.seconds} s`);
    const load = await mixedLoad(owner, lead, shop, 50, options.seconds);
    log(`${label}: a lead's build detail while the owner imports 2,000 builds`);
    const contention = await detailDuringOwnerWork(owner, lead, shop, 2000);
    log(`${label}: roll-ups from the summary tables and from the base tables`);
    const rollups = await compareRollups(dir, options.samples);
    return { size, screens, load, contention, memory: app.peakMemory(), drawn, rollups };
  } finally {
    await app.stop();
    const removed = await forgetBenchWrites(dir);
    log(`${label}: took the run's ${removed.builds} imported builds and ${removed.customers} customers out again`);
  }
}

const options = benchOptions();
const loadAtStart = loadavg()[0]!;
log('demo: seeding the demo network');
const demoDir = await demoData();
try {
  const demo = await measure(demoDir, 'demo', null, options);
  log('demo: the accountant exports twelve months');
  const demoExport = await measureExport(demoDir);
  const shorter = await networkData(demo.size.locations, options.years, options.reuse);
  const sameYears = await measureScreensOnly(shorter.dir, `the demo's ${demo.size.locations} shops over ${options.years} years`, shorter.generatedSeconds, options);
  const network = await networkData(options.locations, options.years, options.reuse);
  const label = `network ${options.locations} × ${options.years} years${network.reused ? ' (generated by an earlier run)' : ''}`;
  const generated = await measure(network.dir, label, network.generatedSeconds, options, demo);
  log(`${label}: the accountant exports twelve months`);
  const networkExport = await measureExport(network.dir);
  const exports = exportTable([exportLine('demo', demoExport), exportLine(label, networkExport)]);
  const summary = targetLines(demo, sameYears, generated, networkExport);
  const text = [report(demo, sameYears, generated, options.samples, loadAtStart, summary), '', ...drawnTable(demo.drawn, generated.drawn), '', ...rollupLines([['demo', demo.rollups], [label, generated.rollups]]), '', ...exports].join('\n');
  console.log(text);
  writeReport(options.results, text);
  log(`Wrote ${options.results}.`);
} finally {
  rmSync(demoDir, { recursive: true, force: true });
}
