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

/** Share of the array's energy an MPPT converter passes to the battery (common practice, no source). */
export const MPPT_HARVEST = 0.95;

export interface HarvestInput {
  controller: SolarController;
  /** The panels' maximum-power voltage, V. */
  panelVmp: number;
  /** The battery's voltage while it charges, V. */
  batteryV: number;
}

/**
 * Share of the array's energy the controller passes to the battery. A PWM controller connects the
 * panel straight to the battery, so the panel works at battery voltage with about its maximum-power
 * current: it delivers P × V_battery / V_mp (power balance). An MPPT converter delivers MPPT_HARVEST.
 */
export function controllerHarvest({ controller, panelVmp, batteryV }: HarvestInput): number {
  checkNumber('panelVmp', panelVmp, { above: 0 });
  checkNumber('batteryV', batteryV, { above: 0 });
  return controller === 'mppt' ? MPPT_HARVEST : Math.min(1, batteryV / panelVmp);
}

/** PVWatts v5's temperature coefficient of power for a standard module, per °C (from memory). */
export const MODULE_POWER_COEFFICIENT_PER_C = -0.0047;
/** How far a module in full sun runs above the air, °C (from memory: about 25 °C at 800 W/m²). */
export const MODULE_RISE_C = 25;

/** Share of rated power a module gives at an air temperature: 1 + γ × (T_module − 25 °C), the module taken MODULE_RISE_C above the air; never above 1, so a cold day is not credited. */
export function moduleTemperatureFactor(airC: number): number {
  checkNumber('airC', airC, { min: -60, max: 80 });
  return Math.min(1, 1 + MODULE_POWER_COEFFICIENT_PER_C * (airC + MODULE_RISE_C - 25));
}
