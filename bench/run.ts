/**
 * `pnpm bench [-- --locations 200 --years 5]`: the real app, started as its own process, measured
 * through HTTP at the demo's size and at a generated network's size in the same run: every list
 * and search screen for the owner, a regional manager and a location lead (also on a generated
 * network of the demo's shops over the same years, to tell growth with shops from growth with
 * history; the three sizes' apps run side by side and answer each screen's requests in turns),
 * 50 connections mixing reads and writes,
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
import { LOAD_RUNS, repeatedLoad } from './load.ts';
import { demoData, networkData, sizeOf, type DataSize } from './network-data.ts';
import { benchOptions, type BenchOptions } from './options.ts';
import { PEOPLE, report, writeReport, type SizeRun, type Who } from './results.ts';
import { compareRollups, rollupLines, type RollupComparison } from './rollups.ts';
import { idsFor, measureScreens } from './screens.ts';
import { startApp, type RunningApp } from './server.ts';
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

/** A size of data with its app started and the people signed in to it. */
interface Started {
  dir: string;
  app: RunningApp;
  size: DataSize;
  people: Record<Who, Person>;
}

async function startSize(dir: string, label: string, generatedSeconds: number | null): Promise<Started> {
  log(`\n${label}: starting the app`);
  const app = await startApp(dir);
  try {
    return { dir, app, size: await sizeOf(dir, label, generatedSeconds), people: await peopleOf(app.baseUrl) };
  } catch (error) {
    await app.stop();
    throw error;
  }
}

/** Every screen for every person at every size, the sizes taking turns (see measureScreens). */
async function screensOf(sizes: readonly Started[], options: BenchOptions): Promise<SizeRun['screens'][]> {
  const screens = sizes.map(() => ({}) as SizeRun['screens']);
  for (const who of PEOPLE) {
    const figures = await measureScreens(sizes.map((size) => size.people[who]), options.samples, (screen) => log(`screens: ${who}, ${screen}`));
    figures.forEach((figure, i) => (screens[i]![who] = figure));
  }
  return screens;
}

/** The rest at one size, its screens measured already; then stops its app and takes out what the run wrote. */
async function measureRest({ dir, app, size, people }: Started, screens: SizeRun['screens'], options: BenchOptions): Promise<SizeRun & { rollups: RollupComparison }> {
  const { label } = size;
  try {
    const { owner, lead } = people;
    const session = JSON.parse((await call(lead, 'GET', '/api/session')).body) as { assignments: { locationId: number }[] };
    const shop = { locationId: session.assignments[0]!.locationId, buildId: (await idsFor(lead)).buildId };
    const drawn = await measureDrawn(app.baseUrl, (screen) => log(`${label}: drawn in Chromium, ${screen}`));
    log(`${label}: 50 connections for ${options.seconds} s, ${LOAD_RUNS} times`);
    const load = await repeatedLoad(owner, lead, shop, 50, options.seconds);
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
// Apps still running: each stops once, when its size is done or the run fails.
const running = new Set<Started>();
const stop = async (size: Started) => {
  if (running.delete(size)) await size.app.stop();
};
try {
  const demo = await startSize(demoDir, 'demo', null);
  running.add(demo);
  const shorter = await networkData(demo.size.locations, options.years, options.reuse);
  const sameYears = await startSize(shorter.dir, `the demo's ${demo.size.locations} shops over ${options.years} years`, shorter.generatedSeconds);
  running.add(sameYears);
  const network = await networkData(options.locations, options.years, options.reuse);
  const label = `network ${options.locations} × ${options.years} years${network.reused ? ' (generated by an earlier run)' : ''}`;
  const large = await startSize(network.dir, label, network.generatedSeconds);
  running.add(large);
  const [demoScreens, sameYearsScreens, networkScreens] = await screensOf([demo, sameYears, large], options);
  await stop(sameYears);
  // measureRest stops the app itself, whatever happens.
  running.delete(demo);
  const demoRun = await measureRest(demo, demoScreens!, options);
  log('demo: the accountant exports twelve months');
  const demoExport = await measureExport(demoDir);
  running.delete(large);
  const generated = await measureRest(large, networkScreens!, options);
  log(`${label}: the accountant exports twelve months`);
  const networkExport = await measureExport(network.dir);
  const exports = exportTable([exportLine('demo', demoExport), exportLine(label, networkExport)]);
  const sameYearsRun = { size: sameYears.size, screens: sameYearsScreens! };
  const summary = targetLines(demoRun, sameYearsRun, generated, networkExport);
  const text = [report(demoRun, sameYearsRun, generated, options.samples, loadAtStart, summary), '', ...drawnTable(demoRun.drawn, generated.drawn), '', ...rollupLines([['demo', demoRun.rollups], [label, generated.rollups]]), '', ...exports].join('\n');
  console.log(text);
  writeReport(options.results, text);
  log(`Wrote ${options.results}.`);
} finally {
  for (const size of running) await stop(size);
  rmSync(demoDir, { recursive: true, force: true });
}
