/**
 * Field-level rules: the fields of each subject that some roles may not read.
 * The API strips them from every response and export; the web never asks for them.
 */

/** Purchase cost and margin: hidden from technicians and warranty clerks. */
export const COST_FIELDS = ['unitCostCents', 'costCents', 'partsCostCents', 'marginCents'] as const;

/** Selling prices and totals: hidden from warranty clerks. */
export const PRICE_FIELDS = [
  'unitPriceCents',
  'priceCents',
  'laborCents',
  'laborRateCents',
  'partsPriceCents',
  'totalCents',
] as const;

/** Customer contact details, and free-text notes that may hold them: hidden from the accountant everywhere. */
export const CONTACT_FIELDS = ['email', 'phone', 'addressLine1', 'addressLine2', 'city', 'region', 'postalCode', 'notes'] as const;
