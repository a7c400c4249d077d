import { BATTERY_CHEMISTRIES } from './batteries.ts';
import { STARTER_SPARE_FRACTION, lastDriveHourIndex, type BankRun, type TripModel } from './plan-bank.ts';
import type { Finding, Verdict } from './plan-types.ts';

/** What the verdict and the bank findings are drawn from. */
export interface BankFacts {
  model: TripModel;
  run: BankRun;
  dailyWattHours: number;
  dailyAmpHours: number;
  starterDrawAh: number;
  starterSuffices: boolean;
  hasAcLoads: boolean;
  recommendedBankAh: number;
  recommendedChargerA: number | null;
  lowestPercent: number;
}

const round = (x: number, digits = 0) => x.toFixed(digits);
const when = (index: number) => `day ${Math.floor(index / 24) + 1}, ${String(index % 24).padStart(2, '0')}:00–${String((index % 24) + 1).padStart(2, '0')}:00`;

/** State of charge at the end of an hour of the trip, % of the effective capacity. */
export function stateOfChargePercent(run: BankRun, index: number): number {
  return (100 * (run.bank.effectiveCapacityAh - run.deficitsAh[index]!)) / run.bank.effectiveCapacityAh;
}

/** Index of the first hour the bank is below its allowed floor, or -1. */
function firstLowHourIndex(run: BankRun): number {
  return run.deficitsAh.findIndex((deficitAh) => deficitAh > run.bank.usableAh + 1e-9);
}

/** Whether the loads can live on the starter battery's spare, and the reasons either way. */
function starterReasons(facts: BankFacts): string[] {
  const { plan } = facts.model;
  const spareAh = plan.starterBattery.capacityAh * STARTER_SPARE_FRACTION;
  const draw = `The deepest draw over the trip is ${round(facts.starterDrawAh, 1)} Ah`;
  const spare = `the ${round(spareAh, 1)} Ah the ${plan.starterBattery.capacityAh} Ah starter battery can spare (${100 * STARTER_SPARE_FRACTION} %) and still start the engine`;
  return [
    facts.starterDrawAh <= spareAh ? `${draw}, within ${spare}.` : `${draw}, more than ${spare}.`,
    facts.hasAcLoads ? 'AC loads run through an inverter, which needs a house battery of its own.' : 'No load runs through an inverter.',
  ];
}

/** The plan's answer to "what battery does this vehicle need?". */
export function verdictFor(facts: BankFacts): Verdict {
  const { run } = facts;
  const bankName = `${run.bank.ratedAh} Ah ${BATTERY_CHEMISTRIES[run.bank.chemistry].label}`;
  const use = `The loads use ${round(facts.dailyWattHours)} Wh (${round(facts.dailyAmpHours, 1)} Ah) a day.`;
  if (facts.starterSuffices) {
    return {
      kind: 'no-second-battery',
      headline: 'No second battery needed',
      reasons: [use, ...starterReasons(facts), 'Put the loads on a low-voltage disconnect so they cannot flatten the starter battery.'],
    };
  }
  if (run.bank.source === 'recommended') {
    return { kind: 'bank-needed', headline: `A house battery is needed: at least ${bankName}`, reasons: [use, ...starterReasons(facts)] };
  }
  const lowIndex = firstLowHourIndex(run);
  if (lowIndex >= 0) {
    return {
      kind: 'bank-too-small',
      headline: `The ${bankName} bank is too small for this trip: at least ${facts.recommendedBankAh} Ah`,
      reasons: [use, `It falls below its ${round(run.bank.floorPercent)} % floor on ${when(lowIndex)}.`],
    };
  }
  return {
    kind: 'bank-ok',
    headline: `The ${bankName} bank carries this trip`,
    reasons: [use, `Its lowest state of charge is ${round(facts.lowestPercent)} %, above its ${round(run.bank.floorPercent)} % floor.`],
  };
}

/** Findings about the bank running low and about its charger. */
export function bankFindings(facts: BankFacts): Finding[] {
  const { run, model, recommendedChargerA } = facts;
  const findings: Finding[] = [];
  const { label, chargeRateC } = BATTERY_CHEMISTRIES[run.bank.chemistry];
  const bankName = `${run.bank.ratedAh} Ah ${label}`;
  const lowIndex = firstLowHourIndex(run);
  if (lowIndex >= 0) {
    const message = `The ${bankName} bank falls below its allowed ${round(run.bank.floorPercent)} % on ${when(lowIndex)}, before the trip ends; at least ${facts.recommendedBankAh} Ah carries it.`;
    findings.push({ severity: 'critical', code: 'bank-runs-low', message });
  }
  if (run.bank.source === 'starter') return findings;
  const driveIndex = lastDriveHourIndex(model);
  const afterDrive = driveIndex >= 0 ? stateOfChargePercent(run, driveIndex) : 100;
  const chargerA = model.plan.dcdcCharger?.outputA;
  const about = recommendedChargerA === null ? '' : ` About ${recommendedChargerA} A would.`;
  if (chargerA === undefined) {
    if (afterDrive < 100 - 1e-6)
      findings.push({ severity: 'warning', code: 'no-charger', message: `No DC-DC charger is planned, so driving does not refill the house bank.${about}` });
    return findings;
  }
  if (recommendedChargerA !== null && chargerA < recommendedChargerA) {
    const why =
      afterDrive < 100 - 1e-6
        ? `it leaves the bank at ${round(afterDrive)} % after the trip's last drive`
        : `it is below the ${chargeRateC.min} C (${round(chargeRateC.min * run.bank.ratedAh)} A) the bank wants`;
    findings.push({ severity: 'warning', code: 'charger-undersized', message: `The ${chargerA} A DC-DC charger is too small for the ${bankName} bank: ${why}.${about}` });
  }
  if (chargerA > chargeRateC.max * run.bank.ratedAh) {
    const message = `The ${chargerA} A DC-DC charger is above the ${chargeRateC.max} C (${round(chargeRateC.max * run.bank.ratedAh)} A) a ${bankName} bank usually takes: check the battery maker's charge limit.`;
    findings.push({ severity: 'warning', code: 'charger-above-bank-rate', message });
  }
  return findings;
}
