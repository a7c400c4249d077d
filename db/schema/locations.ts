import type { Generated } from 'kysely';

export interface LocationsTable {
  id: Generated<number>;
  regionId: number;
  code: string;
  name: string;
  /** IANA time zone; periods (day, week, month) are cut in this zone. */
  timeZone: string;
  laborRateCents: number;
  /** Royalty owed to the network, in basis points of revenue (650 = 6.5 %). */
  royaltyBasisPoints: number;
  /** Claims whose credit is above this a location lead may not approve alone (the regional manager does). */
  claimApprovalLimitCents: Generated<number>;
}
