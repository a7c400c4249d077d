import { z } from 'zod';
import { emailSchema, idSchema, pageQuery, personNameSchema } from './common.ts';

const optionalText = (max: number) => z.string().trim().max(max).default('');

const customerFields = {
  name: personNameSchema,
  email: z.union([z.literal(''), emailSchema]).default(''),
  phone: optionalText(40).pipe(z.string().regex(/^[0-9+()\-.\s]*$/, 'Digits, spaces and + ( ) - . only')),
  addressLine1: optionalText(120),
  addressLine2: optionalText(120),
  city: optionalText(80),
  region: optionalText(80),
  postalCode: optionalText(20),
  notes: optionalText(4000),
};

export const customerBody = z.strictObject({ locationId: z.int().positive({ error: 'Choose a location' }), ...customerFields });
export type CustomerBody = z.infer<typeof customerBody>;
export const customerUpdate = z.strictObject({ ...customerFields, version: z.int().min(1) });
export type CustomerUpdate = z.infer<typeof customerUpdate>;

export type CustomerQuery = z.infer<typeof customerQuery>;
export const customerQuery = z.strictObject({
  locationId: idSchema.optional(),
  regionId: idSchema.optional(),
  q: z.string().trim().max(100).optional(),
  ...pageQuery,
});

/** A customer as read; contact fields are absent for people who may not read them. */
export interface CustomerView {
  id: number;
  locationId: number;
  name: string;
  email?: string;
  phone?: string;
  addressLine1?: string;
  addressLine2?: string;
  city?: string;
  region?: string;
  postalCode?: string;
  notes: string;
  version: number;
}

export const BODY_STYLES = ['pickup', 'van', 'suv', 'chassis_cab', 'box_truck', 'other'] as const;
export const BODY_STYLE_LABELS: Record<(typeof BODY_STYLES)[number], string> = {
  pickup: 'Pickup',
  van: 'Van',
  suv: 'SUV',
  chassis_cab: 'Chassis cab',
  box_truck: 'Box truck',
  other: 'Other',
};

const vehicleFields = {
  year: z.int('Enter a year').min(1950, 'From 1950').max(2100, 'Until 2100'),
  bodyStyle: z.enum(BODY_STYLES, { error: 'Choose a body style' }),
  make: z.string().trim().min(1, 'Enter the make').max(60),
  model: z.string().trim().min(1, 'Enter the model').max(80),
  notes: optionalText(2000),
};

export const vehicleBody = z.strictObject({ customerId: z.int().positive(), ...vehicleFields });
export type VehicleBody = z.infer<typeof vehicleBody>;
export const vehicleUpdate = z.strictObject({ ...vehicleFields, version: z.int().min(1) });
export type VehicleUpdate = z.infer<typeof vehicleUpdate>;

export interface VehicleView {
  id: number;
  customerId: number;
  locationId: number;
  year: number;
  bodyStyle: (typeof BODY_STYLES)[number];
  make: string;
  model: string;
  notes: string;
  version: number;
}
