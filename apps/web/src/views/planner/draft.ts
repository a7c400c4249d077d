import { feetToMeters, type Gauge, type PlanCircuit, type PlanInput } from '@busbar/calc';
import { presetLoad } from './presets.ts';

// Runs of round lengths in the units the person works in (AWG goes with feet); stored in metres.
const runM = (gauge: Gauge, meters: number, feet: number) => (gauge === 'awg' ? feetToMeters(feet) : meters);

/**
 * A new plan: a 12 V van with a fridge and lights, parked two days and driven one, on a 100 Ah
 * LiFePO4 bank charged by a 25 A DC-DC charger, with the charger's two runs to check: their
 * currents follow from the charger, and each leaves a battery, so each needs a fuse beside it.
 */
export function newPlanInput(gauge: Gauge): PlanInput {
  return {
    systemV: 12,
    gauge,
    loads: [presetLoad('fridge'), presetLoad('lights')],
    bank: { chemistry: 'lifepo4', capacityAh: 100 },
    starterBattery: { capacityAh: 70 },
    dcdcCharger: { outputA: 25 },
    trip: { daysParked: 2, daysDriving: 1, driveHoursPerDay: 3 },
    circuits: [
      {
        from: 'Starter battery',
        to: 'DC-DC charger',
        oneWayLengthM: runM(gauge, 4, 12),
        link: 'dcdc-input',
        critical: true,
        insulationC: 105,
        engineSpace: true,
        fromBattery: 'starter',
      },
      { from: 'DC-DC charger', to: 'House battery', oneWayLengthM: runM(gauge, 1, 3), link: 'dcdc-output', critical: true, insulationC: 105, toBattery: 'house' },
    ],
  };
}

export function newCircuit(gauge: Gauge): PlanCircuit {
  return { from: 'Fuse block', to: '', oneWayLengthM: runM(gauge, 3, 10), currentA: 10, critical: false, insulationC: 105 };
}

/** The run from the house battery to the inverter; its current follows from the inverter at its cutoff voltage. */
export function inverterFeed(gauge: Gauge): PlanCircuit {
  return { from: 'House battery', to: 'Inverter', oneWayLengthM: runM(gauge, 1.5, 5), link: 'inverter-feed', critical: true, insulationC: 105, fromBattery: 'house' };
}

export const hasInverterFeed = (plan: PlanInput) => plan.circuits.some((c) => c.link === 'inverter-feed');

/** An inverter big enough for the AC loads running together, in steps of 500 W from 1,000 W. */
export function inverterFor(plan: PlanInput): { ratedW: number; efficiency: number } {
  const acW = plan.loads.filter((load) => load.ac).reduce((sum, load) => sum + (Number(load.watts) || 0), 0);
  return { ratedW: Math.max(1000, Math.ceil(acW / 500) * 500), efficiency: 0.9 };
}

/** Keys sorted and empty optional fields left out, so two plans compare by what they say. */
function canonical(value: unknown): unknown {
  if (Array.isArray(value)) return value.map(canonical);
  if (value === null || typeof value !== 'object') return value;
  const entries = Object.entries(value).filter(([, v]) => v !== undefined);
  return Object.fromEntries(entries.sort(([a], [b]) => a.localeCompare(b)).map(([k, v]) => [k, canonical(v)]));
}

export const samePlan = (a: unknown, b: unknown) => JSON.stringify(canonical(a)) === JSON.stringify(canonical(b));

export const clonePlan = (input: PlanInput): PlanInput => JSON.parse(JSON.stringify(input)) as PlanInput;
