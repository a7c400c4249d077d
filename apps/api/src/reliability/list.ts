import type { Db } from '@busbar/db';
import type { ReliabilityList, ReliabilityQuery, ReliabilityRow } from '@busbar/shared';
import type { LocationScope } from '../access/locations.ts';
import { unitSums, type UnitSums } from '../queries/unit-exposure.ts';
import { addSums, figuresOf, NO_UNITS } from './figures.ts';
import { catalogNames, labelOf } from './labels.ts';
import { componentsToWatch, type ItemQuarterSums } from './watch.ts';

/**
 * Every item, category or vendor with units installed in the months at the locations, with its
 * figures, and the components to watch among them. Both come from one sum per catalog item and
 * install quarter in scope (and one across the network for the peers, when the scope is narrower).
 */
export async function reliabilityList(db: Db, scope: LocationScope, query: ReliabilityQuery, today: string, todayDay: number): Promise<ReliabilityList> {
  const months = { from: query.from, to: query.to };
  const names = await catalogNames(db);
  // Each row stays as read, its key with it (taking the key out made a copy of each of a thousand rows).
  const byItemQuarter = (rows: (UnitSums & { key: string | number })[]): ItemQuarterSums => new Map(rows.map((row) => [String(row.key), row]));
  const inScope = byItemQuarter(await unitSums(db, { scope, ...months }, 'itemQuarter', today));
  const network = scope === 'all' ? inScope : byItemQuarter(await unitSums(db, { scope: 'all', ...months }, 'itemQuarter', today));

  const groupOf = (itemQuarter: string) => {
    const item = names.items.get(Number(itemQuarter.split(' ')[0]));
    if (!item) return null;
    return query.groupBy === 'item' ? String(item.id) : query.groupBy === 'category' ? item.category : String(item.vendorId);
  };
  const mine = byGroup(inScope, groupOf);
  const everyone = scope === 'all' ? mine : byGroup(network, groupOf);
  const rows: ReliabilityRow[] = [];
  for (const [key, sums] of mine) {
    const named = labelOf(names, query.groupBy, key);
    if (!named || sums.units === 0) continue;
    const networkRate = figuresOf(everyone.get(key)!, todayDay).rate;
    rows.push({ key, ...named, ...figuresOf(sums, todayDay), networkRate });
  }
  rows.sort((a, b) => a.label.localeCompare(b.label));
  return { asOf: today, groupBy: query.groupBy, rows, watch: componentsToWatch(inScope, network, names, todayDay) };
}

/** Item-quarter sums added up by the group `groupOf` puts each in (none: left out). */
function byGroup(sums: ItemQuarterSums, groupOf: (itemQuarter: string) => string | null): Map<string, UnitSums> {
  const groups = new Map<string, UnitSums>();
  for (const [itemQuarter, s] of sums) {
    const key = groupOf(itemQuarter);
    if (key !== null) groups.set(key, addSums([groups.get(key) ?? NO_UNITS, s]));
  }
  return groups;
}
