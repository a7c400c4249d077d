import { checkNumber } from './checks.ts';
import { checkConductorSize, type Awg, type ConductorSize, type Mm2 } from './sizes.ts';
import { feetToMeters } from './units.ts';

// NEC Chapter 9 Table 8, uncoated stranded copper at 75 °C, Ω per 1,000 ft. The stranded column:
// for 14–8 AWG it differs from the solid one (3.07 / 1.93 / 1.21 / 0.764).
const TABLE_8_OHMS_PER_KFT: Record<Awg, number> = {
  '18': 7.95,
  '16': 4.99,
  '14': 3.14,
  '12': 1.98,
  '10': 1.24,
  '8': 0.778,
  '6': 0.491,
  '4': 0.308,
  '3': 0.245,
  '2': 0.194,
  '1': 0.154,
  '1/0': 0.122,
  '2/0': 0.0967,
  '3/0': 0.0766,
  '4/0': 0.0608,
};

// IEC 60228 Table 3, class 5 (flexible) plain copper, maximum resistance at 20 °C, Ω per km.
const CLASS_5_OHMS_PER_KM: Record<Mm2, number> = {
  1.5: 13.3,
  2.5: 7.98,
  4: 4.95,
  6: 3.3,
  10: 1.91,
  16: 1.21,
  25: 0.78,
  35: 0.554,
  50: 0.386,
  70: 0.272,
  95: 0.206,
};

const METRES_PER_KFT = feetToMeters(1000);

/** DC resistance in Ω/m: NEC Chapter 9 Table 8 (stranded copper, 75 °C) for AWG; IEC 60228 Table 3 class 5 (copper, 20 °C) for mm². */
export function conductorResistanceOhmsPerM(size: ConductorSize): number {
  checkConductorSize('size', size);
  return 'awg' in size ? TABLE_8_OHMS_PER_KFT[size.awg] / METRES_PER_KFT : CLASS_5_OHMS_PER_KM[size.mm2] / 1000;
}

export interface VoltageDropInput {
  currentA: number;
  oneWayLengthM: number;
  size: ConductorSize;
  systemV: number;
}

export interface VoltageDrop {
  dropV: number;
  dropPercent: number;
}

/** Drop over the round trip (2 × one-way length) from the table resistance above; about 20 % more than the K = 10.75 Ω·cmil/ft method gives. */
export function voltageDrop({ currentA, oneWayLengthM, size, systemV }: VoltageDropInput): VoltageDrop {
  checkNumber('currentA', currentA, { min: 0 });
  checkNumber('oneWayLengthM', oneWayLengthM, { min: 0 });
  checkNumber('systemV', systemV, { above: 0 });
  const dropV = currentA * 2 * oneWayLengthM * conductorResistanceOhmsPerM(size);
  return { dropV, dropPercent: (100 * dropV) / systemV };
}
