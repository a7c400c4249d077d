import type { Db } from '@busbar/db';
import { CATEGORY_LABELS, type Category, type ReliabilityGroup } from '@busbar/shared';

export interface CatalogEntry {
  id: number;
  sku: string;
  name: string;
  category: Category;
  vendorId: number;
}

/** The catalog and vendors, for naming rows and finding an item's peers. */
export async function catalogNames(db: Db) {
  const items = await db.selectFrom('catalogItems').select(['id', 'sku', 'name', 'category', 'vendorId']).execute();
  const vendors = await db.selectFrom('vendors').select(['id', 'name']).execute();
  return { items: new Map<number, CatalogEntry>(items.map((i) => [i.id, i])), vendors: new Map(vendors.map((v) => [v.id, v.name])) };
}

export type CatalogNames = Awaited<ReturnType<typeof catalogNames>>;

/** The row's name and category for a group key; null when the key names nothing in the catalog. */
export function labelOf(names: CatalogNames, groupBy: ReliabilityGroup, key: string | number): { label: string; category: Category | null } | null {
  if (groupBy === 'category') return key in CATEGORY_LABELS ? { label: CATEGORY_LABELS[key as Category], category: key as Category } : null;
  if (groupBy === 'vendor') {
    const vendor = names.vendors.get(Number(key));
    return vendor === undefined ? null : { label: vendor, category: null };
  }
  const item = names.items.get(Number(key));
  return item ? { label: `${item.sku} ${item.name}`, category: item.category } : null;
}
