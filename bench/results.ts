import { writeFileSync } from 'node:fs';
import { cpus, loadavg, totalmem } from 'node:os';
import type { DrawnScreens } from './browser.ts';
import type { ContentionFigures } from './contention.ts';
import { LOAD_RUNS, LOAD_WARM_UP_SECONDS, type RepeatedLoad } from './load.ts';
import type { DataSize } from './network-data.ts';
import type { PeakMemory } from './server.ts';
import { SCREENS, type ScreenFigure } from './screens.ts';
import { ms } from './stats.ts';

/** The people each screen is measured for: the whole network, a region, one shop. */
export const PEOPLE = ['owner', 'regional manager', 'lead'] as const;
export type Who = (typeof PEOPLE)[number];

/** Everything measured at one size of data. */
export interface SizeRun {
  size: DataSize;
  screens: Record<Who, Map<string, ScreenFigure>>;
  load: RepeatedLoad;
  contention: ContentionFigures;
  memory: PeakMemory;
  drawn: DrawnScreens;
}

/** The screens alone, at a size measured for comparison only. */
export type ScreensRun = Pick<SizeRun, 'size' | 'screens'>;

const cell = (figure: ScreenFigure | undefined) =>
  !figure ? '–' : 'status' in figure ? `(${figure.status})` : `${ms(figure.p50)} / ${ms(figure.p95)} / ${ms(figure.p99)}`;
const ratio = (demo: ScreenFigure | undefined, network: ScreenFigure | undefined) =>
  demo && network && 'p95' in demo && 'p95' in network ? `${(network.p95 / demo.p95).toFixed(1)}×` : '–';

const rowsOnPage = (figure: ScreenFigure | undefined) => (figure && 'rows' in figure && figure.rows !== null ? String(figure.rows) : '–');

/** The network's p95 with pages of the demo's rows, and its ratio to the demo's, where the demo's page was shorter. */
const sameRows = (demo: ScreenFigure | undefined, network: ScreenFigure | undefined) =>
  demo && network && 'p95' in demo && 'sameRows' in network && network.sameRows ? `${ms(network.sameRows.p95)} ms, ${(network.sameRows.p95 / demo.p95).toFixed(1)}×` : '–';

/** The p95 on the demo's shops over the network's years, and the network's ratio to it. */
const sameYears = (shorter: ScreenFigure | undefined, network: ScreenFigure | undefined) =>
  shorter && 'p95' in shorter ? `${ms(shorter.p95)} ms, ${ratio(shorter, network)}` : cell(shorter);

function screenTable(demo: SizeRun, shorter: ScreensRun, network: SizeRun, who: Who): string[] {
  const rows = SCREENS.map(([label]) => {
    const [d, s, n] = [demo.screens[who].get(label), shorter.screens[who].get(label), network.screens[who].get(label)];
    return `| ${label} | ${cell(d)} | ${cell(n)} | ${ratio(d, n)} | ${rowsOnPage(d)} / ${rowsOnPage(n)} | ${sameRows(d, n)} | ${sameYears(s, n)} |`;
  });
  return [
    `| screen (${who}) | demo p50 / p95 / p99 ms | network p50 / p95 / p99 ms | p95 ratio | rows in the answer, demo / network | network p95 with pages of the demo's rows, ratio | p95 on the demo's shops over the network's years, network's ratio to it |`,
    '|---|---|---|---|---|---|---|',
    ...rows,
  ];
}

const sizeLine = ({ size }: ScreensRun) =>
  `${size.label}: ${size.locations} locations, ${size.builds.toLocaleString('en-US')} builds, ${size.buildItems.toLocaleString('en-US')} build lines, ${size.claims.toLocaleString('en-US')} warranty claims, ${size.auditRows.toLocaleString('en-US')} audit rows, ${size.finalMonths.toLocaleString('en-US')} months final` +
  (size.generatedSeconds === null ? '' : ` (generated in ${Math.round(size.generatedSeconds)} s)`);

/** Each run's req/s, in the order run. */
export const perSecondOfRuns = (load: RepeatedLoad) => load.perSecondOfRuns.map((perSecond) => perSecond.toFixed(0)).join(', ');

const otherRows = (run: SizeRun) => [
  `| ${run.size.label} | ${run.load.perSecond.toFixed(0)} req/s (runs: ${perSecondOfRuns(run.load)}), ${run.load.errors} errors in all, ${run.load.requests} requests (${run.load.writes} writes), p95 ${ms(run.load.latency.p95)} ms | ${ms(run.contention.leadDetail.p95)} ms (p50 ${ms(run.contention.leadDetail.p50)}, ${run.contention.leadDetail.count} requests; the lead's saves meanwhile p95 ${ms(run.contention.leadWrites.p95)} ms, max ${ms(run.contention.leadWrites.max)} ms of ${run.contention.leadWrites.count}; import of ${run.contention.importRows} rows answered ${run.contention.importStatus} in ${ms(run.contention.importMs)} ms, ${run.contention.ownerRequests} owner list requests meanwhile) | ${run.memory.largestMiB.toFixed(0)} MiB (${run.memory.processes} processes: ${run.memory.totalMiB.toFixed(0)} MiB) |`,
];

/** The figures as Markdown, with the machine and the date they were taken on, and `summary` above the tables. */
export function report(demo: SizeRun, shorter: ScreensRun, network: SizeRun, samples: number, loadAtStart: number, summary: string[]): string {
  // Other work on the machine shows in every figure, so the load average goes with them.
  const machine = `${cpus().length} CPUs (${cpus()[0]?.model.trim() ?? 'unknown'}), ${(totalmem() / 2 ** 30).toFixed(1)} GiB memory, Node ${process.version}, load average ${loadAtStart.toFixed(1)} at the start and ${loadavg()[0]!.toFixed(1)} at the end`;
  return [
    '# Benchmark results',
    '',
    `Taken ${new Date().toISOString().slice(0, 16).replace('T', ' ')} UTC on ${machine}, by \`pnpm bench\` (figures are printed, nothing is asserted).`,
    '',
    `- ${sizeLine(demo)}`,
    `- ${sizeLine(network)}`,
    `- ${sizeLine(shorter)}, for the last column only`,
    '',
    ...summary,
    '',
    `Each screen's API request through HTTP with a signed-in person, after 5 warm-up requests, ${samples} timed requests one after another (ms to the last byte, brotli as a browser asks); the three sizes' apps run side by side and take turns of 20 requests (after one untimed), so that a change in the machine's speed meanwhile falls on all three alike. A regional manager and a lead read no audit log: (403). Where a list's page at the demo's size held fewer rows, the network's list is timed once more with pages of that many rows. The last column times each screen on a network of the demo's shops with the network's years of history: the network's ratio to it is what more shops cost, without more years.`,
    '',
    ...PEOPLE.flatMap((who) => [...screenTable(demo, shorter, network, who), '']),
    `| data | ${demo.load.connections} connections, reads and writes, ${demo.load.seconds.toFixed(0)} s (after ${LOAD_WARM_UP_SECONDS} s untimed), the median of ${LOAD_RUNS} runs | a lead's build detail p95 while the owner imports and reads big lists, and the lead's saves | peak RSS of the largest app process (of all together) |`,
    '|---|---|---|---|',
    ...otherRows(demo),
    ...otherRows(network),
    '',
  ].join('\n');
}

export function writeReport(file: string, text: string): void {
  writeFileSync(file, text);
}
