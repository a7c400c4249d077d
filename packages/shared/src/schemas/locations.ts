import { z } from 'zod';
import { idSchema, pageQuery } from './common.ts';

/** The largest approval limit the owner may set: a million dollars. */
export const MAX_APPROVAL_LIMIT_CENTS = 100_000_000;

/** One page of the locations a person may see, by code or name and by region. */
export const locationListQuery = z.strictObject({
  q: z.string().trim().max(80).optional(),
  regionId: idSchema.optional(),
  ...pageQuery,
});
export type LocationListQuery = z.infer<typeof locationListQuery>;

/** What the owner sets on a location: the credit up to which its lead approves warranty claims alone. */
export const locationUpdate = z.strictObject({
  claimApprovalLimitCents: z
    .int('Enter the limit in whole cents')
    .min(0, 'The limit cannot be negative')
    .max(MAX_APPROVAL_LIMIT_CENTS, 'The limit can be at most $1,000,000'),
});
export type LocationUpdate = z.infer<typeof locationUpdate>;

/** A location with its region and the settings the owner keeps. */
export interface LocationSettings {
  id: number;
  code: string;
  name: string;
  regionId: number;
  regionName: string;
  timeZone: string;
  /** A lead approves claims with a credit up to this; above it the regional manager does. */
  claimApprovalLimitCents: number;
}
