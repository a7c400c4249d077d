import type { Db } from '@busbar/db';
import type { ReliabilityList, ReliabilityQuery, ReliabilityRow } from '@busbar/shared';
import type { LocationScope } from '../access/locations.ts';
import { unitSums, type UnitSums } from '../queries/unit-exposure.ts';
import { addSums, figuresOf } from './figures.ts';
import { catalogNames, labelOf } from './labels.ts';
import { componentsToWatch } from './watch.ts';

/**
 * Every item, category or vendor with units installed in the months at the locations, with its
 * figures, and the components to watch among them. Both come from one sum per catalog item in
 * scope (and one across the network for the peers, when the scope is narrower).
 */
export async function reliabilityList(db: Db, scope: LocationScope, query: ReliabilityQuery, today: string, todayDay: number): Promise<ReliabilityList> {
  const months = { from: query.from, to: query.to };
  const names = await catalogNames(db);
  const byItem = (rows: (UnitSums & { key: string | number })[]) => new Map(rows.map(({ key, ...sums }) => [Number(key), sums]));
  const inScope = byItem(await unitSums(db, { scope, ...months }, 'item', today));
  const network = scope === 'all' ? inScope : byItem(await unitSums(db, { scope: 'all', ...months }, 'item', today));

  const groups = new Map<string, UnitSums[]>();
  for (const [itemId, sums] of inScope) {
    const item = names.items.get(itemId);
    if (!item || sums.units === 0) continue;
    const key = query.groupBy === 'item' ? String(itemId) : query.groupBy === 'category' ? item.category : String(item.vendorId);
    groups.set(key, [...(groups.get(key) ?? []), sums]);
  }
  const rows: ReliabilityRow[] = [];
  for (const [key, sums] of groups) {
    const named = labelOf(names, query.groupBy, key);
    if (named) rows.push({ key, ...named, ...figuresOf(addSums(sums), todayDay) });
  }
  rows.sort((a, b) => a.label.localeCompare(b.label));
  return { asOf: today, groupBy: query.groupBy, rows, watch: componentsToWatch(inScope, network, names, todayDay) };
}
