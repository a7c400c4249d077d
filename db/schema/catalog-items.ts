import type { Generated } from 'kysely';
import type { Category } from '@busbar/shared';

export interface CatalogItemsTable {
  id: Generated<number>;
  sku: string;
  vendorId: number;
  category: Category;
  name: string;
  /** JSON, checked against the category's schema on every write. */
  specs: string;
  serialized: number;
  unitCostCents: number;
  unitPriceCents: number;
  warrantyMonths: number;
  active: Generated<number>;
  version: Generated<number>;
}
