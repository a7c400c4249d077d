import { hoursToRefill } from './batteries.ts';
import { dailyEnergy, inverterInputA } from './energy.ts';
import { houseChemistry, minimumBankAh, recommendedChargerA, runBank, starterDrawAh, STARTER_SPARE_FRACTION, type TripModel } from './plan-bank.ts';
import { evaluateCircuit } from './plan-circuits.ts';
import { hourlyFlows, tripDays } from './plan-profile.ts';
import type { Finding, PlanInput, PlanResult } from './plan-types.ts';
import { validatePlan } from './plan-validate.ts';
import { bankFindings, stateOfChargePercent, verdictFor, type BankFacts } from './plan-verdict.ts';
import { SAFETY_CAUTION } from './safety.ts';
import { CONTROLLER_HARVEST, solarDailyWh } from './solar.ts';

const sum = (values: number[]) => values.reduce((a, b) => a + b, 0);

// How a plan is judged:
// - The trip is simulated hour by hour from a full bank: the parked days as one stretch (the
//   hardest case for the bank), then the driving days; the day's profile is in plan-profile.ts.
// - No second battery is needed when no load runs on AC and the deepest draw over the trip, with
//   the alternator refilling the starter battery on each drive, is within 20 % of the starter
//   battery's rating (common practice, no source).
// - The recommended bank is the smallest that stays above its floor; the recommended charger the
//   smallest that refills it by the end of the last drive (plan-bank.ts).
// - Findings come most severe first.

/** The whole electrical plan of a build: energy, state of charge over the trip, verdict, circuits and findings. */
export function evaluatePlan(plan: PlanInput): PlanResult {
  validatePlan(plan);
  const inverterEfficiency = plan.inverter?.efficiency ?? 1;
  const energy = dailyEnergy(plan.loads, { systemV: plan.systemV, inverterEfficiency });
  const averageLoadA = energy.ampHours / 24;
  const model: TripModel = { plan, days: tripDays(plan.trip), flows: hourlyFlows(plan), averageLoadA };
  const hasAcLoads = plan.loads.some((load) => load.ac);
  const drawAh = starterDrawAh(model);
  const starterSuffices = !hasAcLoads && drawAh <= plan.starterBattery.capacityAh * STARTER_SPARE_FRACTION;
  const recommendedBankAh = minimumBankAh(model);
  const run = runBank(model, starterSuffices, recommendedBankAh);
  const chargerA = recommendedChargerA(model, run);
  const hourly = run.deficitsAh.map((deficitAh, i) => ({
    day: Math.floor(i / 24) + 1,
    hour: i % 24,
    kind: model.days[Math.floor(i / 24)]!,
    storedAh: run.bank.effectiveCapacityAh - deficitAh,
    stateOfChargePercent: stateOfChargePercent(run, i),
  }));
  const lowestPercent = Math.min(...hourly.map((state) => state.stateOfChargePercent));
  const facts: BankFacts = {
    model,
    run,
    dailyWattHours: energy.wattHours,
    dailyAmpHours: energy.ampHours,
    starterDrawAh: drawAh,
    starterSuffices,
    hasAcLoads,
    recommendedBankAh,
    recommendedChargerA: chargerA,
    lowestPercent,
  };

  const { flows } = model;
  const efficiency = run.chargeEfficiency;
  const parkedChargeAh = (sum(flows.solarAh) + sum(flows.shoreAh)) * efficiency;
  const drivingChargeAh = (sum(flows.solarAh) + (plan.dcdcCharger?.outputA ?? 0) * sum(flows.driveShare)) * efficiency;
  const parkedDeficitAh = energy.ampHours - parkedChargeAh;

  const findings: Finding[] = bankFindings(facts);
  const inverterA = plan.inverter ? inverterInputA({ acW: plan.inverter.ratedW, batteryV: plan.systemV, efficiency: plan.inverter.efficiency }) : null;
  const acW = sum(plan.loads.filter((load) => load.ac).map((load) => load.watts));
  if (plan.inverter && acW > plan.inverter.ratedW) {
    const message = `The AC loads add up to ${acW} W, more than the ${plan.inverter.ratedW} W inverter supplies when they run together.`;
    findings.push({ severity: 'warning', code: 'inverter-undersized', message });
  }
  const circuits = plan.circuits.map((circuit, i) => evaluateCircuit(circuit, i, plan));
  findings.push(...circuits.flatMap((circuit) => circuit.findings));

  return {
    dailyWattHours: energy.wattHours,
    dailyAmpHours: energy.ampHours,
    averageLoadA,
    solarDailyWh: plan.solar ? solarDailyWh(plan.solar) * CONTROLLER_HARVEST[plan.solar.controller] : 0,
    netDailyAh: { parked: parkedChargeAh - energy.ampHours, driving: drivingChargeAh - energy.ampHours },
    bank: run.bank,
    hourly,
    lowestStateOfChargePercent: lowestPercent,
    daysOfAutonomy: energy.ampHours > 0 ? run.bank.usableAh / energy.ampHours : null,
    daysOfAutonomyWithCharging: parkedDeficitAh > 0 ? run.bank.usableAh / parkedDeficitAh : null,
    driveHoursToRefill:
      run.bank.source === 'starter' || !plan.dcdcCharger
        ? null
        : hoursToRefill({ refillAh: Math.max(...run.deficitsAh), chargerA: plan.dcdcCharger.outputA, chargeEfficiency: efficiency, loadA: averageLoadA }),
    recommendedBankAh,
    recommendedBankChemistry: houseChemistry(plan),
    recommendedChargerA: chargerA,
    inverterInputA: inverterA,
    verdict: verdictFor(facts),
    circuits: circuits.map((circuit) => circuit.result),
    // Stable sort: within a severity, bank findings first, then circuits in order.
    findings: findings.sort((a, b) => Number(a.severity === 'warning') - Number(b.severity === 'warning')),
    caution: SAFETY_CAUTION,
  };
}
