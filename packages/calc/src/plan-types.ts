import type { InsulationRatingC } from './ampacity.ts';
import type { Chemistry } from './batteries.ts';
import type { Load } from './energy.ts';
import type { ConductorChoice } from './select-conductor.ts';
import type { ConductorSize, Gauge } from './sizes.ts';
import type { SolarController } from './solar.ts';

/** A load with the hours of the day (0–23) it may run in; its daily energy is spread evenly over them, over all 24 when absent. */
export interface PlanLoad extends Load {
  activeHours?: number[];
}

export interface PlanBank {
  chemistry: Chemistry;
  capacityAh: number;
  depthOfDischarge?: number;
  peukertExponent?: number;
  ratedHours?: number;
}

export interface PlanCircuit {
  from: string;
  to: string;
  oneWayLengthM: number;
  currentA: number;
  /** Main feeders, electronics and charging: 3 % drop allowed; other circuits 10 %. */
  critical: boolean;
  insulationC: InsulationRatingC;
  engineSpace?: boolean;
  bundledConductors?: number;
  /** The conductor fitted or drawn; Busbar checks it. Absent: Busbar's choice is used. */
  size?: ConductorSize;
  /** The fuse fitted or drawn, A; Busbar checks it. Absent: Busbar's choice is used. */
  fuseA?: number;
}

/** A typical trip, repeated: the parked days as one stretch, then the driving days. */
export interface PlanTrip {
  daysParked: number;
  daysDriving: number;
  driveHoursPerDay: number;
  /** Hour of the day driving starts (0–23); 9 when absent. */
  driveStartHour?: number;
}

export interface PlanInput {
  systemV: 12 | 24;
  /** Gauge Busbar chooses conductors in. */
  gauge: Gauge;
  loads: PlanLoad[];
  inverter?: { ratedW: number; efficiency: number };
  /** The house bank planned; absent when none is planned (yet). */
  bank?: PlanBank;
  starterBattery: { capacityAh: number };
  dcdcCharger?: { outputA: number };
  solar?: { arrayW: number; peakSunHours: number; controller: SolarController; lossFraction?: number };
  /** Plugged in from 18:00 on parked days. */
  shoreCharger?: { outputA: number; hoursPerParkedDay: number };
  trip: PlanTrip;
  circuits: PlanCircuit[];
}

export type DayKind = 'parked' | 'driving';

export interface HourState {
  /** 1 for the first day of the trip. */
  day: number;
  /** 0–23; the state at the end of that hour. */
  hour: number;
  kind: DayKind;
  storedAh: number;
  stateOfChargePercent: number;
}

/** The battery the hour-by-hour states are for. */
export interface SimulatedBank {
  /** planned: the plan's house bank; starter: no house bank is needed or planned; recommended: the minimum bank Busbar recommends. */
  source: 'planned' | 'starter' | 'recommended';
  chemistry: Chemistry;
  ratedAh: number;
  effectiveCapacityAh: number;
  usableAh: number;
  /** Lowest state of charge the plan allows, % of the effective capacity. */
  floorPercent: number;
}

export interface Verdict {
  kind: 'no-second-battery' | 'bank-needed' | 'bank-too-small' | 'bank-ok';
  headline: string;
  reasons: string[];
}

export type FindingCode =
  | 'bank-runs-low'
  | 'charger-undersized'
  | 'charger-above-bank-rate'
  | 'no-charger'
  | 'inverter-undersized'
  | 'no-conductor-fits'
  | 'conductor-over-ampacity'
  | 'circuit-over-drop'
  | 'no-fuse-fits'
  | 'fuse-does-not-protect-wire'
  | 'fuse-below-load';

export interface Finding {
  severity: 'critical' | 'warning';
  code: FindingCode;
  message: string;
  /** Index into the plan's circuits, for circuit findings. */
  circuit?: number;
}

export interface CheckedConductor {
  size: ConductorSize;
  dropV: number;
  dropPercent: number;
  ampacityA: number;
}

export interface CircuitResult {
  from: string;
  to: string;
  currentA: number;
  maxDropPercent: number;
  /** Busbar's choice: the smallest size meeting drop and amperage; null when none does. */
  recommended: ConductorChoice | null;
  /** The fitted size when given, else Busbar's choice; null when neither exists. */
  conductor: CheckedConductor | null;
  /** 150 % of the conductor's amperage (33 CFR 183.455). */
  maxFuseA: number | null;
  recommendedFuseA: number | null;
  /** The fitted fuse when given, else Busbar's choice. */
  fuseA: number | null;
}

export interface PlanResult {
  dailyWattHours: number;
  dailyAmpHours: number;
  averageLoadA: number;
  /** Solar energy a day reaching the battery through the charge controller, Wh. */
  solarDailyWh: number;
  /** Ah stored less Ah used on one day with the planned sources (DC-DC charger while driving), before the bank's full point limits it. */
  netDailyAh: { parked: number; driving: number };
  bank: SimulatedBank;
  hourly: HourState[];
  lowestStateOfChargePercent: number;
  /** Usable Ah over daily Ah with no charging; null when there are no loads. */
  daysOfAutonomy: number | null;
  /** The same with the parked-day charging (solar, shore); null when it covers the loads. */
  daysOfAutonomyWithCharging: number | null;
  /** Driving hours with the planned DC-DC charger from the trip's lowest point back to full; null without a charger or when it cannot gain on the loads. */
  driveHoursToRefill: number | null;
  recommendedBankAh: number;
  recommendedBankChemistry: Chemistry;
  recommendedChargerA: number | null;
  inverterInputA: number | null;
  verdict: Verdict;
  circuits: CircuitResult[];
  findings: Finding[];
  caution: string;
}
