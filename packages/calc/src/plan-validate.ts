import { INSULATION_RATINGS_C } from './ampacity.ts';
import { CHEMISTRIES } from './batteries.ts';
import { checkNumber, checkOneOf } from './checks.ts';
import { CIRCUIT_LINKS } from './plan-defaults.ts';
import type { BatteryName, CircuitLink, PlanInput, PlanLoad } from './plan-types.ts';
import { checkConductorSize } from './sizes.ts';

// Bounds past which an input is a typing slip rather than a vehicle.
const MAX_TRIP_DAYS = 90;
const MAX_BANK_AH = 5000;
const MAX_CURRENT_A = 2000;
const MAX_LENGTH_M = 100;

const BATTERIES: readonly BatteryName[] = ['house', 'starter'];

function checkLink(plan: PlanInput, link: CircuitLink, field: string): void {
  checkOneOf(field, link, CIRCUIT_LINKS);
  if (link === 'inverter-feed' && !plan.inverter) throw new RangeError(`${field}: the plan has no inverter to feed`);
  if (link !== 'inverter-feed' && !plan.dcdcCharger) throw new RangeError(`${field}: the plan has no DC-DC charger`);
}

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
  if (plan.conductorTemperatureC !== undefined) checkNumber('conductorTemperatureC', plan.conductorTemperatureC, { min: 20, max: 105 });
  if (plan.inverter) {
    checkNumber('inverter.ratedW', plan.inverter.ratedW, { above: 0, max: 10_000 });
    checkNumber('inverter.efficiency', plan.inverter.efficiency, { above: 0, max: 1 });
    if (plan.inverter.cutoffV !== undefined) checkNumber('inverter.cutoffV', plan.inverter.cutoffV, { above: 0, max: plan.systemV * 1.25 });
    if (plan.inverter.idleW !== undefined) checkNumber('inverter.idleW', plan.inverter.idleW, { min: 0, max: plan.inverter.ratedW });
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
  if (plan.starterBattery.rechargeA !== undefined) checkNumber('starterBattery.rechargeA', plan.starterBattery.rechargeA, { above: 0, max: MAX_CURRENT_A });
  if (plan.alternator) {
    checkNumber('alternator.ratedA', plan.alternator.ratedA, { above: 0, max: MAX_CURRENT_A });
    if (plan.alternator.vehicleLoadA !== undefined) checkNumber('alternator.vehicleLoadA', plan.alternator.vehicleLoadA, { min: 0, max: MAX_CURRENT_A });
  }
  if (plan.dcdcCharger) {
    checkNumber('dcdcCharger.outputA', plan.dcdcCharger.outputA, { above: 0, max: MAX_CURRENT_A });
    if (plan.dcdcCharger.efficiency !== undefined) checkNumber('dcdcCharger.efficiency', plan.dcdcCharger.efficiency, { above: 0, max: 1 });
    if (plan.dcdcCharger.minInputV !== undefined) checkNumber('dcdcCharger.minInputV', plan.dcdcCharger.minInputV, { above: 0, max: plan.systemV * 1.25 });
  }
  if (plan.solar) {
    checkNumber('solar.arrayW', plan.solar.arrayW, { min: 0, max: 10_000 });
    checkNumber('solar.peakSunHours', plan.solar.peakSunHours, { min: 0, max: 12 });
    checkOneOf('solar.controller', plan.solar.controller, ['mppt', 'pwm']);
    if (plan.solar.lossFraction !== undefined) checkNumber('solar.lossFraction', plan.solar.lossFraction, { min: 0, max: 0.9 });
    if (plan.solar.panelVmp !== undefined) checkNumber('solar.panelVmp', plan.solar.panelVmp, { above: 0, max: 100 });
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
  if (trip.lowestC !== undefined) checkNumber('trip.lowestC', trip.lowestC, { min: -50, max: 60 });
  if (trip.highestC !== undefined) checkNumber('trip.highestC', trip.highestC, { min: trip.lowestC ?? -50, max: 60 });
  plan.circuits.forEach((circuit, i) => {
    const field = `circuits[${i}]`;
    checkNumber(`${field}.oneWayLengthM`, circuit.oneWayLengthM, { above: 0, max: MAX_LENGTH_M });
    if (circuit.link !== undefined) checkLink(plan, circuit.link, `${field}.link`);
    else checkNumber(`${field}.currentA`, circuit.currentA ?? Number.NaN, { above: 0, max: MAX_CURRENT_A });
    checkOneOf(`${field}.insulationC`, circuit.insulationC, INSULATION_RATINGS_C);
    checkNumber(`${field}.bundledConductors`, circuit.bundledConductors ?? 1, { min: 1, max: 100, integer: true });
    if (circuit.size !== undefined) checkConductorSize(`${field}.size`, circuit.size);
    if (circuit.fuseA !== undefined) checkNumber(`${field}.fuseA`, circuit.fuseA, { above: 0, max: 1000 });
    if (circuit.fromBattery !== undefined) checkOneOf(`${field}.fromBattery`, circuit.fromBattery, BATTERIES);
    if (circuit.toBattery !== undefined) checkOneOf(`${field}.toBattery`, circuit.toBattery, BATTERIES);
    if (circuit.fuseFromBatteryMm !== undefined) checkNumber(`${field}.fuseFromBatteryMm`, circuit.fuseFromBatteryMm, { min: 0, max: 5000 });
    if (circuit.fuseToBatteryMm !== undefined) checkNumber(`${field}.fuseToBatteryMm`, circuit.fuseToBatteryMm, { min: 0, max: 5000 });
  });
}
