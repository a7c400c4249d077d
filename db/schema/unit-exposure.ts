import type { GeneratedAlways } from 'kysely';
import type { Coverage, FailureMode } from '@busbar/shared';

/** Reliability counts per catalog item, location and install month (YYYY-MM) (migration 019). */
export interface UnitExposureTable {
  catalogItemId: number;
  locationId: number;
  installedMonth: string;
  units: number;
  /** Σ quantity × install day (days since 1970-01-01, UTC). */
  installedDaySum: number;
  failures: number;
  failedInstalledDaySum: number;
  failedDaySum: number;
  /** Failures within the unit's warranty months. */
  warrantyFailures: number;
}

/** The same counts for units on planned builds, per design-margin measure (1 drop, 2 load, 3 discharge) and band (1–4). */
export type UnitExposureBandsTable = UnitExposureTable & { measure: number; band: number };

/** The same counts summed over every location, per catalog item and install month. */
export type UnitExposureNetworkTable = Omit<UnitExposureTable, 'locationId'>;

/** The bands summed over every location. */
export type UnitExposureBandsNetworkTable = Omit<UnitExposureBandsTable, 'locationId'>;

/** The same counts summed over the locations of each region (migration 036). */
export type UnitExposureRegionTable = UnitExposureNetworkTable & { regionId: number };

/** The same counts per catalog item and location over every install month (migration 038). */
export type UnitExposureLifetimeTable = Omit<UnitExposureTable, 'installedMonth'>;

/** The bands summed over the locations of each region. */
export type UnitExposureBandsRegionTable = UnitExposureBandsNetworkTable & { regionId: number };

/** How close a build's power plan runs to its limits, in bands: 1 the most margin, 4 past the limit. */
export interface PlanMarginsTable {
  buildId: number;
  dropBand: number;
  loadBand: number;
  dischargeBand: number;
}

/** One failure (a warranty claim) of an installed unit, with the unit's install day (days since 1970-01-01, UTC). */
export interface UnitFailuresTable {
  claimId: number;
  buildItemId: number;
  buildId: number;
  catalogItemId: number;
  locationId: number;
  installedDay: number;
  failedDay: number;
  failureMode: FailureMode;
  coverage: Coverage;
  /** failedDay − installedDay, worked out by SQLite. */
  ageDays: GeneratedAlways<number>;
}

/** Failures per catalog item and age in days (failed day − install day), over every location (migration 043). */
export interface UnitFailureAgesNetworkTable {
  catalogItemId: number;
  ageDays: number;
  failures: number;
}

/** The same per region. */
export type UnitFailureAgesRegionTable = UnitFailureAgesNetworkTable & { regionId: number };

/** Failures per catalog item, coverage and failure mode, over every location (migration 043). */
export interface UnitFailureKindsNetworkTable {
  catalogItemId: number;
  coverage: Coverage;
  failureMode: FailureMode;
  failures: number;
}

/** The same per region. */
export type UnitFailureKindsRegionTable = UnitFailureKindsNetworkTable & { regionId: number };

/** Claims under the shop's own workmanship warranty per catalog item and location (migration 046). */
export interface UnitFailureWorkmanshipTable {
  catalogItemId: number;
  locationId: number;
  failures: number;
}
