import type { Generated } from 'kysely';
import type { BuildStatus } from '@busbar/shared';

export interface BuildsTable {
  id: Generated<number>;
  locationId: number;
  /** Per-location sequence; `number` is the location code and this, e.g. DEN-00042. */
  sequence: number;
  number: string;
  customerId: number;
  vehicleId: number;
  status: BuildStatus;
  leadTechnicianId: number | null;
  /** Local date (YYYY-MM-DD) in the location's time zone. */
  bookedFor: string | null;
  startedAt: string | null;
  deliveredAt: string | null;
  /** Local date (YYYY-MM-DD) of `deliveredAt` in the location's zone, for the roll-ups. */
  deliveredOn: Generated<string | null>;
  laborHours: number;
  /** The location's rate when the build was created. */
  laborRateCents: number;
  /** Totals, computed on the server whenever items or labor change. */
  laborCents: number;
  partsPriceCents: number;
  partsCostCents: number;
  totalCents: number;
  notes: string;
  version: Generated<number>;
  createdAt: string;
  updatedAt: string;
  createdBy: number | null;
}

/** How many builds a location holds in a status, kept by triggers (migration 061). */
export interface BuildCountsTable {
  locationId: number;
  status: BuildStatus;
  builds: number;
}
