import { benjaminiHochberg, excessChance, poissonRateInterval } from '@busbar/calc';
import { CATEGORY_LABELS, type WatchRow } from '@busbar/shared';
import type { UnitSums } from '../queries/unit-exposure.ts';
import { unitMonthsOf } from './figures.ts';
import type { CatalogEntry, CatalogNames } from './labels.ts';

/** The share of listed rows that may be there by chance alone (false discovery rate). */
export const WATCH_FALSE_DISCOVERY = 0.05;
/** The most rows the list shows. */
export const WATCH_LIMIT = 10;

/** Sums per catalog item and install quarter (`${itemId} ${YYYY}-Q${1–4}`). */
export type ItemQuarterSums = Map<string, UnitSums>;

interface Exposure {
  failures: number;
  unitMonths: number;
}

const monthsOf = (quarter: string) => {
  const first = (Number(quarter.slice(6)) - 1) * 3 + 1;
  return { from: `${quarter.slice(0, 4)}-${String(first).padStart(2, '0')}`, to: `${quarter.slice(0, 4)}-${String(first + 2).padStart(2, '0')}` };
};

/** Failures and unit-months per item and install quarter. */
function byQuarter(sums: ItemQuarterSums, todayDay: number): Map<number, Map<string, Exposure>> {
  const items = new Map<number, Map<string, Exposure>>();
  for (const [key, s] of sums) {
    const [item, quarter] = key.split(' ') as [string, string];
    const quarters = items.get(Number(item)) ?? new Map<string, Exposure>();
    quarters.set(quarter, exposureOf(s, todayDay));
    items.set(Number(item), quarters);
  }
  return items;
}

const exposureOf = (s: UnitSums, todayDay: number): Exposure => ({ failures: s.failures, unitMonths: unitMonthsOf(s, todayDay) });

/**
 * Items, and each item's units installed in one quarter (a bad batch shows as a quarter), that fail
 * more than the other items of their category across the network, judged quarter of install by
 * quarter so young and old installs are each compared with peers of their own age: the exact
 * conditional test of two Poisson rates, summed over the quarters (`excessChance`), which also
 * judges a quarter whose peers have not failed yet. Judging hundreds of rows at once, some would
 * pass any fixed threshold by chance; the Benjamini–Hochberg step-up rule (J R Stat Soc B
 * 57:289–300, 1995) lists the rows whose chance is at most k/m × WATCH_FALSE_DISCOVERY for the k-th
 * smallest of m judged, keeping the expected share of chance findings listed at or below it.
 */
export function componentsToWatch(inScope: ItemQuarterSums, network: ItemQuarterSums, names: CatalogNames, todayDay: number): WatchRow[] {
  const mine = byQuarter(inScope, todayDay);
  const all = byQuarter(network, todayDay);
  const categoryTotals = new Map<string, Exposure>();
  for (const [item, quarters] of all) {
    for (const [quarter, e] of quarters) {
      const key = `${names.items.get(item)?.category} ${quarter}`;
      const total = categoryTotals.get(key) ?? { failures: 0, unitMonths: 0 };
      categoryTotals.set(key, { failures: total.failures + e.failures, unitMonths: total.unitMonths + e.unitMonths });
    }
  }
  const candidates: Judged[] = [];
  for (const [itemId, quarters] of mine) {
    const item = names.items.get(itemId);
    if (!item) continue;
    const strata = [...quarters].map(([quarter, observed]) => {
      const total = categoryTotals.get(`${item.category} ${quarter}`)!;
      const own = all.get(itemId)?.get(quarter) ?? { failures: 0, unitMonths: 0 };
      const stratum = { events: observed.failures, exposure: observed.unitMonths, peerEvents: total.failures - own.failures, peerExposure: total.unitMonths - own.unitMonths };
      return { quarter, stratum };
    });
    const judged = strata.filter(({ stratum: s }) => s.exposure > 0 && s.peerExposure > 0 && s.events + s.peerEvents > 0);
    if (judged.length === 0) continue;
    candidates.push({ item, quarter: null, ...excessChance(judged.map((j) => j.stratum)) });
    for (const j of judged) candidates.push({ item, quarter: j.quarter, ...excessChance([j.stratum]) });
  }
  const passing = benjaminiHochberg(candidates.map((row) => row.chance), WATCH_FALSE_DISCOVERY);
  return candidates
    .filter((row) => row.events > row.expected)
    .sort((a, b) => a.chance - b.chance || b.events / b.expected - a.events / a.expected)
    .slice(0, Math.min(passing, WATCH_LIMIT))
    .map(watchRow);
}

/** An item, or its units of one install quarter, with its evidence. */
interface Judged {
  item: CatalogEntry;
  quarter: string | null;
  events: number;
  expected: number;
  chance: number;
}

function watchRow({ item, quarter, events: failures, expected, chance }: Judged): WatchRow {
  const { from, to } = quarter ? monthsOf(quarter) : { from: null, to: null };
  const ratio = failures / expected;
  // The lower exact Poisson limit of the count over the count expected (taken as known).
  const ratioLower = poissonRateInterval(failures, 1).lower / expected;
  const which = quarter ? `Installed ${from} to ${to}: ` : '';
  const reason = `${which}${failures} failures where ${expected.toFixed(1)} were expected had it failed like the other items in ${CATEGORY_LABELS[item.category]} installed at the same time: ${ratio.toFixed(1)} times as many`;
  return { key: String(item.id), label: `${item.sku} ${item.name}`, from, to, failures, expected, chance, ratio, ratioLower, reason };
}
