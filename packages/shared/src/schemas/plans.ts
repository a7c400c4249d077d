import { AWG_SIZES, CIRCUIT_LINKS, INSULATION_RATINGS_C, MM2_SIZES, type PlanInput, type PlanResult } from '@busbar/calc';
import { z } from 'zod';
import { multilineText, text } from './common.ts';

interface Bounds {
  min?: number;
  /** Exclusive lower bound: zero is no answer for a battery's capacity or a run's length. */
  above?: number;
  max: number;
  integer?: boolean;
}

/** A finite number within bounds that rule out typing slips, each message naming the quantity. */
function quantity(what: string, unit: string, { min, above, max, integer }: Bounds) {
  const withUnit = (n: number) => `${n.toLocaleString('en-US')}${unit ? ` ${unit}` : ''}`;
  let schema = z.number({ error: `${what} must be a number` });
  if (integer) schema = schema.int(`${what} must be a whole number`);
  if (above !== undefined) schema = schema.gt(above, `${what} must be more than ${withUnit(above)}`);
  if (min !== undefined) schema = schema.min(min, `${what} must be at least ${withUnit(min)}`);
  return schema.max(max, `${what} must be at most ${withUnit(max)}`);
}

const label = (what: string) => text(80, `Enter the ${what}`);
const hourOfDay = quantity('Hour', '', { min: 0, max: 23, integer: true });

const conductorSize = z.union(
  [
    z.strictObject({ awg: z.enum(AWG_SIZES) }),
    z.strictObject({ mm2: z.literal(MM2_SIZES) }),
  ],
  { error: `Choose an AWG size from ${AWG_SIZES[0]} to ${AWG_SIZES.at(-1)} or a metric size from ${MM2_SIZES[0]} to ${MM2_SIZES.at(-1)} mm²` },
);

const load = z.strictObject({
  name: label('name of the load'),
  watts: quantity('Power', 'W', { above: 0, max: 10_000 }),
  hoursPerDay: quantity('Hours a day', 'h', { min: 0, max: 24 }),
  dutyCycle: quantity('Duty cycle', '', { above: 0, max: 1 }).optional(),
  ac: z.boolean({ error: 'Say whether the load runs on AC' }).optional(),
  activeHours: z
    .array(hourOfDay, { error: 'List the hours the load may run in' })
    .min(1, 'Choose at least one hour')
    .max(24, 'A day has 24 hours')
    .refine((hours) => new Set(hours).size === hours.length, 'Each hour can be listed only once')
    .optional(),
});

const battery = z.enum(['house', 'starter'], { error: 'Choose the house or the starter battery' });
const fuseDistance = quantity('Distance of the fuse from the battery', 'mm', { min: 0, max: 5000 });

const circuit = z
  .strictObject({
    from: label('start of the circuit'),
    to: label('end of the circuit'),
    oneWayLengthM: quantity('Length', 'm', { above: 0, max: 100 }),
    currentA: quantity('Current', 'A', { above: 0, max: 1000 }).optional(),
    link: z.enum(CIRCUIT_LINKS, { error: 'Choose what the circuit feeds' }).optional(),
    critical: z.boolean({ error: 'Say whether the circuit is critical' }),
    insulationC: z.literal(INSULATION_RATINGS_C, { error: `Choose an insulation rating: ${INSULATION_RATINGS_C.join(', ')} °C` }),
    engineSpace: z.boolean({ error: 'Say whether the circuit runs in the engine space' }).optional(),
    bundledConductors: quantity('Conductors in the bundle', '', { min: 1, max: 100, integer: true }).optional(),
    sheathed: z.boolean({ error: 'Say whether the conductor is sheathed' }).optional(),
    fromBattery: battery.optional(),
    toBattery: battery.optional(),
    fuseFromBatteryMm: fuseDistance.optional(),
    fuseToBatteryMm: fuseDistance.optional(),
    size: conductorSize.optional(),
    fuseA: quantity('Fuse', 'A', { above: 0, max: 1000 }).optional(),
  })
  .refine((c) => c.link !== undefined || c.currentA !== undefined, { message: 'Enter the current', path: ['currentA'] });

/** The inputs of a power plan as `evaluatePlan` (packages/calc) takes them; the form and the API check with it. */
export const planInputSchema = z.strictObject({
  systemV: z.literal([12, 24], { error: 'Choose a 12 V or a 24 V system' }),
  gauge: z.enum(['awg', 'mm2'], { error: 'Choose AWG or mm² for the conductors' }),
  conductorTemperatureC: quantity('Conductor temperature', '°C', { min: 20, max: 105 }).optional(),
  tinnedCopper: z.boolean({ error: 'Say whether the conductors are tinned' }).optional(),
  loads: z.array(load, { error: 'List the loads' }).max(60, 'At most 60 loads'),
  inverter: z
    .strictObject({
      ratedW: quantity('Inverter rating', 'W', { above: 0, max: 10_000 }),
      efficiency: quantity('Inverter efficiency', '', { min: 0.5, max: 1 }),
      cutoffV: quantity('Inverter cutoff', 'V', { min: 8, max: 30 }).optional(),
      idleW: quantity('Inverter idle draw', 'W', { min: 0, max: 200 }).optional(),
    })
    .optional(),
  bank: z
    .strictObject({
      chemistry: z.enum(['lifepo4', 'agm', 'flooded'], { error: 'Choose LiFePO4, AGM or flooded' }),
      capacityAh: quantity('Capacity', 'Ah', { above: 0, max: 5000 }),
      depthOfDischarge: quantity('Depth of discharge', '', { above: 0, max: 1 }).optional(),
      peukertExponent: quantity('Peukert exponent', '', { min: 1, max: 2 }).optional(),
      ratedHours: quantity('Rated hours', 'h', { above: 0, max: 100 }).optional(),
      selfHeating: z.boolean({ error: 'Say whether the bank heats itself' }).optional(),
    })
    .optional(),
  starterBattery: z.strictObject({
    capacityAh: quantity('Starter battery capacity', 'Ah', { above: 0, max: 5000 }),
    rechargeA: quantity('Alternator charge into the starter battery', 'A', { above: 0, max: 500 }).optional(),
  }),
  alternator: z
    .strictObject({
      ratedA: quantity('Alternator rating', 'A', { above: 0, max: 1000 }),
      vehicleLoadA: quantity("Vehicle's own load", 'A', { min: 0, max: 1000 }).optional(),
    })
    .optional(),
  dcdcCharger: z
    .strictObject({
      outputA: quantity('Charger output', 'A', { above: 0, max: 1000 }),
      efficiency: quantity('Charger efficiency', '', { min: 0.5, max: 1 }).optional(),
      minInputV: quantity('Lowest input voltage', 'V', { min: 8, max: 30 }).optional(),
    })
    .optional(),
  solar: z
    .strictObject({
      arrayW: quantity('Array power', 'W', { above: 0, max: 10_000 }),
      peakSunHours: quantity('Peak sun hours', 'h', { min: 0, max: 12 }),
      controller: z.enum(['mppt', 'pwm'], { error: 'Choose an MPPT or a PWM controller' }),
      lossFraction: quantity('System losses', '', { min: 0, max: 0.9 }).optional(),
      panelVmp: quantity('Panel maximum-power voltage', 'V', { min: 10, max: 100 }).optional(),
    })
    .optional(),
  shoreCharger: z
    .strictObject({
      outputA: quantity('Shore charger output', 'A', { above: 0, max: 1000 }),
      hoursPerParkedDay: quantity('Hours plugged in', 'h', { min: 0, max: 24 }),
    })
    .optional(),
  trip: z.strictObject({
    daysParked: quantity('Days parked', '', { min: 0, max: 60, integer: true }),
    daysDriving: quantity('Days driving', '', { min: 0, max: 60, integer: true }),
    driveHoursPerDay: quantity('Drive hours a day', 'h', { min: 0, max: 24 }),
    driveStartHour: hourOfDay.optional(),
    lowestC: quantity('Lowest temperature', '°C', { min: -50, max: 60 }).optional(),
    highestC: quantity('Highest temperature', '°C', { min: -50, max: 60 }).optional(),
  }),
  circuits: z.array(circuit, { error: 'List the circuits' }).max(40, 'At most 40 circuits'),
});

const planName = text(120, 'Name the plan');

/** Saves a build's plan: version 0 creates it; a delivered build also needs the reason. */
export const planSaveBody = z.strictObject({
  version: z.int().min(0),
  input: planInputSchema,
  correctionNote: multilineText(1000, 'Enter the reason for the correction').optional(),
});
export type PlanSaveBody = z.infer<typeof planSaveBody>;

/** A plan made in a consultation, before there is a build. */
export const quickPlanCreate = z.strictObject({
  locationId: z.int().positive({ error: 'Choose a location' }),
  name: planName,
  input: planInputSchema,
});
export type QuickPlanCreate = z.infer<typeof quickPlanCreate>;

export const quickPlanUpdate = z.strictObject({ version: z.int().min(1), name: planName, input: planInputSchema });
export type QuickPlanUpdate = z.infer<typeof quickPlanUpdate>;

export const planAttachBody = z.strictObject({ buildId: z.int().positive({ error: 'Choose a build' }), version: z.int().min(1) });
export type PlanAttachBody = z.infer<typeof planAttachBody>;

/** A plan as stored: the inputs and the server's evaluation of them (which carries the safety caution). */
export interface PlanView {
  id: number;
  buildId: number | null;
  locationId: number;
  name: string;
  input: PlanInput;
  result: PlanResult;
  version: number;
  updatedAt: string;
  updatedByName: string | null;
}

/** One saved version of a plan. */
export interface PlanRevisionView {
  version: number;
  savedAt: string;
  savedByName: string;
  note: string;
}
