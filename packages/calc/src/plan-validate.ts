import { INSULATION_RATINGS_C } from './ampacity.ts';
import { CHEMISTRIES } from './batteries.ts';
import { checkNumber, checkOneOf } from './checks.ts';
import type { PlanInput, PlanLoad } from './plan-types.ts';
import { checkConductorSize } from './sizes.ts';

// Bounds past which an input is a typing slip rather than a vehicle.
const MAX_TRIP_DAYS = 90;
const MAX_BANK_AH = 5000;
const MAX_CURRENT_A = 2000;
const MAX_LENGTH_M = 100;

function checkLoad(load: PlanLoad, field: string): void {
  checkNumber(`${field}.watts`, load.watts, { above: 0, max: 10_000 });
  checkNumber(`${field}.hoursPerDay`, load.hoursPerDay, { min: 0, max: 24 });
  checkNumber(`${field}.dutyCycle`, load.dutyCycle ?? 1, { above: 0, max: 1 });
  if (load.activeHours === undefined) return;
  if (load.activeHours.length === 0) throw new RangeError(`${field}.activeHours must list at least one hour`);
  load.activeHours.forEach((hour, i) => checkNumber(`${field}.activeHours[${i}]`, hour, { min: 0, max: 23, integer: true }));
  if (new Set(load.activeHours).size !== load.activeHours.length) throw new RangeError(`${field}.activeHours lists an hour twice`);
  if (load.hoursPerDay > load.activeHours.length)
    throw new RangeError(`${field}.hoursPerDay must fit in its ${load.activeHours.length} active hours; got ${load.hoursPerDay}`);
}

/** Rejects a plan with a missing, absurd or contradictory input, naming the field. */
export function validatePlan(plan: PlanInput): void {
  checkOneOf('systemV', plan.systemV, [12, 24]);
  checkOneOf('gauge', plan.gauge, ['awg', 'mm2']);
  plan.loads.forEach((load, i) => checkLoad(load, `loads[${i}]`));
  if (plan.inverter) {
    checkNumber('inverter.ratedW', plan.inverter.ratedW, { above: 0, max: 10_000 });
    checkNumber('inverter.efficiency', plan.inverter.efficiency, { above: 0, max: 1 });
  } else if (plan.loads.some((load) => load.ac)) {
    throw new RangeError('inverter must be given when a load runs on AC');
  }
  if (plan.bank) {
    checkOneOf('bank.chemistry', plan.bank.chemistry, CHEMISTRIES);
    checkNumber('bank.capacityAh', plan.bank.capacityAh, { above: 0, max: MAX_BANK_AH });
    if (plan.bank.depthOfDischarge !== undefined) checkNumber('bank.depthOfDischarge', plan.bank.depthOfDischarge, { above: 0, max: 1 });
    if (plan.bank.peukertExponent !== undefined) checkNumber('bank.peukertExponent', plan.bank.peukertExponent, { min: 1, max: 2 });
    if (plan.bank.ratedHours !== undefined) checkNumber('bank.ratedHours', plan.bank.ratedHours, { above: 0, max: 100 });
  }
  checkNumber('starterBattery.capacityAh', plan.starterBattery.capacityAh, { above: 0, max: MAX_BANK_AH });
  if (plan.dcdcCharger) checkNumber('dcdcCharger.outputA', plan.dcdcCharger.outputA, { above: 0, max: MAX_CURRENT_A });
  if (plan.solar) {
    checkNumber('solar.arrayW', plan.solar.arrayW, { min: 0, max: 10_000 });
    checkNumber('solar.peakSunHours', plan.solar.peakSunHours, { min: 0, max: 12 });
    checkOneOf('solar.controller', plan.solar.controller, ['mppt', 'pwm']);
    if (plan.solar.lossFraction !== undefined) checkNumber('solar.lossFraction', plan.solar.lossFraction, { min: 0, max: 0.9 });
  }
  if (plan.shoreCharger) {
    checkNumber('shoreCharger.outputA', plan.shoreCharger.outputA, { above: 0, max: MAX_CURRENT_A });
    checkNumber('shoreCharger.hoursPerParkedDay', plan.shoreCharger.hoursPerParkedDay, { min: 0, max: 24 });
  }
  const { trip } = plan;
  checkNumber('trip.daysParked', trip.daysParked, { min: 0, max: MAX_TRIP_DAYS, integer: true });
  checkNumber('trip.daysDriving', trip.daysDriving, { min: 0, max: MAX_TRIP_DAYS, integer: true });
  const tripDays = trip.daysParked + trip.daysDriving;
  if (tripDays < 1 || tripDays > MAX_TRIP_DAYS) throw new RangeError(`trip must last 1 to ${MAX_TRIP_DAYS} days; got ${tripDays}`);
  checkNumber('trip.driveStartHour', trip.driveStartHour ?? 9, { min: 0, max: 23, integer: true });
  checkNumber('trip.driveHoursPerDay', trip.driveHoursPerDay, { min: 0, max: 24 - (trip.driveStartHour ?? 9) });
  plan.circuits.forEach((circuit, i) => {
    const field = `circuits[${i}]`;
    checkNumber(`${field}.oneWayLengthM`, circuit.oneWayLengthM, { above: 0, max: MAX_LENGTH_M });
    checkNumber(`${field}.currentA`, circuit.currentA, { above: 0, max: MAX_CURRENT_A });
    checkOneOf(`${field}.insulationC`, circuit.insulationC, INSULATION_RATINGS_C);
    checkNumber(`${field}.bundledConductors`, circuit.bundledConductors ?? 1, { min: 1, max: 100, integer: true });
    if (circuit.size !== undefined) checkConductorSize(`${field}.size`, circuit.size);
    if (circuit.fuseA !== undefined) checkNumber(`${field}.fuseA`, circuit.fuseA, { above: 0, max: 1000 });
  });
}
