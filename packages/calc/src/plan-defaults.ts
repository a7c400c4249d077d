import type { CircuitLink } from './plan-types.ts';

// What the planner assumes when an input is left out. Each leans to the safe side of its range.

/** Parts of a plan a circuit can be linked to, its current then computed from the plan. */
export const CIRCUIT_LINKS: readonly CircuitLink[] = ['inverter-feed', 'dcdc-input', 'dcdc-output'];

/** Current the alternator puts back into the starter battery while driving, A: the low end of 20–30 A (common practice, no source). */
export const DEFAULT_STARTER_RECHARGE_A = 20;
/** The vehicle's own load while driving (engine management, lights, blower), A (common practice, no source). */
export const DEFAULT_VEHICLE_LOAD_A = 30;
/** Share of an alternator's rating it can deliver steadily when hot and at idle (common practice, no source). */
export const ALTERNATOR_STEADY_SHARE = 0.8;
/** Inverter low-voltage shutdown per 12 V of system voltage (10.5 V; 21 V at 24 V; from memory). */
export const DEFAULT_INVERTER_CUTOFF_V_PER_12 = 10.5;
/** An inverter's idle draw as a share of its rating (common practice, no source). */
export const DEFAULT_INVERTER_IDLE_SHARE = 0.015;
/** DC-DC charger efficiency (common practice, no source). */
export const DEFAULT_DCDC_EFFICIENCY = 0.9;
/** Lowest starter-side voltage a DC-DC charger runs at, per 12 V of system voltage (common practice, no source). */
export const DEFAULT_DCDC_MIN_INPUT_V_PER_12 = 11.5;
/** Maximum-power voltage of a panel made for 12 V charging (36 cells), per 12 V of system voltage (from memory). */
export const DEFAULT_PANEL_VMP_PER_12 = 18;
/** Temperature conductors are computed at, °C: NEC Chapter 9 Table 8's own. */
export const DEFAULT_CONDUCTOR_TEMPERATURE_C = 75;
/** Trip temperatures when none are given, °C: a mild trip (common practice, no source). */
export const DEFAULT_LOWEST_C = 10;
export const DEFAULT_HIGHEST_C = 25;
