import type { Generated } from 'kysely';

export interface BuildItemsTable {
  id: Generated<number>;
  buildId: number;
  catalogItemId: number;
  /** The SKU at the time, so a serial number stays unique per SKU. */
  sku: string;
  quantity: number;
  serialNumber: string | null;
  /** Price and cost captured when the item was added. */
  unitPriceCents: number;
  unitCostCents: number;
  createdAt: string;
  /** The day the unit was taken out (replaced under a warranty claim); null while in service. */
  removedOn: Generated<string | null>;
}
