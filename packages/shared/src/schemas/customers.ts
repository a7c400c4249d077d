import { z } from 'zod';
import { emailSchema, idSchema, multilineText, optionalText, pageQuery, personNameSchema, text } from './common.ts';
import { lowerMileageConfirmation, vehicleIdentityFields } from './vehicle-identity.ts';

const blankable = (max: number) => optionalText(max).default('');

/** A customer's fields, as the customer form and the import take them. */
export const customerFields = {
  name: personNameSchema,
  email: z.union([z.literal(''), emailSchema]).default(''),
  phone: optionalText(40).regex(/^[0-9+()\-.\s]*$/, 'Digits, spaces and + ( ) - . only').default(''),
  addressLine1: blankable(120),
  addressLine2: blankable(120),
  city: blankable(80),
  region: blankable(80),
  postalCode: blankable(20),
  notes: multilineText(4000).default(''),
};

export const customerBody = z.strictObject({ locationId: z.int().positive({ error: 'Choose a location' }), ...customerFields });
export type CustomerBody = z.infer<typeof customerBody>;
export const customerUpdate = z.strictObject({ ...customerFields, version: z.int().min(1) });
export type CustomerUpdate = z.infer<typeof customerUpdate>;

export type CustomerQuery = z.infer<typeof customerQuery>;
export const customerQuery = z.strictObject({
  locationId: idSchema.optional(),
  regionId: idSchema.optional(),
  q: optionalText(100).optional(),
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

/** A vehicle's fields, as the vehicle form and the import take them. */
export const vehicleFields = {
  year: z.int('Enter a year').min(1950, 'From 1950').max(2100, 'Until 2100'),
  bodyStyle: z.enum(BODY_STYLES, { error: 'Choose a body style' }),
  make: text(60, 'Enter the make'),
  model: text(80, 'Enter the model'),
  notes: multilineText(2000).default(''),
  ...vehicleIdentityFields,
};

export const vehicleBody = z.strictObject({ customerId: z.int().positive(), ...vehicleFields });
export type VehicleBody = z.infer<typeof vehicleBody>;
export const vehicleUpdate = z.strictObject({ ...vehicleFields, ...lowerMileageConfirmation, version: z.int().min(1) });
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
  vin: string | null;
  plate: string | null;
  /** Miles on the odometer, and the local day it was read. */
  mileage: number | null;
  mileageReadOn: string | null;
  version: number;
}
