import {
  DEFAULT_CONDUCTOR_TEMPERATURE_C,
  DEFAULT_DCDC_EFFICIENCY,
  DEFAULT_DCDC_MIN_INPUT_V_PER_12,
  DEFAULT_HIGHEST_C,
  DEFAULT_INVERTER_CUTOFF_V_PER_12,
  DEFAULT_INVERTER_IDLE_SHARE,
  DEFAULT_LOWEST_C,
  DEFAULT_PANEL_VMP_PER_12,
  DEFAULT_STARTER_RECHARGE_A,
  DEFAULT_VEHICLE_LOAD_A,
  type PlanInput,
} from '@busbar/calc';

const perSystem = (plan: PlanInput, per12: number) => Number(((per12 * plan.systemV) / 12).toFixed(1));

/** What the planner assumes for each optional input left empty, shown as the field's placeholder. */
export function planPlaceholders(plan: PlanInput) {
  const ratedW = Number(plan.inverter?.ratedW) || 0;
  return {
    conductorTemperatureC: DEFAULT_CONDUCTOR_TEMPERATURE_C,
    starterRechargeA: DEFAULT_STARTER_RECHARGE_A,
    vehicleLoadA: DEFAULT_VEHICLE_LOAD_A,
    inverterCutoffV: perSystem(plan, DEFAULT_INVERTER_CUTOFF_V_PER_12),
    inverterIdleW: Math.round(ratedW * DEFAULT_INVERTER_IDLE_SHARE * 10) / 10,
    dcdcEfficiencyPercent: DEFAULT_DCDC_EFFICIENCY * 100,
    dcdcMinInputV: perSystem(plan, DEFAULT_DCDC_MIN_INPUT_V_PER_12),
    panelVmp: perSystem(plan, DEFAULT_PANEL_VMP_PER_12),
    lowestC: DEFAULT_LOWEST_C,
    highestC: DEFAULT_HIGHEST_C,
  };
}
