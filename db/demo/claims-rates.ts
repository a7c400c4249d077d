import type { Category, FailureMode } from '@busbar/shared';
import type { Random } from './draw.ts';

/**
 * How the demo's installed units fail. Every figure here is invented for the demo, not measured:
 * each category fails after a Weibull-distributed time from its install, given as the shape and
 * the share of units that fail within their first year. Shape below 1 means early failures (the
 * electronics), above 1 wear-out (batteries, compressors).
 */
export interface Weibull {
  shape: number;
  firstYearShare: number;
}

export const FAILURE_RATES: Partial<Record<Category, Weibull>> = {
  house_battery: { shape: 1.6, firstYearShare: 0.015 },
  starter_battery: { shape: 2, firstYearShare: 0.03 },
  dc_dc_charger: { shape: 0.6, firstYearShare: 0.05 },
  solar_panel: { shape: 1, firstYearShare: 0.005 },
  solar_controller: { shape: 0.7, firstYearShare: 0.035 },
  inverter: { shape: 0.8, firstYearShare: 0.04 },
  battery_monitor: { shape: 0.7, firstYearShare: 0.02 },
  air_compressor: { shape: 2, firstYearShare: 0.02 },
};

/**
 * Lead-acid house batteries wear out sooner than lithium. The flooded one carries only 12 months,
 * so it is the unit that comes back past its warranty within the demo's two years.
 */
export const SKU_FAILURE_RATES: Readonly<Record<string, Weibull>> = {
  'NVB-FLD115': { shape: 2.5, firstYearShare: 0.2 },
  'NVB-AGM100': { shape: 2, firstYearShare: 0.05 },
};

/** Loose or burnt connections at a unit the shop wired: early failures, at every category but panels on the roof. */
export const WORKMANSHIP: Weibull = { shape: 0.5, firstYearShare: 0.008 };

/** Austin's installs come loose about twelve times as often as the network's (hazard × 12). */
export const WORKMANSHIP_FACTOR: Readonly<Record<string, number>> = { AUS: 12 };

/**
 * Units on builds whose power plan runs a conductor past its allowed voltage drop or its amperage
 * (drop or load band 4, plans.ts) come loose or burn at their connections about four times as often
 * (hazard × 4, on top of the shop's own factor): a hot conductor loosens its terminals.
 */
export const TIGHT_DESIGN_FACTOR = 4;

/**
 * The bad batch: TDW-DC40 chargers made in three months about a year before the clock (the
 * year and month of manufacture are the serial's first digits, so the batch is one range of
 * serial numbers) fail early and often.
 */
export const BAD_BATCH = { sku: 'TDW-DC40', monthsBeforeClock: [12, 11, 10], rate: { shape: 0.9, firstYearShare: 0.6 } } as const;

/** The serial-number prefixes of the bad batch at a clock (TW2506- to TW2508- with the clock in June 2026). */
export function badBatchPrefixes(serialPrefix: string, nowMs: number): string[] {
  const now = new Date(nowMs);
  return BAD_BATCH.monthsBeforeClock.map((back) => {
    const made = new Date(Date.UTC(now.getUTCFullYear(), now.getUTCMonth() - back, 1));
    return `${serialPrefix}${String(made.getUTCFullYear() % 100).padStart(2, '0')}${String(made.getUTCMonth() + 1).padStart(2, '0')}-`;
  });
}

/** Years to failure drawn from a Weibull with the given shape and first-year share (inverse transform); `hazardFactor` scales the hazard. */
export function yearsToFailure(random: Random, { shape, firstYearShare }: Weibull, hazardFactor = 1): number {
  const scaleYears = (hazardFactor * -Math.log(1 - firstYearShare)) ** (-1 / shape);
  return scaleYears * (-Math.log(1 - random())) ** (1 / shape);
}

/** How each category usually fails when the unit itself is at fault. */
export const VENDOR_MODES: Record<string, readonly (readonly [FailureMode, number])[]> = {
  house_battery: [['cell_or_bms_fault', 5], ['will_not_charge', 3], ['overheating', 1], ['terminal_corrosion', 1]],
  starter_battery: [['will_not_charge', 4], ['terminal_corrosion', 2], ['cell_or_bms_fault', 1]],
  dc_dc_charger: [['will_not_charge', 5], ['overheating', 3], ['firmware_fault', 2]],
  solar_panel: [['water_ingress', 3], ['physical_damage', 1], ['other', 1]],
  solar_controller: [['will_not_charge', 3], ['firmware_fault', 3], ['overheating', 1]],
  inverter: [['overheating', 3], ['firmware_fault', 2], ['other', 2]],
  battery_monitor: [['firmware_fault', 3], ['other', 2], ['water_ingress', 1]],
  air_compressor: [['overheating', 4], ['other', 3], ['water_ingress', 1]],
};

export const SYMPTOMS: Record<FailureMode, readonly string[]> = {
  will_not_charge: ['House bank stays flat after a day of driving', 'Charger shows no output with the engine running', 'Bank never gets past 60 % on solar'],
  overheating: ['Unit too hot to touch and shuts down under load', 'Smell of hot plastic from the unit; it cuts out after ten minutes', 'Fan runs constantly and the unit trips on temperature'],
  cell_or_bms_fault: ['Battery disconnects itself under a modest load', 'One cell group reads low; the BMS cuts off early', 'Capacity down to about half of its rating'],
  terminal_corrosion: ['White and green crust on the terminals; voltage drops under load', 'Corroded terminal; the lug no longer seats'],
  loose_or_burnt_connection: ['Burnt lug at the unit; the cable insulation is melted back', 'Intermittent power; a terminal nut was finger-loose', 'Scorch marks at the terminal and a loose crimp'],
  water_ingress: ['Moisture inside the housing after rain', 'Junction box full of water; output intermittent'],
  physical_damage: ['Housing cracked; the mount broke on a washboard road', 'Panel glass cracked by a branch'],
  firmware_fault: ['Display frozen; the unit ignores its settings', 'Unit resets every few minutes and loses its charge profile'],
  other: ['Unit dead; no lights, no output', 'Grinding noise and low output', 'Reads wrong by several amps'],
};

export const FOUND_HOW = [
  'Customer brought the vehicle in',
  'Customer called; unit checked in the bay the same week',
  'Found at the customer\'s seasonal check-up',
  'Customer sent photos, then came in',
] as const;
