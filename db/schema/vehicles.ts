import type { Generated } from 'kysely';

export interface VehiclesTable {
  id: Generated<number>;
  customerId: number;
  /** The customer's location, kept here so every vehicle query is scoped without a join. */
  locationId: number;
  year: number;
  bodyStyle: string;
  make: string;
  model: string;
  notes: string;
  version: Generated<number>;
}
