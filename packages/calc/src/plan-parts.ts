import { bankNominalV, BATTERY_CHEMISTRIES, type Chemistry } from './batteries.ts';
import { dcdcInputA, inverterInputA } from './energy.ts';
import {
  DEFAULT_DCDC_EFFICIENCY,
  DEFAULT_DCDC_MIN_INPUT_V_PER_12,
  DEFAULT_HIGHEST_C,
  DEFAULT_INVERTER_CUTOFF_V_PER_12,
  DEFAULT_INVERTER_IDLE_SHARE,
  DEFAULT_LOWEST_C,
  DEFAULT_PANEL_VMP_PER_12,
  DEFAULT_STARTER_RECHARGE_A,
  DEFAULT_VEHICLE_LOAD_A,
} from './plan-defaults.ts';
import type { CircuitLink, PlanInput } from './plan-types.ts';
import { controllerHarvest, moduleTemperatureFactor } from './solar.ts';

/** What follows from the plan's parts once the defaults are filled in. */
export interface PlanParts {
  lowestC: number;
  highestC: number;
  starterRechargeA: number;
  inverterIdleW: number;
  /** Hours of the day the inverter is on: those any AC load may run in. */
  inverterOnHours: number[];
  /** The idle draw over those hours, Wh a day. */
  inverterIdleWh: number;
  /** At full rating and the cutoff voltage. */
  inverterInputA: number | null;
  dcdcInputA: number | null;
  /** DC-DC input plus the vehicle's own load, A; null without a charger. */
  alternatorLoadA: number | null;
  /** Share of the array's rated energy reaching the battery: controller harvest × module temperature. */
  solarShare: number;
  solarHarvest: number;
}

/** House chemistry Busbar recommends when none is planned: the deepest usable share (common practice, no source). */
export const RECOMMENDED_CHEMISTRY: Chemistry = 'lifepo4';

/** The house chemistry planned, or the one Busbar recommends. */
export function houseChemistry(plan: PlanInput): Chemistry {
  return plan.bank?.chemistry ?? RECOMMENDED_CHEMISTRY;
}

const perSystem = (plan: PlanInput, valuePer12: number) => (valuePer12 * plan.systemV) / 12;

/** The plan's derived currents and conditions (every default in plan-defaults.ts). */
export function planParts(plan: PlanInput): PlanParts {
  const { inverter, dcdcCharger, solar } = plan;
  const acLoads = plan.loads.filter((load) => load.ac);
  const onHours = new Set(acLoads.flatMap((load) => load.activeHours ?? Array.from({ length: 24 }, (_, hour) => hour)));
  const chemistry = houseChemistry(plan);
  const dcdcIn =
    dcdcCharger &&
    dcdcInputA({
      outputA: dcdcCharger.outputA,
      outputV: perSystem(plan, BATTERY_CHEMISTRIES[chemistry].absorptionV),
      inputV: dcdcCharger.minInputV ?? perSystem(plan, DEFAULT_DCDC_MIN_INPUT_V_PER_12),
      efficiency: dcdcCharger.efficiency ?? DEFAULT_DCDC_EFFICIENCY,
    });
  const highestC = plan.trip.highestC ?? DEFAULT_HIGHEST_C;
  const inverterIdleW = inverter ? (inverter.idleW ?? DEFAULT_INVERTER_IDLE_SHARE * inverter.ratedW) : 0;
  const solarHarvest = solar
    ? controllerHarvest({ controller: solar.controller, panelVmp: solar.panelVmp ?? perSystem(plan, DEFAULT_PANEL_VMP_PER_12), batteryV: bankNominalV(chemistry, plan.systemV) })
    : 0;
  return {
    lowestC: plan.trip.lowestC ?? DEFAULT_LOWEST_C,
    highestC,
    starterRechargeA: plan.starterBattery.rechargeA ?? DEFAULT_STARTER_RECHARGE_A,
    inverterIdleW,
    inverterOnHours: [...onHours].sort((a, b) => a - b),
    inverterIdleWh: inverterIdleW * onHours.size,
    inverterInputA: inverter
      ? inverterInputA({ acW: inverter.ratedW, batteryV: inverter.cutoffV ?? perSystem(plan, DEFAULT_INVERTER_CUTOFF_V_PER_12), efficiency: inverter.efficiency })
      : null,
    dcdcInputA: dcdcIn ?? null,
    alternatorLoadA: dcdcIn === undefined ? null : dcdcIn + (plan.alternator?.vehicleLoadA ?? DEFAULT_VEHICLE_LOAD_A),
    solarShare: solarHarvest * moduleTemperatureFactor(highestC),
    solarHarvest,
  };
}

/** Current of a circuit linked to a part of the plan; null when the plan lacks that part. */
export function linkedCurrentA(plan: PlanInput, parts: PlanParts, link: CircuitLink): number | null {
  if (link === 'inverter-feed') return parts.inverterInputA;
  if (link === 'dcdc-input') return parts.dcdcInputA;
  return plan.dcdcCharger?.outputA ?? null;
}
