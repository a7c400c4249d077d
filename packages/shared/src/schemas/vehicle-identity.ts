import { vinProblem, type VinProblem } from '@busbar/calc';
import { z } from 'zod';

/** The highest odometer reading taken, in miles: past what any working truck reaches, short of a typo's extra digit. */
export const MAX_MILEAGE = 2_000_000;

const VIN_WORDS: Record<VinProblem, string> = {
  length: 'A VIN has 17 characters',
  characters: 'A VIN has only digits and letters, never I, O or Q',
  check_digit: 'This VIN does not add up: check each character against the vehicle (the 9th is a check digit)',
};

/** Empty text as null: the field was left blank. */
const blankAsNull = (text: string) => (text === '' ? null : text);

/**
 * The VIN in capitals without spaces; a wrong check digit is refused, since the network's
 * vehicles are North American, where every VIN since 1981 carries one (49 CFR 565.15(c)).
 */
export const vinSchema = z
  .string()
  .transform((text) => text.replace(/[\s-]+/g, '').toUpperCase())
  .transform(blankAsNull)
  .superRefine((vin, ctx) => {
    const problem = vin === null ? null : vinProblem(vin);
    if (problem) ctx.addIssue({ code: 'custom', message: VIN_WORDS[problem] });
  })
  .nullable();

/** A licence plate as printed on it: capitals, single spaces, no control characters. */
export const plateSchema = z
  .string()
  .transform((text) => text.trim().replace(/\s+/g, ' ').toUpperCase())
  .pipe(z.string().max(12, 'A plate has at most 12 characters').regex(/^[^\p{C}]*$/u, 'Use letters, digits and the marks on the plate only'))
  .transform(blankAsNull)
  .nullable();

export const mileageSchema = z
  .int('Enter the miles as a whole number')
  .min(0, 'Miles cannot be below 0')
  .max(MAX_MILEAGE, `At most ${MAX_MILEAGE.toLocaleString('en-US')} miles`)
  .nullable();

/** VIN, plate and odometer of a vehicle; each may be left out (kept as it is on a change) or null (not known). */
export const vehicleIdentityFields = {
  vin: vinSchema.optional(),
  plate: plateSchema.optional(),
  mileage: mileageSchema.optional(),
};

/** A change that lowers the miles on file must say so: an odometer rarely goes back, a typo often does. */
export const lowerMileageConfirmation = { confirmLowerMileage: z.literal(true).optional() };
