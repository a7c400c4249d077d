import type { Category, RollupGrain } from '@busbar/shared';

type Camel<S extends string> = S extends `${infer Head}_${infer Tail}` ? `${Head}${Capitalize<Camel<Tail>>}` : S;

/** Delivered builds with at least one component of each category: `mixHouseBattery`, `mixDcDcCharger`, … */
export type JobMixColumns = { [C in Category as `mix${Capitalize<Camel<C>>}`]: number };

/**
 * The sums the roll-up figures are made of, per grain, period and location (migration 021).
 * Period keys: day YYYY-MM-DD, week the YYYY-MM-DD of its Monday, month YYYY-MM, quarter YYYY-Qn, year YYYY.
 */
export interface RollupFiguresTable extends JobMixColumns {
  grain: RollupGrain;
  period: string;
  locationId: number;
  buildsDelivered: number;
  /** Builds booked for a day of the period and not cancelled. */
  buildsBooked: number;
  revenueCents: number;
  partsCostCents: number;
  /** Labor hours of the delivered builds, in hundredths of an hour (each build's hours rounded). */
  laborCentihours: number;
  claimsOpened: number;
  /** Claim labor at the build's rate plus credit asked of the vendor and not received, of the claims logged in the period. */
  warrantyCostCents: number;
  creditsReceivedCents: number;
}

/** The same sums over every location of the network, per grain and period (migration 042). */
export type RollupNetworkTable = Omit<RollupFiguresTable, 'locationId'>;

/** The same sums over each region's locations, per grain, period and region (migration 042). */
export interface RollupRegionTable extends RollupNetworkTable {
  regionId: number;
}
