import { BATTERY_CHEMISTRIES, capacityForUsableAh, usableCapacity, type Chemistry } from './batteries.ts';
import { simulateDeficitsAh, type HourlyFlows } from './plan-profile.ts';
import type { DayKind, PlanInput, SimulatedBank } from './plan-types.ts';

/** Share of a starter battery's rating loads may take and still leave a sure start (common practice, no source). */
export const STARTER_SPARE_FRACTION = 0.2;
/** House chemistry Busbar recommends when none is planned: the deepest usable share (common practice, no source). */
export const RECOMMENDED_CHEMISTRY: Chemistry = 'lifepo4';
// A starter battery is taken as flooded lead-acid.
const STARTER_CHEMISTRY: Chemistry = 'flooded';
const MAX_CHARGER_A = 2000;
// Rounding up must not turn 125.000000001 Ah into 126.
const ceil = (x: number) => Math.ceil(x - 1e-9);

/** The plan laid out for simulation. */
export interface TripModel {
  plan: PlanInput;
  days: DayKind[];
  flows: HourlyFlows;
  averageLoadA: number;
}

/** The house chemistry planned, or the one Busbar recommends. */
export function houseChemistry(plan: PlanInput): Chemistry {
  return plan.bank?.chemistry ?? RECOMMENDED_CHEMISTRY;
}

/** Deepest draw the loads make on the starter battery alone, the alternator refilling it within any hour of driving (common practice, no source). */
export function starterDrawAh({ days, flows }: TripModel): number {
  const chargeEfficiency = BATTERY_CHEMISTRIES[STARTER_CHEMISTRY].chargeEfficiency;
  return Math.max(0, ...simulateDeficitsAh({ days, flows, capacityAh: Infinity, drivingChargeA: Infinity, chargeEfficiency }));
}

/** Smallest house bank (rated Ah) that stays above its floor over the trip with the plan's own charging. */
export function minimumBankAh({ plan, days, flows, averageLoadA }: TripModel): number {
  const chemistry = houseChemistry(plan);
  const demandAh = simulateDeficitsAh({
    days,
    flows,
    capacityAh: Infinity,
    drivingChargeA: plan.dcdcCharger?.outputA ?? 0,
    chargeEfficiency: BATTERY_CHEMISTRIES[chemistry].chargeEfficiency,
  });
  const spec = plan.bank ?? { chemistry };
  // At least 1 Ah, so that a bank wanted for other reasons (an inverter) still has a size.
  return Math.max(1, ceil(capacityForUsableAh({ ...spec, usableAh: Math.max(0, ...demandAh), averageCurrentA: averageLoadA })));
}

/** The battery whose hour-by-hour state the plan shows, with the charging it gets while driving. */
export interface BankRun {
  bank: SimulatedBank;
  drivingChargeA: number;
  chargeEfficiency: number;
  deficitsAh: number[];
}

/** Simulates the planned bank; else the starter battery when it suffices; else the recommended minimum bank. */
export function runBank(model: TripModel, starterSuffices: boolean, recommendedAh: number): BankRun {
  const { plan } = model;
  let bank: SimulatedBank;
  let drivingChargeA = plan.dcdcCharger?.outputA ?? 0;
  if (!plan.bank && starterSuffices) {
    const ratedAh = plan.starterBattery.capacityAh;
    const usableAh = ratedAh * STARTER_SPARE_FRACTION;
    bank = { source: 'starter', chemistry: STARTER_CHEMISTRY, ratedAh, effectiveCapacityAh: ratedAh, usableAh, floorPercent: 100 - 100 * STARTER_SPARE_FRACTION };
    drivingChargeA = Infinity;
  } else {
    const spec = plan.bank ?? { chemistry: RECOMMENDED_CHEMISTRY, capacityAh: recommendedAh };
    const usable = usableCapacity({ ...spec, averageCurrentA: model.averageLoadA });
    bank = {
      source: plan.bank ? 'planned' : 'recommended',
      chemistry: spec.chemistry,
      ratedAh: spec.capacityAh,
      effectiveCapacityAh: usable.effectiveCapacityAh,
      usableAh: usable.usableAh,
      floorPercent: 100 - 100 * usable.depthOfDischarge,
    };
  }
  const chargeEfficiency = BATTERY_CHEMISTRIES[bank.chemistry].chargeEfficiency;
  const deficitsAh = simulateDeficitsAh({ ...model, capacityAh: bank.effectiveCapacityAh, drivingChargeA, chargeEfficiency });
  return { bank, drivingChargeA, chargeEfficiency, deficitsAh };
}

/** Index of the trip's last driving hour, or -1 when the trip has no driving. */
export function lastDriveHourIndex({ days, flows }: TripModel): number {
  const lastHour = flows.driveShare.findLastIndex((share) => share > 0);
  return days.at(-1) === 'driving' && lastHour >= 0 ? (days.length - 1) * 24 + lastHour : -1;
}

// A trip repeats, so a bank that ends the last drive short starts the next trip short.
/** DC-DC current to recommend: the smallest whole amperes that refill the bank by the end of the trip's last drive, at least the chemistry's minimum charge rate; null for a starter battery or a trip without driving. */
export function recommendedChargerA(model: TripModel, run: BankRun): number | null {
  const index = lastDriveHourIndex(model);
  if (run.bank.source === 'starter' || index < 0) return null;
  const refilledWith = (chargerA: number) =>
    simulateDeficitsAh({ ...model, capacityAh: run.bank.effectiveCapacityAh, drivingChargeA: chargerA, chargeEfficiency: run.chargeEfficiency })[index]! <= 1e-9;
  if (!refilledWith(MAX_CHARGER_A)) return null;
  let low = 0;
  let high = MAX_CHARGER_A;
  while (low < high) {
    const mid = Math.floor((low + high) / 2);
    if (refilledWith(mid)) high = mid;
    else low = mid + 1;
  }
  return Math.max(low, ceil(BATTERY_CHEMISTRIES[run.bank.chemistry].chargeRateC.min * run.bank.ratedAh));
}
