import type { Awg, Chemistry, PlanCircuit, PlanInput, PlanLoad } from '@busbar/calc';
import { between, chance, weighted, type Random } from './draw.ts';

/** What a build's power plan is drawn around: the parts fitted that the plan names. */
export interface PlannedParts {
  chemistry: Chemistry;
  bankAh: number;
  chargerA: number;
  inverter: { ratedW: number; efficiency: number } | null;
}

const span = (from: number, to: number) => Array.from({ length: (to - from + 24) % 24 }, (_, i) => (from + i) % 24);
const EVENING = span(17, 23);
const NIGHT = span(22, 7);
const WAKING = span(7, 22);

/** The customer's loads: a fridge and lights nearly always, a few others now and then, AC ones only with an inverter (invented, typical figures). */
function loadsFor(random: Random, parts: PlannedParts): PlanLoad[] {
  const loads: PlanLoad[] = [
    { name: 'Compressor fridge', watts: between(random, 35, 55, 5), hoursPerDay: 24, dutyCycle: between(random, 0.25, 0.45, 0.05) },
    { name: 'LED lights', watts: between(random, 10, 30, 5), hoursPerDay: between(random, 2, 4), activeHours: EVENING },
  ];
  if (chance(random, 0.6)) loads.push({ name: 'Phone charging', watts: 10, hoursPerDay: between(random, 2, 4) });
  if (chance(random, 0.3)) loads.push({ name: 'Roof fan', watts: 25, hoursPerDay: between(random, 3, 8) });
  if (chance(random, 0.2)) loads.push({ name: 'Diesel heater fan', watts: 30, hoursPerDay: between(random, 3, 8), activeHours: NIGHT });
  if (chance(random, 0.1)) loads.push({ name: 'CPAP', watts: 40, hoursPerDay: 8, activeHours: NIGHT });
  if (chance(random, 0.3)) loads.push({ name: 'Water pump', watts: 60, hoursPerDay: 0.3, activeHours: WAKING });
  if (parts.inverter) {
    loads.push({ name: 'Laptop charging', watts: 65, hoursPerDay: between(random, 2, 6), ac: true, activeHours: span(8, 17) });
    if (chance(random, 0.6)) loads.push({ name: 'Coffee maker', watts: 900, hoursPerDay: between(random, 0.1, 0.3, 0.05), ac: true, activeHours: span(6, 9) });
    if (parts.inverter.ratedW >= 2000 && chance(random, 0.5))
      loads.push({ name: 'Induction cooktop', watts: 1800, hoursPerDay: between(random, 0.2, 0.4, 0.1), ac: true, activeHours: EVENING });
  }
  return loads;
}

/**
 * The heavy runs (charger, main feeder, inverter) in the cable the shop stocks, or Busbar's own
 * choice when the plan leaves the size open. Shops reach for the cable kit on hand: usually 2 AWG
 * (1/0 or 2/0 with an inverter), sometimes a size smaller from the reel. Invented shares.
 */
function heavySize(random: Random, parts: PlannedParts): { size?: { awg: Awg } } {
  if (chance(random, 0.5)) return {};
  const awg: Awg = parts.inverter
    ? weighted(random, [['2/0', 4], ['1/0', 5], ['2', 1]] as const)
    : weighted(random, [['2', 6], ['4', 3], ['6', 1]] as const);
  return { size: { awg } };
}

function circuitsFor(random: Random, parts: PlannedParts): PlanCircuit[] {
  const fuseMm = () => between(random, 80, 170, 10);
  const heavy = { critical: true, insulationC: 105 as const };
  const circuits: PlanCircuit[] = [
    // Under the hood to the back of a van or the bed of a truck: the longest run of the build.
    { from: 'Starter battery', to: 'DC-DC charger', oneWayLengthM: between(random, 1.5, 6, 0.5), link: 'dcdc-input', ...heavy, engineSpace: true, fromBattery: 'starter', fuseFromBatteryMm: fuseMm(), ...heavySize(random, parts) },
    { from: 'DC-DC charger', to: 'House battery', oneWayLengthM: between(random, 0.5, 2.5, 0.5), link: 'dcdc-output', ...heavy, toBattery: 'house', fuseToBatteryMm: fuseMm(), ...heavySize(random, parts) },
    { from: 'House battery', to: 'Fuse block', oneWayLengthM: between(random, 0.5, 3, 0.5), currentA: between(random, 20, 60, 5), ...heavy, fromBattery: 'house', fuseFromBatteryMm: fuseMm(), ...heavySize(random, parts) },
  ];
  if (parts.inverter)
    circuits.push({ from: 'House battery', to: 'Inverter', oneWayLengthM: between(random, 0.5, 2, 0.5), link: 'inverter-feed', ...heavy, fromBattery: 'house', fuseFromBatteryMm: fuseMm(), ...heavySize(random, parts) });
  // Branch circuits in the shop's 10 AWG duplex, or Busbar's choice.
  const duplex = () => (chance(random, 0.6) ? { size: { awg: '10' as Awg } } : {});
  circuits.push({ from: 'Fuse block', to: 'Fridge', oneWayLengthM: between(random, 1, 6, 0.5), currentA: 6, critical: false, insulationC: 105, ...duplex() });
  circuits.push({ from: 'Fuse block', to: 'Lights', oneWayLengthM: between(random, 2, 8, 0.5), currentA: 3, critical: false, insulationC: 105, ...duplex() });
  return circuits;
}

/** A power plan as a technician draws it for a build with these parts: the customer's loads, a typical trip, and the runs as fitted. */
export function planVariant(random: Random, parts: PlannedParts): PlanInput {
  const lowestC = between(random, -12, 15);
  const solar = parts.inverter && chance(random, 0.85) ? { arrayW: between(random, 2, 4) * 175, peakSunHours: between(random, 3, 6, 0.5), controller: 'mppt' as const } : undefined;
  return {
    systemV: 12,
    gauge: 'awg',
    loads: loadsFor(random, parts),
    ...(parts.inverter ? { inverter: parts.inverter } : {}),
    bank: { chemistry: parts.chemistry, capacityAh: parts.bankAh, ...(parts.chemistry === 'lifepo4' && lowestC < 0 ? { selfHeating: true } : {}) },
    starterBattery: { capacityAh: weighted(random, [[70, 3], [100, 1]] as const) },
    alternator: { ratedA: weighted(random, [[130, 2], [160, 3], [180, 2], [220, 1]] as const) },
    dcdcCharger: { outputA: parts.chargerA },
    ...(solar ? { solar } : {}),
    trip: {
      daysParked: weighted(random, [[0, 3], [1, 5], [2, 4], [3, 2], [4, 1]] as const),
      daysDriving: weighted(random, [[1, 3], [2, 1]] as const),
      driveHoursPerDay: between(random, 1, 6, 0.5),
      lowestC,
      highestC: between(random, Math.max(lowestC + 8, 18), 38),
    },
    circuits: circuitsFor(random, parts),
  };
}
