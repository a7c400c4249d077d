import { poissonRateInterval, poissonUpperTail } from '@busbar/calc';
import { CATEGORY_LABELS, type WatchRow } from '@busbar/shared';
import type { UnitSums } from '../queries/unit-exposure.ts';
import { addSums, unitMonthsOf } from './figures.ts';
import type { CatalogNames } from './labels.ts';

/** Listed when failing this far past the peers' rate would happen by chance less often than this. */
export const WATCH_CHANCE = 0.01;
/** The most items the list shows. */
export const WATCH_LIMIT = 10;

/**
 * Items that fail more than the other items of their category across the network, ranked by
 * evidence: the chance of the item's failure count or more at the peers' rate and the item's own
 * time in service (one-sided Poisson), smallest first; a large count at a rate near its peers'
 * ranks below a few failures far past it. An item whose category has no other item in service
 * has no peers and is not judged.
 */
export function componentsToWatch(inScope: Map<number, UnitSums>, network: Map<number, UnitSums>, names: CatalogNames, todayDay: number): WatchRow[] {
  const rows: WatchRow[] = [];
  for (const [itemId, sums] of inScope) {
    const item = names.items.get(itemId);
    if (!item || sums.failures === 0) continue;
    const peers = addSums([...network].filter(([id]) => id !== itemId && names.items.get(id)?.category === item.category).map(([, s]) => s));
    const peerMonths = unitMonthsOf(peers, todayDay);
    const unitMonths = unitMonthsOf(sums, todayDay);
    if (peerMonths <= 0 || peers.failures === 0 || unitMonths <= 0) continue;
    const peerRate = peers.failures / peerMonths;
    const expected = peerRate * unitMonths;
    const chance = poissonUpperTail(sums.failures, expected);
    if (chance >= WATCH_CHANCE) continue;
    const ratio = sums.failures / expected;
    const ratioLower = poissonRateInterval(sums.failures, unitMonths).lower / peerRate;
    const reason = `${sums.failures} failures where ${expected.toFixed(1)} were expected at the rate of the other items in ${CATEGORY_LABELS[item.category]}: ${ratio.toFixed(1)} times as many`;
    rows.push({ key: String(itemId), label: `${item.sku} ${item.name}`, failures: sums.failures, expected, chance, ratio, ratioLower, reason });
  }
  return rows.sort((a, b) => a.chance - b.chance || b.ratioLower - a.ratioLower).slice(0, WATCH_LIMIT);
}
