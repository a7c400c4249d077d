import type { Db } from '@busbar/db';
import type { ReliabilityList, ReliabilityQuery, ReliabilityRow } from '@busbar/shared';
import type { LocationScope } from '../access/locations.ts';
import { unitSums, type UnitSums } from '../queries/unit-exposure.ts';
import { addSums, figuresOf } from './figures.ts';
import { catalogNames, labelOf } from './labels.ts';
import { componentsToWatch, type ItemMonthSums } from './watch.ts';

/**
 * Every item, category or vendor with units installed in the months at the locations, with its
 * figures, and the components to watch among them. Both come from one sum per catalog item and
 * install month in scope (and one across the network for the peers, when the scope is narrower).
 */
export async function reliabilityList(db: Db, scope: LocationScope, query: ReliabilityQuery, today: string, todayDay: number): Promise<ReliabilityList> {
  const months = { from: query.from, to: query.to };
  const names = await catalogNames(db);
  const byItemMonth = (rows: (UnitSums & { key: string | number })[]): ItemMonthSums => new Map(rows.map(({ key, ...sums }) => [String(key), sums]));
  const inScope = byItemMonth(await unitSums(db, { scope, ...months }, 'itemMonth', today));
  const network = scope === 'all' ? inScope : byItemMonth(await unitSums(db, { scope: 'all', ...months }, 'itemMonth', today));

  const groups = new Map<string, UnitSums[]>();
  for (const [itemMonth, sums] of inScope) {
    const itemId = Number(itemMonth.split(' ')[0]);
    const item = names.items.get(itemId);
    if (!item) continue;
    const key = query.groupBy === 'item' ? String(itemId) : query.groupBy === 'category' ? item.category : String(item.vendorId);
    groups.set(key, [...(groups.get(key) ?? []), sums]);
  }
  const rows: ReliabilityRow[] = [];
  for (const [key, sums] of groups) {
    const named = labelOf(names, query.groupBy, key);
    const total = addSums(sums);
    if (named && total.units > 0) rows.push({ key, ...named, ...figuresOf(total, todayDay) });
  }
  rows.sort((a, b) => a.label.localeCompare(b.label));
  return { asOf: today, groupBy: query.groupBy, rows, watch: componentsToWatch(inScope, network, names, todayDay) };
}
