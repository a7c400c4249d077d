import type { PlanCircuit, PlanInput } from '@busbar/calc';

// A 20 A feeder run 3 m each way (6 m round trip) with 105 °C insulation: 8 AWG (0.778 Ω/kft at
// 75 °C) drops 20 × 6 × 0.778 / 304.8 = 0.306 V, 2.55 % of 12 V, 85 % of the 3 % a critical circuit
// may drop (drop band 3); 10 AWG (1.24 Ω/kft) drops 4.07 %, 136 % of it (band 4). 8 AWG carries 80 A
// at 105 °C: 25 % of it (load band 1).
export const feeder: PlanCircuit = { from: 'House battery', to: 'Fuse block', oneWayLengthM: 3, currentA: 20, critical: true, insulationC: 105, size: { awg: '8' } };

/** 40 Wh a day of lights over two parked days on a 100 Ah LiFePO4 bank: about 7 Ah, 7 % of it (discharge band 1). */
export const feederPlan: PlanInput = {
  systemV: 12,
  gauge: 'awg',
  loads: [{ name: 'LED lights', watts: 10, hoursPerDay: 4, activeHours: [19, 20, 21, 22] }],
  bank: { chemistry: 'lifepo4', capacityAh: 100 },
  starterBattery: { capacityAh: 70 },
  dcdcCharger: { outputA: 25 },
  trip: { daysParked: 2, daysDriving: 1, driveHoursPerDay: 3 },
  circuits: [feeder],
};
