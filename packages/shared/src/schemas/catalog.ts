import { z } from 'zod';
import { emailSchema, multilineText, optionalText, pageQuery, pagingOf, text } from './common.ts';

/** The fixed list of catalog categories. */
export const CATEGORIES = [
  'house_battery',
  'starter_battery',
  'dc_dc_charger',
  'solar_panel',
  'solar_controller',
  'inverter',
  'fuse_block',
  'switch_panel',
  'battery_monitor',
  'air_compressor',
  'cable_terminals',
  'tray_mount',
  'other',
] as const;
export type Category = (typeof CATEGORIES)[number];

export const CATEGORY_LABELS: Record<Category, string> = {
  house_battery: 'House battery',
  starter_battery: 'Starter battery',
  dc_dc_charger: 'DC-DC charger',
  solar_panel: 'Solar panel',
  solar_controller: 'Solar charge controller',
  inverter: 'Inverter',
  fuse_block: 'Fuse block',
  switch_panel: 'Switch panel',
  battery_monitor: 'Battery monitor',
  air_compressor: 'Air compressor',
  cable_terminals: 'Cable and terminals',
  tray_mount: 'Tray and mount',
  other: 'Other',
};

export const CHEMISTRIES = ['lifepo4', 'agm', 'flooded'] as const;
export type Chemistry = (typeof CHEMISTRIES)[number];

const positive = (max: number, unit: string) =>
  z.number({ error: 'Enter a number' }).positive('Must be more than zero').max(max, `At most ${max} ${unit}`);

const battery = z.strictObject({
  chemistry: z.enum(CHEMISTRIES, { error: 'Choose LiFePO4, AGM or flooded' }),
  capacityAh: positive(2000, 'Ah'),
  nominalV: positive(60, 'V'),
});

/** Specs each category must carry, checked on every write. */
export const SPEC_SCHEMAS = {
  house_battery: battery,
  starter_battery: battery.extend({ coldCrankingA: positive(3000, 'A').optional() }),
  dc_dc_charger: z.strictObject({ outputA: positive(200, 'A') }),
  solar_panel: z.strictObject({ watts: positive(1000, 'W') }),
  solar_controller: z.strictObject({ maxChargeA: positive(200, 'A'), tracking: z.enum(['mppt', 'pwm']) }),
  inverter: z
    .strictObject({
      continuousW: positive(10000, 'W'),
      surgeW: positive(30000, 'W'),
      efficiency: z.number().min(0.5, 'At least 0.5').max(1, 'At most 1'),
    })
    .refine((s) => s.surgeW >= s.continuousW, { path: ['surgeW'], message: 'Surge must be at least the continuous rating' }),
  fuse_block: z.strictObject({ circuits: z.int().min(1).max(48), maxA: positive(500, 'A') }),
  switch_panel: z.strictObject({ switches: z.int().min(1).max(24) }),
  battery_monitor: z.strictObject({ shuntA: positive(2000, 'A') }),
  air_compressor: z.strictObject({ drawA: positive(200, 'A'), dutyCyclePercent: z.number().min(1).max(100) }),
  cable_terminals: z.strictObject({}),
  tray_mount: z.strictObject({}),
  other: z.strictObject({}),
} satisfies Record<Category, z.ZodType>;

const money = z.int('Whole cents').min(0, 'Cannot be negative').max(100_000_000, 'Too large');

/** A catalog item's SKU, as the catalog form and the import take it. */
export const skuSchema = text(40, 'Enter a SKU').regex(/^[A-Za-z0-9][A-Za-z0-9._-]*$/, 'Letters, digits, dot, dash or underscore');

const catalogItemFields = {
  sku: skuSchema,
  vendorId: z.int().positive({ error: 'Choose a vendor' }),
  category: z.enum(CATEGORIES, { error: 'Choose a category' }),
  name: text(120, 'Enter a name'),
  specs: z.record(z.string(), z.unknown()).default({}),
  serialized: z.boolean(),
  unitCostCents: money,
  unitPriceCents: money,
  warrantyMonths: z.int().min(0).max(240),
  active: z.boolean().default(true),
};

/** Checks specs against the schema of the item's category, naming the field as `specs.<name>`. */
function checkSpecs(item: { category: Category; specs: Record<string, unknown> }, ctx: z.RefinementCtx) {
  const result = SPEC_SCHEMAS[item.category].safeParse(item.specs);
  if (result.success) return;
  for (const issue of result.error.issues) {
    const keys = issue.code === 'unrecognized_keys' ? issue.keys : [undefined];
    for (const key of keys) {
      ctx.addIssue({ code: 'custom', path: ['specs', ...issue.path, ...(key ? [key] : [])], message: key ? 'Unknown field' : issue.message });
    }
  }
}

export const catalogItemBody = z.strictObject(catalogItemFields).superRefine(checkSpecs);
export type CatalogItemBody = z.infer<typeof catalogItemBody>;

export const catalogItemUpdate = z
  .strictObject({ ...catalogItemFields, version: z.int().min(1) })
  .superRefine(checkSpecs);
export type CatalogItemUpdate = z.infer<typeof catalogItemUpdate>;

export type CatalogQuery = z.infer<typeof catalogQuery>;
export const catalogQuery = z.strictObject({
  category: z.enum(CATEGORIES).optional(),
  vendorId: z.coerce.number().int().positive().optional(),
  q: optionalText(100).optional(),
  active: z.enum(['true', 'false', 'all']).default('true'),
  ...pageQuery,
});

/** A catalog item as read; cost fields are absent for people who may not read them. */
export interface CatalogItemView {
  id: number;
  sku: string;
  vendorId: number;
  vendorName: string;
  category: Category;
  name: string;
  specs: Record<string, unknown>;
  serialized: boolean;
  unitCostCents?: number;
  marginCents?: number;
  unitPriceCents?: number;
  warrantyMonths: number;
  active: boolean;
  version: number;
}

const vendorFields = {
  name: text(120, 'Enter a name'),
  rmaEmail: emailSchema,
  defaultWarrantyMonths: z.int().min(0).max(240),
  notes: multilineText(2000).default(''),
  active: z.boolean().default(true),
};
export const vendorBody = z.strictObject(vendorFields);
export type VendorBody = z.infer<typeof vendorBody>;
export const vendorUpdate = z.strictObject({ ...vendorFields, version: z.int().min(1) });
export type VendorUpdate = z.infer<typeof vendorUpdate>;

/** Vendors are few: one page of up to 200 holds them all in a pick list. */
export const vendorQuery = z.strictObject({ ...pagingOf(200, 200) });

export interface VendorView {
  id: number;
  name: string;
  rmaEmail: string;
  defaultWarrantyMonths: number;
  notes: string;
  active: boolean;
  version: number;
}
