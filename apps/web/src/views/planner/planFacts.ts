import { BATTERY_CHEMISTRIES, dailyEnergy, PVWATTS_V5_LOSS_FRACTION, type PlanInput, type PlanLoad } from '@busbar/calc';
import { figure } from './planFormat.ts';
import { DAY_WINDOWS, windowOf } from './presets.ts';

const percent = (share: number) => `${figure(share * 100)} %`;

/** The batteries, charging sources and trip of a plan in words, for summaries and the printed sheet. */
export function planFacts(input: PlanInput): { label: string; value: string }[] {
  const { bank, inverter, dcdcCharger, solar, shoreCharger, trip } = input;
  const depth = bank && (bank.depthOfDischarge ?? BATTERY_CHEMISTRIES[bank.chemistry].defaultDepthOfDischarge);
  const start = String(trip.driveStartHour ?? 9).padStart(2, '0');
  const days = (n: number, what: string) => `${n} ${n === 1 ? 'day' : 'days'} ${what}`;
  return [
    { label: 'System', value: `${input.systemV} V` },
    {
      label: 'House battery bank',
      value: bank ? `${figure(bank.capacityAh, 0)} Ah ${BATTERY_CHEMISTRIES[bank.chemistry].label}, used to ${percent(depth!)}` : 'None planned',
    },
    { label: 'Starter battery', value: `${figure(input.starterBattery.capacityAh, 0)} Ah` },
    { label: 'Inverter', value: inverter ? `${figure(inverter.ratedW, 0)} W, ${percent(inverter.efficiency)} efficient` : 'None' },
    { label: 'DC-DC charger', value: dcdcCharger ? `${figure(dcdcCharger.outputA)} A` : 'None' },
    {
      label: 'Solar',
      value: solar
        ? `${figure(solar.arrayW, 0)} W, ${figure(solar.peakSunHours)} peak sun hours, ${solar.controller.toUpperCase()} controller, ${percent(solar.lossFraction ?? PVWATTS_V5_LOSS_FRACTION)} losses`
        : 'None',
    },
    { label: 'Shore charger', value: shoreCharger ? `${figure(shoreCharger.outputA)} A for ${figure(shoreCharger.hoursPerParkedDay)} h a parked day` : 'None' },
    {
      label: 'Trip',
      value: `${days(trip.daysParked, 'parked')}, then ${days(trip.daysDriving, 'driving')}, ${figure(trip.driveHoursPerDay)} h a day from ${start}:00`,
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
