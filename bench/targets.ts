import type { ExportFigures } from './exports.ts';
import { PEOPLE, perSecondOfRuns, type ScreensRun, type SizeRun, type Who } from './results.ts';
import { SCREENS, type ScreenFigure } from './screens.ts';
import { ms } from './stats.ts';

/** The targets of the network-scale work, as the figures are judged against them. */
const MAX_P95_MS = 100;
const MAX_RATIO = 2;
const MIN_PER_SECOND = 500;
const MAX_DETAIL_WHILE_BUSY_MS = 50;
const MAX_PEAK_MIB = 400;

type Timed = Extract<ScreenFigure, { p95: number }>;
const timed = (figure: ScreenFigure | undefined): figure is Timed => figure !== undefined && 'p95' in figure;
const holds = (ok: boolean) => (ok ? 'holds' : '**missed**');
const times = (value: number) => `${value.toFixed(1)}×`;

/** A screen's ratio to the demo's, with the like-for-like ratios beside it where they were measured. */
function missLine(label: string, who: Who, demo: Timed, network: Timed, sameYears: ScreenFigure | undefined): string {
  const likeForLike = [
    network.sameRows ? `${times(network.sameRows.p95 / demo.p95)} with pages of the demo's rows` : null,
    timed(sameYears) ? `${times(network.p95 / sameYears.p95)} the demo's shops over the same years` : null,
  ].filter((text) => text !== null);
  return `  - ${label} (${who}): ${ms(network.p95)} ms, ${times(network.p95 / demo.p95)}${likeForLike.length > 0 ? `; ${likeForLike.join(', ')}` : ''}`;
}

/**
 * What holds and what is missed at the network's size, in a few lines above the tables: every
 * screen's p95 and its ratio to the demo's (each miss named, with its like-for-like ratios), the
 * requests a second under load, a lead's build detail while the owner's import and export run, and
 * the peak memory.
 */
export function targetLines(demo: SizeRun, sameYears: ScreensRun, network: SizeRun, networkExport: ExportFigures): string[] {
  const pairs = PEOPLE.flatMap((who) =>
    SCREENS.map(([label]) => ({ label, who, d: demo.screens[who].get(label), n: network.screens[who].get(label), s: sameYears.screens[who].get(label) })),
  ).filter((p): p is typeof p & { d: Timed; n: Timed } => timed(p.d) && timed(p.n));
  const slowest = pairs.reduce((most, p) => (p.n.p95 > most.n.p95 ? p : most), pairs[0]!);
  const over = pairs.filter((p) => p.n.p95 > MAX_P95_MS);
  const grown = pairs.filter((p) => p.n.p95 / p.d.p95 > MAX_RATIO);
  const { load, contention, memory } = network;
  const busyDetail = Math.max(contention.leadDetail.p95, networkExport.leadDetail.p95);
  const peak = Math.max(memory.largestMiB, networkExport.memory.largestMiB);
  return [
    `Against the targets at the network's size (${pairs.length} screen figures: each screen for each person who may read it):`,
    '',
    `- p95 at most ${MAX_P95_MS} ms: ${holds(over.length === 0)}, ${pairs.length - over.length} of ${pairs.length} within it; the slowest ${slowest.label} (${slowest.who}), ${ms(slowest.n.p95)} ms.`,
    ...over.map((p) => missLine(p.label, p.who, p.d, p.n, p.s)),
    `- p95 at most ${MAX_RATIO}× the demo's: ${holds(grown.length === 0)}, ${pairs.length - grown.length} of ${pairs.length} within it${grown.length > 0 ? '; over it:' : '.'}`,
    ...grown.map((p) => missLine(p.label, p.who, p.d, p.n, p.s)),
    `- ${load.connections} connections, reads and writes: ${holds(load.perSecond >= MIN_PER_SECOND && load.errors === 0)} (at least ${MIN_PER_SECOND} req/s with 0 errors): ${load.perSecond.toFixed(0)} req/s, the median of ${load.perSecondOfRuns.length} runs (${perSecondOfRuns(load)}), ${load.errors} errors in all.`,
    `- A lead's build detail p95 while the owner imports and while the accountant exports, at most ${MAX_DETAIL_WHILE_BUSY_MS} ms: ${holds(busyDetail <= MAX_DETAIL_WHILE_BUSY_MS)}: ${ms(contention.leadDetail.p95)} and ${ms(networkExport.leadDetail.p95)} ms.`,
    `- Peak RSS of the largest app process at most ${MAX_PEAK_MIB} MiB: ${holds(peak <= MAX_PEAK_MIB)}: ${memory.largestMiB.toFixed(0)} MiB through the screens and the load, ${networkExport.memory.largestMiB.toFixed(0)} MiB through the export.`,
  ];
}
