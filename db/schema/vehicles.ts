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
  /** 17 characters with a valid check digit (49 CFR 565); null when not recorded. */
  vin: string | null;
  /** In capitals, as on the plate. */
  plate: string | null;
  /** The odometer in miles, and the local day (YYYY-MM-DD, the location's zone) it was read. */
  mileage: number | null;
  mileageReadOn: string | null;
  version: Generated<number>;
}
