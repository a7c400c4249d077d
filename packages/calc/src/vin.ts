/** Letters stand for digits in the check-digit sum; I, O and Q never appear (49 CFR 565.15(c); ISO 3779). */
const TRANSLITERATION: Record<string, number> = {
  A: 1, B: 2, C: 3, D: 4, E: 5, F: 6, G: 7, H: 8, J: 1, K: 2, L: 3, M: 4, N: 5,
  P: 7, R: 9, S: 2, T: 3, U: 4, V: 5, W: 6, X: 7, Y: 8, Z: 9,
};

/** The weight of each position; the check digit's own (9th) weighs nothing (49 CFR 565.15(c)). */
const WEIGHTS = [8, 7, 6, 5, 4, 3, 2, 10, 0, 9, 8, 7, 6, 5, 4, 3, 2] as const;

export const VIN_PATTERN = /^[A-HJ-NPR-Z0-9]{17}$/;

export type VinProblem = 'length' | 'characters' | 'check_digit';

/** The check digit (position 9) a 17-character VIN should carry: the weighted sum mod 11, 10 as X (49 CFR 565.15(c)). */
export function vinCheckDigit(vin: string): string {
  if (!VIN_PATTERN.test(vin)) throw new RangeError('vin must be 17 characters of 0-9 and A-Z without I, O, Q');
  let sum = 0;
  for (let i = 0; i < 17; i++) {
    const c = vin[i]!;
    sum += (c >= '0' && c <= '9' ? Number(c) : TRANSLITERATION[c]!) * WEIGHTS[i]!;
  }
  const remainder = sum % 11;
  return remainder === 10 ? 'X' : String(remainder);
}

/** What is wrong with a VIN (already in capitals), or null: 17 characters, none of I, O, Q, and the right check digit. */
export function vinProblem(vin: string): VinProblem | null {
  if (vin.length !== 17) return 'length';
  if (!VIN_PATTERN.test(vin)) return 'characters';
  return vinCheckDigit(vin) === vin[8] ? null : 'check_digit';
}
