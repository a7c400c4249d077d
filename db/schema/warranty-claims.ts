import type { ClaimStatus, Coverage, FailureMode } from '@busbar/shared';
import type { Generated } from 'kysely';

export interface WarrantyClaimsTable {
  id: Generated<number>;
  locationId: number;
  /** Per location; the number is `<location code>-W<five digits>`. */
  sequence: number;
  number: string;
  buildId: number;
  /** The failed unit: one line of the build it came from. */
  buildItemId: number;
  /** The failed unit's catalog item (its vendor and category filter the claims list). */
  catalogItemId: number;
  failedOn: string;
  failureMode: FailureMode;
  coverage: Coverage;
  symptoms: string;
  foundHow: string;
  laborHours: number;
  /** 1 when the unit was past its warranty months from delivery when the claim was logged. */
  outOfWarranty: number;
  status: ClaimStatus;
  /** YYYY-MM-DD in the location's zone by which the next step is due; null when closed. */
  dueOn: string | null;
  vendorRmaNumber: Generated<string>;
  creditRequestedCents: number;
  creditApprovedCents: Generated<number | null>;
  creditReceivedCents: Generated<number | null>;
  /** The build line of the unit put in instead, once there is one. */
  replacementItemId: Generated<number | null>;
  createdBy: number | null;
  createdAt: string;
  /** Local date (YYYY-MM-DD) of `createdAt` in the location's zone, for the roll-ups. */
  loggedOn: Generated<string | null>;
  updatedAt: string;
  version: Generated<number>;
}
