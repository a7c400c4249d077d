import { BATTERY_CHEMISTRIES, dailyEnergy, PVWATTS_V5_LOSS_FRACTION, type PlanInput, type PlanLoad } from '@busbar/calc';
import { planPlaceholders } from './placeholders.ts';
import { figure } from './planFormat.ts';
import { DAY_WINDOWS, windowOf } from './presets.ts';

const percent = (share: number) => `${figure(share * 100)} %`;

/**
 * The batteries, charging sources, trip and conductors of a plan in words, for summaries and the
 * printed sheet; an input left empty reads as the figure assumed for it. Temperatures are given
 * in °C and shown with `temperature`.
 */
export function planFacts(input: PlanInput, temperature: (c: number) => string): { label: string; value: string }[] {
  const { bank, inverter, alternator, dcdcCharger, solar, shoreCharger, trip } = input;
  const assumed = planPlaceholders(input);
  const depth = bank && (bank.depthOfDischarge ?? BATTERY_CHEMISTRIES[bank.chemistry].defaultDepthOfDischarge);
  const start = String(trip.driveStartHour ?? 9).padStart(2, '0');
  const days = (n: number, what: string) => `${n} ${n === 1 ? 'day' : 'days'} ${what}`;
  return [
    { label: 'System', value: `${input.systemV} V` },
    {
      label: 'House battery bank',
      value: bank
        ? `${figure(bank.capacityAh, 0)} Ah ${BATTERY_CHEMISTRIES[bank.chemistry].label}${bank.selfHeating ? ', self-heating' : ''}, used to ${percent(depth!)}`
        : 'None planned',
    },
    {
      label: 'Starter battery',
      value: `${figure(input.starterBattery.capacityAh, 0)} Ah, recharged at ${figure(input.starterBattery.rechargeA ?? assumed.starterRechargeA)} A while driving`,
    },
    {
      label: 'Inverter',
      value: inverter
        ? `${figure(inverter.ratedW, 0)} W, ${percent(inverter.efficiency)} efficient, cutoff ${figure(inverter.cutoffV ?? assumed.inverterCutoffV)} V, idle ${figure(inverter.idleW ?? assumed.inverterIdleW)} W`
        : 'None',
    },
    {
      label: 'DC-DC charger',
      value: dcdcCharger
        ? `${figure(dcdcCharger.outputA)} A, ${percent(dcdcCharger.efficiency ?? assumed.dcdcEfficiencyPercent / 100)} efficient, from ${figure(dcdcCharger.minInputV ?? assumed.dcdcMinInputV)} V`
        : 'None',
    },
    {
      label: 'Alternator',
      value: alternator ? `${figure(alternator.ratedA, 0)} A, vehicle's own load ${figure(alternator.vehicleLoadA ?? assumed.vehicleLoadA)} A` : 'Not given',
    },
    {
      label: 'Solar',
      value: solar
        ? `${figure(solar.arrayW, 0)} W, ${figure(solar.peakSunHours)} peak sun hours, ${solar.controller.toUpperCase()} controller${
            solar.controller === 'pwm' ? ` (panels ${figure(solar.panelVmp ?? assumed.panelVmp)} V Vmp)` : ''
          }, ${percent(solar.lossFraction ?? PVWATTS_V5_LOSS_FRACTION)} losses`
        : 'None',
    },
    { label: 'Shore charger', value: shoreCharger ? `${figure(shoreCharger.outputA)} A for ${figure(shoreCharger.hoursPerParkedDay)} h a parked day` : 'None' },
    {
      label: 'Trip',
      value: `${days(trip.daysParked, 'parked')}, then ${days(trip.daysDriving, 'driving')}, ${figure(trip.driveHoursPerDay)} h a day from ${start}:00`,
    },
    { label: 'Temperatures', value: `${temperature(trip.lowestC ?? assumed.lowestC)} to ${temperature(trip.highestC ?? assumed.highestC)}` },
    {
      label: 'Conductors',
      value: `${input.tinnedCopper ? 'Tinned copper' : 'Copper'} at ${temperature(input.conductorTemperatureC ?? assumed.conductorTemperatureC)}`,
    },
  ];
}

/** When a load runs, in words. */
export function loadWindow(load: PlanLoad): string {
  const key = windowOf(load.activeHours);
  return DAY_WINDOWS.find((w) => w.key === key)?.label ?? `${load.activeHours?.length ?? 0} set hours`;
}

/** A load's energy a day from the battery, Wh (AC loads through the inverter). */
export function loadWattHours(load: PlanLoad, input: PlanInput): number {
  return dailyEnergy([load], { systemV: input.systemV, inverterEfficiency: input.inverter?.efficiency ?? 1 }).wattHours;
}
