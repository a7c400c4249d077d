import { BATTERY_CHEMISTRIES, coldCapacityFactor, DEFAULT_RATED_HOURS, type Chemistry } from './batteries.ts';
import { houseChemistry, RECOMMENDED_CHEMISTRY, type PlanParts } from './plan-parts.ts';
import { deepestDeficit, deficitAtHour, simulateDeficitsAh, type BankPhysics, type HourlyFlows } from './plan-profile.ts';
import type { BankRecommendation, DayKind, PlanBank, PlanInput, PlanStock, SimulatedBank, SizedChoice } from './plan-types.ts';
import { COMMON_BANK_AH, COMMON_CHARGER_A, sizeToBuy } from './sized.ts';

/** Share of a starter battery's capacity loads may take and still leave a sure start (common practice, no source). */
export const STARTER_SPARE_FRACTION = 0.2;
// A starter battery is taken as flooded lead-acid.
const STARTER_CHEMISTRY: Chemistry = 'flooded';
const MAX_CHARGER_A = 2000;
const MAX_BANK_AH = 1_000_000;
const ceil = (x: number) => Math.ceil(x - 1e-9);

/** The plan laid out for simulation. */
export interface TripModel {
  plan: PlanInput;
  parts: PlanParts;
  days: DayKind[];
  flows: HourlyFlows;
  stock?: PlanStock;
}

type BankSpec = Pick<PlanBank, 'chemistry' | 'depthOfDischarge' | 'peukertExponent' | 'ratedHours'>;

/** How a bank of a chemistry and rating behaves on the trip's coldest day. */
function physicsOf(spec: BankSpec, ratedAh: number, lowestC: number): BankPhysics & { depthOfDischarge: number } {
  const data = BATTERY_CHEMISTRIES[spec.chemistry];
  const capacityAh = ratedAh * coldCapacityFactor(spec.chemistry, lowestC);
  return {
    capacityAh,
    chargeEfficiency: data.chargeEfficiency,
    depthOfDischarge: spec.depthOfDischarge ?? data.defaultDepthOfDischarge,
    peukert: { capacityAh: ratedAh, ratedHours: spec.ratedHours ?? DEFAULT_RATED_HOURS, exponent: spec.peukertExponent ?? data.peukertExponent },
    taper: data.taper && { kneeDeficitAh: (1 - data.taper.knee) * capacityAh, acceptAhPerHour: data.taper.acceptC * ratedAh },
  };
}

/** What the loads take from the starter battery alone, with the alternator's recharge while driving. */
export interface StarterDraw {
  /** Deepest draw once trips in a row settle, Ah. */
  deepestAh: number;
  /** Trips in a row settle: the drives put back what the loads take (lead-acid's slow last 20 % included). */
  refilled: boolean;
  /** What the battery may give and still start the engine, Ah. */
  spareAh: number;
}

const MAX_LAPS = 30;
const SETTLED_AH = 0.01;

/** The loads on the starter battery over trips in a row, each starting where the last ended, until they settle or the draw passes what the battery holds. */
export function starterDraw({ plan, parts, days, flows }: TripModel): StarterDraw {
  const physics = physicsOf({ chemistry: STARTER_CHEMISTRY }, plan.starterBattery.capacityAh, parts.lowestC);
  const spareAh = physics.capacityAh * STARTER_SPARE_FRACTION;
  let deepestAh = 0;
  let endAh = 0;
  for (let lap = 0; lap < MAX_LAPS; lap++) {
    const run = deepestDeficit({ ...physics, capacityAh: Infinity, days, flows, drivingChargeA: parts.starterRechargeA, startDeficitAh: endAh }, physics.capacityAh);
    deepestAh = Math.max(deepestAh, run.deepestAh);
    if (deepestAh > physics.capacityAh) break;
    const settled = lap > 0 && run.endAh - endAh < SETTLED_AH;
    endAh = run.endAh;
    if (settled) return { deepestAh, refilled: true, spareAh };
  }
  return { deepestAh, refilled: false, spareAh };
}

/** Smallest house bank (rated Ah, whole) of the planned or recommended kind that stays above its floor over the trip with the plan's own charging. */
export function minimumBankAh(model: TripModel): number {
  const spec = model.plan.bank ?? { chemistry: houseChemistry(model.plan) };
  const chargerA = model.plan.dcdcCharger?.outputA ?? 0;
  const physicsAt = (ratedAh: number) => physicsOf(spec, ratedAh, model.parts.lowestC);
  const carries = (ratedAh: number) => {
    const { depthOfDischarge, ...physics } = physicsAt(ratedAh);
    const usableAh = physics.capacityAh * depthOfDischarge;
    return deepestDeficit({ ...physics, days: model.days, flows: model.flows, drivingChargeA: chargerA }, usableAh + 1e-9).deepestAh <= usableAh + 1e-9;
  };
  // Peukert's law and the taper only add to the demand without them, so that demand bounds the
  // rating from below (and is the answer for LiFePO4); a bigger bank never runs lower in share.
  const { depthOfDischarge, ...plain } = physicsAt(1);
  const plainDemandAh = deepestDeficit({ ...plain, peukert: undefined, taper: undefined, capacityAh: Infinity, days: model.days, flows: model.flows, drivingChargeA: chargerA }).deepestAh;
  let low = Math.max(1, ceil(plainDemandAh / (plain.capacityAh * depthOfDischarge)));
  let high = low;
  while (!carries(high) && high < MAX_BANK_AH) high *= 2;
  while (low < high) {
    const mid = Math.floor((low + high) / 2);
    if (carries(mid)) high = mid;
    else low = mid + 1;
  }
  return low;
}

/** The bank Busbar recommends: the minimum rounded up to a size the shop can buy; self-heating LiFePO4 for a trip below freezing. */
export function recommendBank(model: TripModel, minimumAh: number): BankRecommendation {
  const chemistry = houseChemistry(model.plan);
  const sized = sizeToBuy(minimumAh, model.stock?.bankAh?.[chemistry], COMMON_BANK_AH);
  return { ...sized, chemistry, selfHeating: chemistry === 'lifepo4' && model.parts.lowestC < 0 };
}

/** The battery whose hour-by-hour state the plan shows, with the charging it gets while driving. */
export interface BankRun {
  bank: SimulatedBank;
  physics: BankPhysics;
  drivingChargeA: number;
  deficitsAh: number[];
}

/** Simulates the planned bank; else the starter battery when it suffices; else the recommended bank. */
export function runBank(model: TripModel, starterSuffices: boolean, recommended: BankRecommendation): BankRun {
  const { plan, parts } = model;
  const starter = !plan.bank && starterSuffices;
  const spec: BankSpec = starter ? { chemistry: STARTER_CHEMISTRY } : (plan.bank ?? { chemistry: RECOMMENDED_CHEMISTRY });
  const ratedAh = starter ? plan.starterBattery.capacityAh : (plan.bank?.capacityAh ?? recommended.size);
  const { depthOfDischarge, ...physics } = physicsOf(spec, ratedAh, parts.lowestC);
  const usableShare = starter ? STARTER_SPARE_FRACTION : depthOfDischarge;
  const drivingChargeA = starter ? parts.starterRechargeA : (plan.dcdcCharger?.outputA ?? 0);
  const bank: SimulatedBank = {
    source: starter ? 'starter' : plan.bank ? 'planned' : 'recommended',
    chemistry: spec.chemistry,
    ratedAh,
    effectiveCapacityAh: physics.capacityAh,
    usableAh: physics.capacityAh * usableShare,
    floorPercent: 100 - 100 * usableShare,
  };
  const deficitsAh = simulateDeficitsAh({ ...physics, days: model.days, flows: model.flows, drivingChargeA });
  return { bank, physics, drivingChargeA, deficitsAh };
}

/** Index of the trip's last driving hour, or -1 when the trip has no driving. */
export function lastDriveHourIndex({ days, flows }: TripModel): number {
  const lastHour = flows.driveShare.findLastIndex((share) => share > 0);
  return days.at(-1) === 'driving' && lastHour >= 0 ? (days.length - 1) * 24 + lastHour : -1;
}

// A trip repeats, so a bank that ends the last drive short starts the next trip short.
/** DC-DC charger to recommend: the smallest whole amperes that refill the bank by the end of the trip's last drive, at least the chemistry's minimum charge rate, rounded up to a size to buy; null for a starter battery, a trip without driving, or when no charger refills it (a lead-acid bank's taper). */
export function recommendCharger(model: TripModel, run: BankRun): SizedChoice | null {
  const index = lastDriveHourIndex(model);
  if (run.bank.source === 'starter' || index < 0) return null;
  const refilledWith = (chargerA: number) => deficitAtHour({ ...run.physics, days: model.days, flows: model.flows, drivingChargeA: chargerA }, index) <= 1e-9;
  if (!refilledWith(MAX_CHARGER_A)) return null;
  let low = 0;
  let high = MAX_CHARGER_A;
  while (low < high) {
    const mid = Math.floor((low + high) / 2);
    if (refilledWith(mid)) high = mid;
    else low = mid + 1;
  }
  const minimum = Math.max(low, ceil(BATTERY_CHEMISTRIES[run.bank.chemistry].chargeRateC.min * run.bank.ratedAh));
  return sizeToBuy(minimum, model.stock?.chargerA, COMMON_CHARGER_A);
}
