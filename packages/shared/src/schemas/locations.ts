import { z } from 'zod';
import { idSchema, optionalText, pageQuery } from './common.ts';
import { monthSchema } from './rollups.ts';

/** The largest approval limit the owner may set: a million dollars. */
export const MAX_APPROVAL_LIMIT_CENTS = 100_000_000;

/** One page of the locations a person may see, by code or name and by region. */
export const locationListQuery = z.strictObject({
  q: optionalText(80).optional(),
  regionId: idSchema.optional(),
  ...pageQuery,
});
export type LocationListQuery = z.infer<typeof locationListQuery>;

/**
 * One page of the people who may lead builds at the person's shops (within one shop or region of
 * them), by a part of their name; `id` asks for one of them (to name a choice kept in the address bar).
 */
export const buildLeadQuery = z.strictObject({
  q: optionalText(80).optional(),
  id: idSchema.optional(),
  locationId: idSchema.optional(),
  regionId: idSchema.optional(),
  ...pageQuery,
});

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

const rate = z.int('Enter the rate in basis points (650 is 6.5 %)').min(0, 'The rate cannot be negative').max(10_000, 'The rate can be at most 100 %');

/** Royalty terms the owner sets on a location from a month on (a month's terms set again are replaced). */
export const royaltyTermsBody = z
  .strictObject({ appliesFrom: monthSchema, royaltyBasisPoints: rate, marketingBasisPoints: rate })
  .refine((t) => t.royaltyBasisPoints + t.marketingBasisPoints <= 10_000, { path: ['marketingBasisPoints'], message: 'Royalty and marketing fund together can be at most 100 %' });
export type RoyaltyTermsBody = z.infer<typeof royaltyTermsBody>;

/** Terms as set, with who set them. */
export interface RoyaltyTermsView extends RoyaltyTermsBody {
  id: number;
  createdAt: string;
  createdByName: string | null;
}

/** A sales tax rate the owner sets on a location from a month on: on parts, and on labor where it is taxed. */
export const salesTaxBody = z.strictObject({
  appliesFrom: monthSchema,
  basisPoints: z.int('Enter the rate in basis points (825 is 8.25 %)').min(0, 'The rate cannot be negative').max(10_000, 'The rate can be at most 100 %'),
  laborTaxed: z.boolean('Say whether labor is taxed'),
});
export type SalesTaxBody = z.infer<typeof salesTaxBody>;

/** A rate as set, with who set it. */
export interface SalesTaxView extends SalesTaxBody {
  id: number;
  createdAt: string;
  createdByName: string | null;
}
