import type { Generated } from 'kysely';

export interface VendorsTable {
  id: Generated<number>;
  name: string;
  rmaEmail: string;
  defaultWarrantyMonths: number;
  notes: Generated<string>;
  /** SQLite has no boolean: 1 or 0. */
  active: Generated<number>;
  version: Generated<number>;
}
