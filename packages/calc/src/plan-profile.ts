import { loadWattHours } from './energy.ts';
import type { DayKind, PlanInput, PlanTrip } from './plan-types.ts';
import { CONTROLLER_HARVEST, solarDailyWh } from './solar.ts';

// The day Busbar models, hour by hour (see evaluatePlan's notes):
// - each load's daily energy spread evenly over its active hours (all 24 by default);
// - solar over 06:00–18:00 shaped as half a sine, peaking at noon;
// - driving from driveStartHour (09:00 by default) for driveHoursPerDay, part hours pro rata;
// - shore power from 18:00 on parked days, past midnight into the same day's early hours.
const SOLAR_START_HOUR = 6;
const SOLAR_HOURS = 12;
const DEFAULT_DRIVE_START_HOUR = 9;
const SHORE_START_HOUR = 18;

const solarShape = Array.from({ length: 24 }, (_, hour) => {
  const t = hour + 0.5 - SOLAR_START_HOUR;
  return t > 0 && t < SOLAR_HOURS ? Math.sin((Math.PI * t) / SOLAR_HOURS) : 0;
});
const solarShapeSum = solarShape.reduce((a, b) => a + b, 0);

/** Ah per hour of the day (index 0–23) before the battery's charge efficiency. */
export interface HourlyFlows {
  loadAh: number[];
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
export function hourlyFlows(plan: PlanInput): HourlyFlows {
  const loadAh = Array<number>(24).fill(0);
  for (const load of plan.loads) {
    const hours = load.activeHours ?? Array.from({ length: 24 }, (_, hour) => hour);
    const perHourAh = loadWattHours(load, plan.inverter?.efficiency ?? 1) / hours.length / plan.systemV;
    for (const hour of hours) loadAh[hour]! += perHourAh;
  }
  const solarAhPerDay = plan.solar ? (solarDailyWh(plan.solar) * CONTROLLER_HARVEST[plan.solar.controller]) / plan.systemV : 0;
  const driveStart = plan.trip.driveStartHour ?? DEFAULT_DRIVE_START_HOUR;
  const shoreHours = plan.shoreCharger?.hoursPerParkedDay ?? 0;
  const shoreA = plan.shoreCharger?.outputA ?? 0;
  return {
    loadAh,
    solarAh: solarShape.map((share) => (solarAhPerDay * share) / solarShapeSum),
    driveShare: loadAh.map((_, hour) => overlap(hour, driveStart, plan.trip.driveHoursPerDay)),
    shoreAh: loadAh.map((_, hour) => shoreA * overlap((hour - SHORE_START_HOUR + 24) % 24, 0, shoreHours)),
  };
}

export interface Simulation {
  days: DayKind[];
  flows: HourlyFlows;
  /** The bank's full point, Ah; Infinity to see the whole demand. */
  capacityAh: number;
  /** DC-DC (or alternator) current while driving; Infinity refills within the hour. */
  drivingChargeA: number;
  chargeEfficiency: number;
}

/** Ah below full at the end of each hour of the trip, starting full; never below empty. */
export function simulateDeficitsAh({ days, flows, capacityAh, drivingChargeA, chargeEfficiency }: Simulation): number[] {
  const deficits: number[] = [];
  let deficitAh = 0;
  for (const kind of days) {
    for (let hour = 0; hour < 24; hour++) {
      const driveShare = kind === 'driving' ? flows.driveShare[hour]! : 0;
      const sourceAh = flows.solarAh[hour]! + (kind === 'parked' ? flows.shoreAh[hour]! : 0) + (driveShare > 0 ? driveShare * drivingChargeA : 0);
      deficitAh = Math.min(capacityAh, Math.max(0, deficitAh + flows.loadAh[hour]! - sourceAh * chargeEfficiency));
      deficits.push(deficitAh);
    }
  }
  return deficits;
}
