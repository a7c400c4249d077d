import { checkNumber } from './checks.ts';

/** PVWatts v5 default system losses as fractions (Dobos 2014, NREL/TP-6A20-62641). */
export const PVWATTS_V5_LOSSES = {
  soiling: 0.02,
  shading: 0.03,
  snow: 0,
  mismatch: 0.02,
  wiring: 0.02,
  connections: 0.005,
  lightInducedDegradation: 0.015,
  nameplateRating: 0.01,
  age: 0,
  availability: 0.03,
} as const;

/** Losses combined as 1 − Π(1 − Lᵢ) (PVWatts v5, Dobos 2014, NREL/TP-6A20-62641). */
export function combinedLossFraction(losses: readonly number[]): number {
  losses.forEach((loss, i) => checkNumber(`losses[${i}]`, loss, { min: 0, max: 1 }));
  return 1 - losses.reduce((kept, loss) => kept * (1 - loss), 1);
}

/** PVWatts v5 default system losses combined: 14.08 %. */
export const PVWATTS_V5_LOSS_FRACTION = combinedLossFraction(Object.values(PVWATTS_V5_LOSSES));

export interface SolarInput {
  arrayW: number;
  /** Hours at 1 kW/m² giving the day's energy, numerically the insolation in kWh/m²/day (PVEducation). */
  peakSunHours: number;
  lossFraction?: number;
}

/** Daily DC energy of an array, Wh = array W × peak sun hours × (1 − system losses), losses by default PVWatts v5 (NREL/TP-6A20-62641). */
export function solarDailyWh({ arrayW, peakSunHours, lossFraction = PVWATTS_V5_LOSS_FRACTION }: SolarInput): number {
  checkNumber('arrayW', arrayW, { min: 0 });
  checkNumber('peakSunHours', peakSunHours, { min: 0, max: 24 });
  checkNumber('lossFraction', lossFraction, { min: 0, max: 1 });
  return arrayW * peakSunHours * (1 - lossFraction);
}

export type SolarController = 'mppt' | 'pwm';

/**
 * Share of the array's energy a charge controller passes to the battery (common practice, no
 * source): an MPPT converter loses a few percent; a PWM controller holds the panel at battery
 * voltage, well below its maximum-power voltage.
 */
export const CONTROLLER_HARVEST: Record<SolarController, number> = { mppt: 0.95, pwm: 0.75 };
