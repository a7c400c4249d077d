import { BATTERY_CHEMISTRIES } from './batteries.ts';
import { lastDriveHourIndex, STARTER_SPARE_FRACTION, type BankRun, type StarterDraw, type TripModel } from './plan-bank.ts';
import type { BankRecommendation, Finding, SizedChoice, Verdict } from './plan-types.ts';

/** What the verdict and the bank findings are drawn from. */
export interface BankFacts {
  model: TripModel;
  run: BankRun;
  dailyWattHours: number;
  dailyAmpHours: number;
  starter: StarterDraw;
  starterSuffices: boolean;
  hasAcLoads: boolean;
  recommendedBank: BankRecommendation;
  lowestPercent: number;
}

const round = (x: number, digits = 0) => x.toFixed(digits);
const when = (index: number) => `day ${Math.floor(index / 24) + 1}, ${String(index % 24).padStart(2, '0')}:00–${String((index % 24) + 1).padStart(2, '0')}:00`;
const RULE_WORDS = { catalog: 'the smallest in the catalog', 'common-steps': 'a common size' } as const;

/** State of charge at the end of an hour of the trip, % of the effective capacity. */
export function stateOfChargePercent(run: BankRun, index: number): number {
  return (100 * (run.bank.effectiveCapacityAh - run.deficitsAh[index]!)) / run.bank.effectiveCapacityAh;
}

/** Index of the first hour the bank is below its allowed floor, or -1. */
function firstLowHourIndex(run: BankRun): number {
  return run.deficitsAh.findIndex((deficitAh) => deficitAh > run.bank.usableAh + 1e-9);
}

/** A recommended bank in words: "a 200 Ah self-heating LiFePO4 bank (at least 183 Ah; a common size)". */
function bankWords(bank: BankRecommendation): string {
  const kind = `${bank.selfHeating ? 'self-heating ' : ''}${BATTERY_CHEMISTRIES[bank.chemistry].label}`;
  return `a ${bank.size} Ah ${kind} bank (at least ${bank.minimum} Ah; ${RULE_WORDS[bank.rule]})`;
}

/** Whether the loads can live on the starter battery's spare, and the reasons either way. */
function starterReasons(facts: BankFacts): string[] {
  const { plan, parts } = facts.model;
  const { starter } = facts;
  const draw = `The deepest draw over trips in a row is ${round(starter.deepestAh, 1)} Ah`;
  const spare = `the ${round(starter.spareAh, 1)} Ah the ${plan.starterBattery.capacityAh} Ah starter battery can spare (${100 * STARTER_SPARE_FRACTION} %${parts.lowestC < 25 ? ` of what it holds at ${parts.lowestC} °C` : ''}) and still start the engine`;
  const recharge = `The alternator is taken to put ${parts.starterRechargeA} A back into it for ${plan.trip.driveHoursPerDay} h each driving day`;
  return [
    starter.deepestAh <= starter.spareAh + 1e-9 ? `${draw}, within ${spare}.` : `${draw}, more than ${spare}.`,
    starter.refilled ? `${recharge}, enough to refill it.` : `${recharge}: not enough to put back what the loads take, so each trip starts lower.`,
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
    return { kind: 'bank-needed', headline: `A house battery is needed: ${bankWords(facts.recommendedBank)}`, reasons: [use, ...starterReasons(facts)] };
  }
  const lowIndex = firstLowHourIndex(run);
  if (lowIndex >= 0) {
    return {
      kind: 'bank-too-small',
      headline: `The ${bankName} bank is too small for this trip: at least ${facts.recommendedBank.minimum} Ah`,
      reasons: [use, `It falls below its ${round(run.bank.floorPercent)} % floor on ${when(lowIndex)}.`],
    };
  }
  return {
    kind: 'bank-ok',
    headline: `The ${bankName} bank carries this trip`,
    reasons: [use, `Its lowest state of charge is ${round(facts.lowestPercent)} %, above its ${round(run.bank.floorPercent)} % floor.`],
  };
}

function coldFindings({ model, run }: BankFacts): Finding[] {
  const { bank } = model.plan;
  const { lowestC } = model.parts;
  if (!bank || bank.chemistry !== 'lifepo4' || bank.selfHeating || lowestC >= 0) return [];
  const message = `The trip goes down to ${lowestC} °C: charging the ${run.bank.ratedAh} Ah LiFePO4 bank below 0 °C damages its cells. Choose a self-heating bank (or one whose maker allows cold charging), or keep the bank warm.`;
  return [{ severity: 'critical', code: 'cold-charging', message }];
}

function chargerFindings(facts: BankFacts, recommendedCharger: SizedChoice | null): Finding[] {
  const { run, model } = facts;
  const { label, chargeRateC } = BATTERY_CHEMISTRIES[run.bank.chemistry];
  const bankName = `${run.bank.ratedAh} Ah ${label}`;
  const driveIndex = lastDriveHourIndex(model);
  const afterDrive = driveIndex >= 0 ? stateOfChargePercent(run, driveIndex) : 100;
  const short = afterDrive < 100 - 1e-6;
  const chargerA = model.plan.dcdcCharger?.outputA;
  const about = recommendedCharger === null ? (short ? ' No charger refills it within the drive: plan solar or shore charging, or longer drives.' : '') : ` About ${recommendedCharger.size} A would.`;
  if (chargerA === undefined)
    return short ? [{ severity: 'warning', code: 'no-charger', message: `No DC-DC charger is planned, so driving does not refill the house bank.${about}` }] : [];
  const findings: Finding[] = [];
  if ((recommendedCharger !== null && chargerA < recommendedCharger.minimum) || (recommendedCharger === null && short)) {
    const why = short ? `it leaves the bank at ${round(afterDrive)} % after the trip's last drive` : `it is below the ${chargeRateC.min} C (${round(chargeRateC.min * run.bank.ratedAh)} A) the bank wants`;
    findings.push({ severity: 'warning', code: 'charger-undersized', message: `The ${chargerA} A DC-DC charger is too small for the ${bankName} bank: ${why}.${about}` });
  }
  if (chargerA > chargeRateC.max * run.bank.ratedAh) {
    const message = `The ${chargerA} A DC-DC charger is above the ${chargeRateC.max} C (${round(chargeRateC.max * run.bank.ratedAh)} A) a ${bankName} bank usually takes: check the battery maker's charge limit.`;
    findings.push({ severity: 'warning', code: 'charger-above-bank-rate', message });
  }
  return findings;
}

/** Findings about the bank running low, charging in the cold and its charger. */
export function bankFindings(facts: BankFacts, recommendedCharger: SizedChoice | null): Finding[] {
  const { run } = facts;
  const findings: Finding[] = [];
  const lowIndex = firstLowHourIndex(run);
  if (lowIndex >= 0) {
    const bankName = `${run.bank.ratedAh} Ah ${BATTERY_CHEMISTRIES[run.bank.chemistry].label}`;
    const message = `The ${bankName} bank falls below its allowed ${round(run.bank.floorPercent)} % on ${when(lowIndex)}, before the trip ends; at least ${facts.recommendedBank.minimum} Ah carries it.`;
    findings.push({ severity: 'critical', code: 'bank-runs-low', message });
  }
  if (run.bank.source === 'starter') return findings;
  return [...findings, ...coldFindings(facts), ...chargerFindings(facts, recommendedCharger)];
}
