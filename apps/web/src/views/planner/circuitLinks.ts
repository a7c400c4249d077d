import type { BatteryName, CircuitLink } from '@busbar/calc';

/** What a linked circuit feeds, in words. */
export const LINK_LABELS: Record<CircuitLink, string> = {
  'inverter-feed': 'Inverter feed',
  'dcdc-input': 'DC-DC charger input',
  'dcdc-output': 'DC-DC charger output',
};

/** Where a linked circuit's current comes from, for the line under it. */
export const LINK_SOURCES: Record<CircuitLink, string> = {
  'inverter-feed': "the inverter's full rating at its cutoff voltage",
  'dcdc-input': "the charger's draw at its lowest input voltage",
  'dcdc-output': "the charger's output",
};

export const BATTERY_LABELS: Record<BatteryName, string> = { house: 'House battery', starter: 'Starter battery' };

/** The battery a linked circuit leaves or reaches, as the computation assumes when the plan does not say. */
export const LINK_BATTERIES: Record<CircuitLink, { fromBattery?: BatteryName; toBattery?: BatteryName }> = {
  'inverter-feed': { fromBattery: 'house' },
  'dcdc-input': { fromBattery: 'starter' },
  'dcdc-output': { toBattery: 'house' },
};
