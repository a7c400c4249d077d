import { benjaminiHochberg, poissonRateInterval, poissonUpperTail } from '@busbar/calc';
import { CATEGORY_LABELS, type WatchRow } from '@busbar/shared';
import type { UnitSums } from '../queries/unit-exposure.ts';
import { addSums, unitMonthsOf } from './figures.ts';
import type { CatalogNames } from './labels.ts';

/** The share of listed rows that may be there by chance alone (false discovery rate). */
export const WATCH_FALSE_DISCOVERY = 0.05;
/** The most rows the list shows. */
export const WATCH_LIMIT = 10;

/** Sums per catalog item and install month (`${itemId} ${YYYY-MM}`). */
export type ItemMonthSums = Map<string, UnitSums>;

interface Exposure {
  failures: number;
  unitMonths: number;
}

const quarterOf = (month: string) => `${month.slice(0, 4)}-Q${Math.ceil(Number(month.slice(5, 7)) / 3)}`;
const monthsOf = (quarter: string) => {
  const first = (Number(quarter.slice(6)) - 1) * 3 + 1;
  return { from: `${quarter.slice(0, 4)}-${String(first).padStart(2, '0')}`, to: `${quarter.slice(0, 4)}-${String(first + 2).padStart(2, '0')}` };
};

/** Failures and unit-months per item and install quarter. */
function byQuarter(sums: ItemMonthSums, todayDay: number): Map<number, Map<string, Exposure>> {
  const items = new Map<number, Map<string, UnitSums[]>>();
  for (const [key, s] of sums) {
    const [item, month] = key.split(' ') as [string, string];
    const quarters = items.get(Number(item)) ?? new Map<string, UnitSums[]>();
    quarters.set(quarterOf(month), [...(quarters.get(quarterOf(month)) ?? []), s]);
    items.set(Number(item), quarters);
  }
  return new Map(
    [...items].map(([item, quarters]) => [item, new Map([...quarters].map(([q, list]) => [q, exposureOf(addSums(list), todayDay)]))]),
  );
}

const exposureOf = (s: UnitSums, todayDay: number): Exposure => ({ failures: s.failures, unitMonths: unitMonthsOf(s, todayDay) });

/**
 * Items, and each item's units installed in one quarter (a bad batch shows as a quarter), that fail
 * more than the other items of their category across the network. The failures expected are the
 * peers' rate in each install quarter times the item's time in service from that quarter, so young
 * and old installs are each compared with peers of their own age. Evidence is the one-sided Poisson
 * chance of the count or more. Judging hundreds of rows at once, some would pass any fixed threshold
 * by chance; the Benjamini–Hochberg step-up rule (J R Stat Soc B 57:289–300, 1995) lists the rows
 * whose chance is at most k/m × WATCH_FALSE_DISCOVERY for the k-th smallest of m judged, which keeps
 * the expected share of chance findings among those listed at or below WATCH_FALSE_DISCOVERY.
 */
export function componentsToWatch(inScope: ItemMonthSums, network: ItemMonthSums, names: CatalogNames, todayDay: number): WatchRow[] {
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
  const candidates: WatchRow[] = [];
  for (const [itemId, quarters] of mine) {
    const item = names.items.get(itemId);
    if (!item) continue;
    const judged: { quarter: string; observed: Exposure; expected: number }[] = [];
    for (const [quarter, observed] of quarters) {
      const total = categoryTotals.get(`${item.category} ${quarter}`)!;
      const own = all.get(itemId)?.get(quarter) ?? { failures: 0, unitMonths: 0 };
      const peers = { failures: total.failures - own.failures, unitMonths: total.unitMonths - own.unitMonths };
      if (peers.unitMonths > 0 && peers.failures > 0 && observed.unitMonths > 0) {
        judged.push({ quarter, observed, expected: (peers.failures / peers.unitMonths) * observed.unitMonths });
      }
    }
    const whole = judged.reduce((sum, j) => ({ failures: sum.failures + j.observed.failures, unitMonths: sum.unitMonths + j.observed.unitMonths, expected: sum.expected + j.expected }), {
      failures: 0,
      unitMonths: 0,
      expected: 0,
    });
    if (judged.length > 0) candidates.push(watchRow(item, null, whole, whole.expected));
    for (const j of judged) candidates.push(watchRow(item, j.quarter, j.observed, j.expected));
  }
  const ranked = candidates.sort((a, b) => a.chance - b.chance || b.ratioLower - a.ratioLower);
  const passing = benjaminiHochberg(ranked.map((row) => row.chance), WATCH_FALSE_DISCOVERY);
  return ranked.slice(0, passing).slice(0, WATCH_LIMIT);
}

function watchRow(item: { id: number; sku: string; name: string; category: keyof typeof CATEGORY_LABELS }, quarter: string | null, observed: Exposure, expected: number): WatchRow {
  const { from, to } = quarter ? monthsOf(quarter) : { from: null, to: null };
  const chance = poissonUpperTail(observed.failures, expected);
  const ratio = observed.failures / expected;
  // The item's exact lower rate limit over the peers' rate (their far larger exposure taken as known).
  const ratioLower = (poissonRateInterval(observed.failures, observed.unitMonths).lower * observed.unitMonths) / expected;
  const which = quarter ? `Installed ${from} to ${to}: ` : '';
  const reason = `${which}${observed.failures} failures where ${expected.toFixed(1)} were expected at the rate of the other items in ${CATEGORY_LABELS[item.category]}: ${ratio.toFixed(1)} times as many`;
  return { key: String(item.id), label: `${item.sku} ${item.name}`, from, to, failures: observed.failures, expected, chance, ratio, ratioLower, reason };
}
