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
  /** A LiFePO4 bank that warms its cells before charging in the cold. */
  selfHeating?: boolean;
}

/** The two batteries a circuit can start or end at. */
export type BatteryName = 'house' | 'starter';

/** What a circuit feeds, when its current follows from the plan instead of being typed. */
export type CircuitLink = 'inverter-feed' | 'dcdc-input' | 'dcdc-output';

export interface PlanCircuit {
  from: string;
  to: string;
  oneWayLengthM: number;
  /** Typed current, A; ignored (and may be absent) when the circuit is linked to a part of the plan. */
  currentA?: number;
  /** The part of the plan the circuit feeds; its current is computed from the plan. */
  link?: CircuitLink;
  /** Main feeders, electronics and charging: 3 % drop allowed; other circuits 10 %. */
  critical: boolean;
  insulationC: InsulationRatingC;
  engineSpace?: boolean;
  bundledConductors?: number;
  /** Run in a sheath (loom, conduit) along its length: protection may sit up to 1,016 mm from a battery. */
  sheathed?: boolean;
  /** The battery the circuit starts at, whose terminal it must be protected next to. */
  fromBattery?: BatteryName;
  /** The battery the circuit ends at (a link between batteries): protected at that end too. */
  toBattery?: BatteryName;
  /** Distance of the fuse or breaker from the battery at the start, mm; absent when there is none. */
  fuseFromBatteryMm?: number;
  /** Distance of the fuse or breaker from the battery at the end, mm; absent when there is none. */
  fuseToBatteryMm?: number;
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
  /** Coldest air temperature of the trip, °C; DEFAULT_LOWEST_C when absent. */
  lowestC?: number;
  /** Warmest air temperature of the trip, °C; DEFAULT_HIGHEST_C when absent. */
  highestC?: number;
}

/** Sizes a shop can buy, from its catalog; each list in any order. */
export interface PlanStock {
  bankAh?: Partial<Record<Chemistry, number[]>>;
  chargerA?: number[];
}

export interface PlanInput {
  systemV: 12 | 24;
  /** Gauge Busbar chooses conductors in. */
  gauge: Gauge;
  /** Temperature every conductor's resistance is taken at, °C; 75 when absent. */
  conductorTemperatureC?: number;
  /** Tinned copper conductors (marine cable): slightly higher resistance. */
  tinnedCopper?: boolean;
  loads: PlanLoad[];
  /** cutoffV: the inverter's low-voltage shutdown (10.5 V / 21 V when absent); idleW: its draw with no load (a share of the rating when absent). */
  inverter?: { ratedW: number; efficiency: number; cutoffV?: number; idleW?: number };
  /** The house bank planned; absent when none is planned (yet). */
  bank?: PlanBank;
  /** rechargeA: what the alternator puts back into the starter battery while driving (20 A when absent). */
  starterBattery: { capacityAh: number; rechargeA?: number };
  /** The vehicle's alternator: its rating and the vehicle's own load while driving (30 A when absent). */
  alternator?: { ratedA: number; vehicleLoadA?: number };
  /** efficiency: 0.9 when absent; minInputV: the lowest starter-side voltage it runs at (11.5 V / 23 V when absent). */
  dcdcCharger?: { outputA: number; efficiency?: number; minInputV?: number };
  /** panelVmp: the panels' maximum-power voltage, for a PWM controller (18 V / 36 V when absent). */
  solar?: { arrayW: number; peakSunHours: number; controller: SolarController; lossFraction?: number; panelVmp?: number };
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
  /** planned: the plan's house bank; starter: no house bank is needed or planned; recommended: the bank Busbar recommends. */
  source: 'planned' | 'starter' | 'recommended';
  chemistry: Chemistry;
  ratedAh: number;
  /** What the bank holds at the trip's lowest temperature (lead-acid loses capacity in the cold). */
  effectiveCapacityAh: number;
  usableAh: number;
  /** Lowest state of charge the plan allows, % of the effective capacity. */
  floorPercent: number;
}

/** A size to buy: the minimum the plan needs, rounded up to one the shop can buy, and the rule that rounded it. */
export interface SizedChoice {
  minimum: number;
  size: number;
  rule: 'catalog' | 'common-steps';
}

export interface BankRecommendation extends SizedChoice {
  chemistry: Chemistry;
  /** A LiFePO4 bank for a trip below freezing must warm itself before charging. */
  selfHeating: boolean;
}

export interface Verdict {
  kind: 'no-second-battery' | 'bank-needed' | 'bank-too-small' | 'bank-ok';
  headline: string;
  reasons: string[];
}

export type FindingCode =
  | 'bank-runs-low'
  | 'starter-not-refilled'
  | 'cold-charging'
  | 'charger-undersized'
  | 'charger-above-bank-rate'
  | 'no-charger'
  | 'alternator-overloaded'
  | 'inverter-undersized'
  | 'inverter-feed-missing'
  | 'source-not-protected'
  | 'pwm-panel-mismatch'
  | 'no-conductor-fits'
  | 'conductor-over-ampacity'
  | 'conductor-below-minimum'
  | 'circuit-over-drop'
  | 'no-fuse-fits'
  | 'fuse-does-not-protect-wire'
  | 'fuse-above-wire-rating'
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
  /** The typed current, or the one computed for a linked circuit. */
  currentA: number;
  link: CircuitLink | null;
  maxDropPercent: number;
  /** Busbar's choice: the smallest size meeting drop and amperage whose amperage also covers its fuse; null when none does. */
  recommended: ConductorChoice | null;
  /** The fitted size when given, else Busbar's choice; null when neither exists. */
  conductor: CheckedConductor | null;
  /** 150 % of the conductor's amperage (33 CFR 183.455): the hard ceiling for a fitted fuse. */
  maxFuseA: number | null;
  /** Smallest standard fuse ≥ 125 % of the load and ≤ the conductor's amperage. */
  recommendedFuseA: number | null;
  /** The fitted fuse when given, else Busbar's choice. */
  fuseA: number | null;
}

/** Where a circuit leaves a battery and must be protected (33 CFR 183.455(a)–(b)). */
export interface ProtectionPoint {
  circuit: number;
  from: string;
  to: string;
  battery: BatteryName;
  end: 'from' | 'to';
  /** 178 mm (7 in), or 1,016 mm (40 in) for a sheathed conductor. */
  maxDistanceMm: number;
  /** Distance drawn, mm; null when no protection is drawn at that end. */
  distanceMm: number | null;
  fuseA: number | null;
  ok: boolean;
}

export interface PlanResult {
  dailyWattHours: number;
  dailyAmpHours: number;
  averageLoadA: number;
  /** The inverter's idle draw counted in the daily energy, Wh. */
  inverterIdleWh: number;
  /** Solar energy a day reaching the battery through the charge controller at the trip's warmest, Wh. */
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
  /** Driving hours with the planned DC-DC charger from the trip's lowest point back to full (lead-acid tapering above 80 %); null without a charger or when it cannot gain on the loads. */
  driveHoursToRefill: number | null;
  /** Deepest draw on the starter battery alone once trips in a row settle, Ah (what the verdict weighs). */
  starterDrawAh: number;
  recommendedBank: BankRecommendation;
  /** null for a starter battery or a trip without driving. */
  recommendedCharger: SizedChoice | null;
  /** DC current of the inverter at full rating at its cutoff voltage. */
  inverterInputA: number | null;
  /** Current the DC-DC charger takes from the starter side at its lowest input voltage. */
  dcdcInputA: number | null;
  /** Charger input plus the vehicle's own load, against the alternator's rating. */
  alternatorLoadA: number | null;
  verdict: Verdict;
  circuits: CircuitResult[];
  protectionPoints: ProtectionPoint[];
  findings: Finding[];
  caution: string;
}
