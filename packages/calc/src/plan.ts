import { BATTERY_CHEMISTRIES, hoursToRefill } from './batteries.ts';
import { dailyEnergy } from './energy.ts';
import { minimumBankAh, recommendBank, recommendCharger, runBank, starterDraw, type BankRun, type TripModel } from './plan-bank.ts';
import { evaluateCircuit } from './plan-circuits.ts';
import { ALTERNATOR_STEADY_SHARE } from './plan-defaults.ts';
import { planParts, type PlanParts } from './plan-parts.ts';
import { hourlyFlows, tripDays } from './plan-profile.ts';
import { protectionPoints } from './plan-protection.ts';
import type { Finding, PlanInput, PlanResult, PlanStock, Verdict } from './plan-types.ts';
import { validatePlan } from './plan-validate.ts';
import { bankFindings, stateOfChargePercent, verdictFor, type BankFacts } from './plan-verdict.ts';
import { SAFETY_CAUTION } from './safety.ts';
import { solarDailyWh } from './solar.ts';

const sum = (values: number[]) => values.reduce((a, b) => a + b, 0);
const round = (x: number) => x.toFixed(0);
/** Below this share a PWM controller wastes most of the panel: an MPPT controller fits (common practice, no source). */
const PWM_MISMATCH_SHARE = 0.6;

// How a plan is judged:
// - The trip is simulated hour by hour from a full bank: the parked days as one stretch (the
//   hardest case for the bank), then the driving days; the day's profile is in plan-profile.ts.
//   Each hour's draw is weighed by Peukert's law at the current of the loads that may run in it;
//   lead-acid holds less in the trip's cold and takes its last 20 % slowly.
// - No second battery is needed when no load runs on AC, the drives put back what the trip takes
//   (the alternator gives the starter battery only its recharge current for the hours driven) so
//   that trips in a row settle, and the deepest draw then is within 20 % of what the starter
//   battery holds at the trip's coldest (common practice, no source).
// - The recommended bank is the smallest that stays above its floor, rounded up to a size to buy;
//   the recommended charger the smallest that refills it by the end of the last drive (plan-bank.ts).
// - Circuits linked to the inverter or the DC-DC charger carry the current at the worst voltage
//   (the inverter's cutoff, the charger's lowest input); every battery end is a protection point.
// - Findings come most severe first.

function partFindings(plan: PlanInput, parts: PlanParts): Finding[] {
  const findings: Finding[] = [];
  const acW = sum(plan.loads.filter((load) => load.ac).map((load) => load.watts));
  if (plan.inverter && acW > plan.inverter.ratedW) {
    const message = `The AC loads add up to ${acW} W, more than the ${plan.inverter.ratedW} W inverter supplies when they run together.`;
    findings.push({ severity: 'warning', code: 'inverter-undersized', message });
  }
  if (plan.alternator && parts.alternatorLoadA !== null && parts.alternatorLoadA > ALTERNATOR_STEADY_SHARE * plan.alternator.ratedA) {
    const over = parts.alternatorLoadA > plan.alternator.ratedA;
    const message = `The DC-DC charger's ${round(parts.dcdcInputA!)} A with the vehicle's own load makes ${round(parts.alternatorLoadA)} A, ${over ? 'more than' : 'close to'} the ${plan.alternator.ratedA} A alternator's rating${over ? '' : ` (over ${100 * ALTERNATOR_STEADY_SHARE} %, more than it gives steadily when hot)`}: choose a smaller charger, or one that limits its input current.`;
    findings.push({ severity: over ? 'critical' : 'warning', code: 'alternator-overloaded', message });
  }
  if (plan.solar?.controller === 'pwm' && parts.solarHarvest < PWM_MISMATCH_SHARE) {
    const message = `A PWM controller holds the panels at battery voltage, so only ${round(100 * parts.solarHarvest)} % of their power reaches the battery: an MPPT controller fits these panels.`;
    findings.push({ severity: 'warning', code: 'pwm-panel-mismatch', message });
  }
  return findings;
}

function refillHours(plan: PlanInput, run: BankRun, averageLoadA: number): number | null {
  if (run.bank.source === 'starter' || !plan.dcdcCharger) return null;
  const { taper } = BATTERY_CHEMISTRIES[run.bank.chemistry];
  return hoursToRefill({
    refillAh: Math.max(...run.deficitsAh),
    chargerA: plan.dcdcCharger.outputA,
    chargeEfficiency: run.physics.chargeEfficiency,
    loadA: averageLoadA,
    taper: taper && { tailAh: (1 - taper.knee) * run.bank.effectiveCapacityAh, acceptA: taper.acceptC * run.bank.ratedAh },
  });
}

/** Options of an evaluation: sizes the shop can buy, to round recommendations to. */
export interface EvaluateOptions {
  stock?: PlanStock;
}

/** The trip simulated on the starter battery, the planned or the recommended bank. */
function judgeBank(plan: PlanInput, stock: PlanStock | undefined): BankFacts {
  const parts = planParts(plan);
  const energy = dailyEnergy(plan.loads, { systemV: plan.systemV, inverterEfficiency: plan.inverter?.efficiency ?? 1 });
  const dailyWattHours = energy.wattHours + parts.inverterIdleWh;
  const model: TripModel = { plan, parts, days: tripDays(plan.trip), flows: hourlyFlows(plan, parts), stock };
  const hasAcLoads = plan.loads.some((load) => load.ac);
  const starter = starterDraw(model);
  const starterSuffices = !hasAcLoads && starter.refilled && starter.deepestAh <= starter.spareAh + 1e-9;
  const recommendedBank = recommendBank(model, minimumBankAh(model));
  const run = runBank(model, starterSuffices, recommendedBank);
  const lowestPercent = Math.min(...run.deficitsAh.map((_, i) => stateOfChargePercent(run, i)));
  return { model, run, dailyWattHours, dailyAmpHours: dailyWattHours / plan.systemV, starter, starterSuffices, hasAcLoads, recommendedBank, lowestPercent };
}

/** The plan's answer to "what battery does this vehicle need?" alone: what a list of plans shows. */
export function planVerdict(plan: PlanInput, { stock }: EvaluateOptions = {}): Verdict {
  validatePlan(plan);
  return verdictFor(judgeBank(plan, stock));
}

/** The whole electrical plan of a build: energy, state of charge over the trip, verdict, circuits, protection points and findings; stock rounds recommendations to sizes the shop can buy. */
export function evaluatePlan(plan: PlanInput, { stock }: EvaluateOptions = {}): PlanResult {
  validatePlan(plan);
  const facts = judgeBank(plan, stock);
  const { model, run, dailyWattHours, dailyAmpHours, starter, recommendedBank, lowestPercent } = facts;
  const { parts } = model;
  const averageLoadA = dailyAmpHours / 24;
  const recommendedCharger = recommendCharger(model, run);
  const hourly = run.deficitsAh.map((deficitAh, i) => ({
    day: Math.floor(i / 24) + 1,
    hour: i % 24,
    kind: model.days[Math.floor(i / 24)]!,
    storedAh: run.bank.effectiveCapacityAh - deficitAh,
    stateOfChargePercent: stateOfChargePercent(run, i),
  }));

  const { flows } = model;
  const efficiency = run.physics.chargeEfficiency;
  const parkedChargeAh = (sum(flows.solarAh) + sum(flows.shoreAh)) * efficiency;
  const drivingChargeAh = (sum(flows.solarAh) + (plan.dcdcCharger?.outputA ?? 0) * sum(flows.driveShare)) * efficiency;
  const parkedDeficitAh = dailyAmpHours - parkedChargeAh;

  const circuits = plan.circuits.map((circuit, i) => evaluateCircuit(circuit, i, plan, parts));
  const protection = protectionPoints(plan, circuits.map((circuit) => circuit.result));
  const findings: Finding[] = [...bankFindings(facts, recommendedCharger), ...partFindings(plan, parts), ...protection.findings, ...circuits.flatMap((circuit) => circuit.findings)];

  return {
    dailyWattHours,
    dailyAmpHours,
    averageLoadA,
    inverterIdleWh: parts.inverterIdleWh,
    solarDailyWh: plan.solar ? solarDailyWh(plan.solar) * parts.solarShare : 0,
    netDailyAh: { parked: parkedChargeAh - dailyAmpHours, driving: drivingChargeAh - dailyAmpHours },
    bank: run.bank,
    hourly,
    lowestStateOfChargePercent: lowestPercent,
    daysOfAutonomy: dailyAmpHours > 0 ? run.bank.usableAh / dailyAmpHours : null,
    daysOfAutonomyWithCharging: parkedDeficitAh > 0 ? run.bank.usableAh / parkedDeficitAh : null,
    driveHoursToRefill: refillHours(plan, run, averageLoadA),
    starterDrawAh: starter.deepestAh,
    recommendedBank,
    recommendedCharger,
    inverterInputA: parts.inverterInputA,
    dcdcInputA: parts.dcdcInputA,
    alternatorLoadA: parts.alternatorLoadA,
    verdict: verdictFor(facts),
    circuits: circuits.map((circuit) => circuit.result),
    protectionPoints: protection.points,
    // Stable sort: within a severity, bank findings first, then the plan's parts, protection and circuits in order.
    findings: findings.sort((a, b) => Number(a.severity === 'warning') - Number(b.severity === 'warning')),
    caution: SAFETY_CAUTION,
  };
}
