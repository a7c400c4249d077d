import { peukertDrawAh } from './batteries.ts';
import { loadWattHours } from './energy.ts';
import type { PlanParts } from './plan-parts.ts';
import type { DayKind, PlanInput, PlanTrip } from './plan-types.ts';
import { solarDailyWh } from './solar.ts';

// The day Busbar models, hour by hour (see evaluatePlan's notes):
// - each load's daily energy spread evenly over its active hours (all 24 by default), the
//   inverter's idle draw over the hours any AC load may run;
// - solar over 06:00–18:00 shaped as half a sine, peaking at noon;
// - driving from driveStartHour (09:00 by default) for driveHoursPerDay, part hours pro rata;
// - shore power from 18:00 on parked days, past midnight into the same day's early hours.
const SOLAR_START_HOUR = 6;
const SOLAR_HOURS = 12;
const DEFAULT_DRIVE_START_HOUR = 9;
const SHORE_START_HOUR = 18;
const ALL_HOURS = Array.from({ length: 24 }, (_, hour) => hour);

const solarShape = ALL_HOURS.map((hour) => {
  const t = hour + 0.5 - SOLAR_START_HOUR;
  return t > 0 && t < SOLAR_HOURS ? Math.sin((Math.PI * t) / SOLAR_HOURS) : 0;
});
const solarShapeSum = solarShape.reduce((a, b) => a + b, 0);

/** Ah per hour of the day (index 0–23) before the battery's charge efficiency. */
export interface HourlyFlows {
  loadAh: number[];
  /** Current while every load that may run in the hour runs at once, A: what Peukert's law is applied at. */
  runningA: number[];
  solarAh: number[];
  /** Share of each hour spent driving on a driving day. */
  driveShare: number[];
  shoreAh: number[];
}

/** The trip's days in order: the parked stretch first, then the driving days. */
export function tripDays(trip: PlanTrip): DayKind[] {
  return [...Array<DayKind>(trip.daysParked).fill('parked'), ...Array<DayKind>(trip.daysDriving).fill('driving')];
}

// Share of the hour [hour, hour + 1) inside the span [start, start + length).
const overlap = (hour: number, start: number, length: number) => (hour < start ? 0 : Math.min(1, Math.max(0, start + length - hour)));

/** The plan's loads and sources as Ah in each hour of a day. */
export function hourlyFlows(plan: PlanInput, parts: PlanParts): HourlyFlows {
  const loadAh = Array<number>(24).fill(0);
  const runningA = Array<number>(24).fill(0);
  const efficiency = plan.inverter?.efficiency ?? 1;
  const spread = (hours: number[], wattHours: number, runningW: number) => {
    for (const hour of hours) {
      loadAh[hour]! += wattHours / hours.length / plan.systemV;
      runningA[hour]! += runningW / plan.systemV;
    }
  };
  for (const load of plan.loads) spread(load.activeHours ?? ALL_HOURS, loadWattHours(load, efficiency), load.ac ? load.watts / efficiency : load.watts);
  if (parts.inverterOnHours.length > 0) spread(parts.inverterOnHours, parts.inverterIdleW * parts.inverterOnHours.length, parts.inverterIdleW);
  const solarAhPerDay = plan.solar ? (solarDailyWh(plan.solar) * parts.solarShare) / plan.systemV : 0;
  const driveStart = plan.trip.driveStartHour ?? DEFAULT_DRIVE_START_HOUR;
  const shoreHours = plan.shoreCharger?.hoursPerParkedDay ?? 0;
  const shoreA = plan.shoreCharger?.outputA ?? 0;
  return {
    loadAh,
    runningA,
    solarAh: solarShape.map((share) => (solarAhPerDay * share) / solarShapeSum),
    driveShare: ALL_HOURS.map((hour) => overlap(hour, driveStart, plan.trip.driveHoursPerDay)),
    shoreAh: ALL_HOURS.map((hour) => shoreA * overlap((hour - SHORE_START_HOUR + 24) % 24, 0, shoreHours)),
  };
}

/** How a battery takes and gives charge in the simulation. */
export interface BankPhysics {
  /** The bank's full point, Ah; Infinity to see the whole demand. */
  capacityAh: number;
  chargeEfficiency: number;
  /** Peukert's law at each hour's running current; absent: draws count as drawn. */
  peukert?: { capacityAh: number; ratedHours: number; exponent: number };
  /** Lead-acid: within kneeDeficitAh of full the bank takes at most acceptAhPerHour. */
  taper?: { kneeDeficitAh: number; acceptAhPerHour: number };
}

export interface Simulation extends BankPhysics {
  days: DayKind[];
  flows: HourlyFlows;
  /** DC-DC (or alternator) current while driving. */
  drivingChargeA: number;
  /** Ah below full at the start; 0 (full) when absent. */
  startDeficitAh?: number;
}

/** Runs the trip hour by hour, handing visit the Ah below full at the end of each hour (never below empty); visit answers true to stop. */
export function runTrip(sim: Simulation, visit: (deficitAh: number, index: number) => boolean | void): void {
  const { days, flows, capacityAh, chargeEfficiency, peukert, taper, drivingChargeA } = sim;
  const drawFactor = flows.runningA.map((currentA) => (peukert ? peukertDrawAh({ drawnAh: 1, currentA, ...peukert }) : 1));
  let deficitAh = sim.startDeficitAh ?? 0;
  let index = 0;
  for (const kind of days) {
    for (let hour = 0; hour < 24; hour++, index++) {
      const driveShare = kind === 'driving' ? flows.driveShare[hour]! : 0;
      const sourceAh = flows.solarAh[hour]! + (kind === 'parked' ? flows.shoreAh[hour]! : 0) + driveShare * drivingChargeA;
      const netAh = sourceAh * chargeEfficiency - flows.loadAh[hour]! * drawFactor[hour]!;
      // Charging runs at full rate down to the taper's knee, then at most at the taper's rate.
      const bulkAh = taper ? Math.max(0, deficitAh - taper.kneeDeficitAh) : Infinity;
      const gainAh = netAh <= bulkAh ? netAh : bulkAh + (1 - bulkAh / netAh) * Math.min(netAh, taper!.acceptAhPerHour);
      deficitAh = Math.min(capacityAh, Math.max(0, deficitAh - gainAh));
      if (visit(deficitAh, index)) return;
    }
  }
}

/** Ah below full at the end of each hour of the trip. */
export function simulateDeficitsAh(sim: Simulation): number[] {
  const deficits: number[] = [];
  runTrip(sim, (deficitAh) => void deficits.push(deficitAh));
  return deficits;
}

/** The deepest Ah below full over the trip and where it ends; stops early once past stopAboveAh. */
export function deepestDeficit(sim: Simulation, stopAboveAh = Infinity): { deepestAh: number; endAh: number } {
  let deepestAh = 0;
  let endAh = 0;
  runTrip(sim, (deficitAh) => {
    deepestAh = Math.max(deepestAh, deficitAh);
    endAh = deficitAh;
    return deepestAh > stopAboveAh;
  });
  return { deepestAh, endAh };
}

/** Ah below full at the end of one hour of the trip. */
export function deficitAtHour(sim: Simulation, index: number): number {
  let atAh = 0;
  runTrip(sim, (deficitAh, i) => {
    atAh = deficitAh;
    return i >= index;
  });
  return atAh;
}
