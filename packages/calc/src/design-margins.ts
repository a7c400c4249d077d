import type { PlanResult } from './plan-types.ts';

/** 1 the most margin, 4 past the limit. */
export type MarginBand = 1 | 2 | 3 | 4;

/**
 * Where each band ends: a value below the first bound is band 1, below the second band 2, up to and
 * including the third band 3, above it band 4. A value exactly at the limit is within it, as the
 * plan's own findings see it (a drop or a current over the limit is a finding, one at it is not).
 * Drop and load are shares of the limit; discharge is percent of the bank (Busbar's own bands).
 */
export const MARGIN_BAND_BOUNDS = {
  drop: [0.5, 0.8, 1],
  load: [0.5, 0.8, 1],
  discharge: [30, 50, 80],
} as const;

/** How close a plan runs to its limits: the band of each measure and the figure it was read from. */
export interface DesignMargins {
  dropBand: MarginBand;
  loadBand: MarginBand;
  dischargeBand: MarginBand;
  /** The tightest circuit's voltage drop over the drop it is allowed (3 % critical, 10 % other); Infinity when a circuit has no conductor. */
  dropShare: number;
  /** The tightest circuit's current over its conductor's derated amperage; Infinity when a circuit has no conductor. */
  loadShare: number;
  /** 100 − the house bank's lowest state of charge on the planned trip, %. */
  deepestDischargePercent: number;
}

/** The band of a value against its three bounds (see MARGIN_BAND_BOUNDS). */
export function marginBand(value: number, [first, second, limit]: readonly [number, number, number]): MarginBand {
  if (value < first) return 1;
  if (value < second) return 2;
  return value <= limit ? 3 : 4;
}

/**
 * The design margins of an evaluated plan, or null when a measure cannot be known: a plan without
 * circuits says nothing of drop or load, and one without a planned house bank (the starter battery
 * or a bank Busbar only recommends) says nothing of the bank fitted. Such a build counts as having
 * no plan rather than being given a margin it may not have. A circuit without a conductor (none
 * fitted and none fits) is past a limit, which one unknown: both its drop and its load count as
 * past the limit, so no margin is reported that is not there.
 */
export function designMargins(result: PlanResult): DesignMargins | null {
  if (result.circuits.length === 0 || result.bank.source !== 'planned') return null;
  let dropShare = 0;
  let loadShare = 0;
  for (const circuit of result.circuits) {
    const conductor = circuit.conductor;
    dropShare = Math.max(dropShare, conductor ? conductor.dropPercent / circuit.maxDropPercent : Infinity);
    loadShare = Math.max(loadShare, conductor ? circuit.currentA / conductor.ampacityA : Infinity);
  }
  const deepestDischargePercent = 100 - result.lowestStateOfChargePercent;
  return {
    dropBand: marginBand(dropShare, MARGIN_BAND_BOUNDS.drop),
    loadBand: marginBand(loadShare, MARGIN_BAND_BOUNDS.load),
    dischargeBand: marginBand(deepestDischargePercent, MARGIN_BAND_BOUNDS.discharge),
    dropShare,
    loadShare,
    deepestDischargePercent,
  };
}
