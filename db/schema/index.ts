import type { AccessChangesTable } from './access-changes.ts';
import type { AuditLogTable } from './audit-log.ts';
import type { BuildEventsTable } from './build-events.ts';
import type { BuildItemsTable } from './build-items.ts';
import type { BuildCountsTable, BuildsTable } from './builds.ts';
import type { ClaimEventsTable } from './claim-events.ts';
import type { ClaimEvidenceTable } from './claim-evidence.ts';
import type { CatalogItemsTable } from './catalog-items.ts';
import type { CustomersTable } from './customers.ts';
import type { ExportsTable } from './exports.ts';
import type { VehiclesTable } from './vehicles.ts';
import type { VendorsTable } from './vendors.ts';
import type { WarrantyClaimsTable } from './warranty-claims.ts';
import type { InvitesTable } from './invites.ts';
import type { LocationsTable, MonthCloseSumsTable, MonthClosesTable, RoyaltyTermsTable, SalesTaxRatesTable } from './locations.ts';
import type { MailLogTable } from './mail-log.ts';
import type { MailSendsTable } from './mail-sends.ts';
import type { PasswordResetsTable } from './password-resets.ts';
import type { PowerPlanRevisionsTable } from './power-plan-revisions.ts';
import type { PowerPlansTable } from './power-plans.ts';
import type { RegionsTable } from './regions.ts';
import type { RoleAssignmentsTable } from './role-assignments.ts';
import type { RollupFiguresTable, RollupNetworkTable, RollupRegionTable } from './rollups.ts';
import type { SessionsTable } from './sessions.ts';
import type { SignInAttemptsTable } from './sign-in-attempts.ts';
import type {
  PlanMarginsTable,
  UnitExposureBandsNetworkTable,
  UnitExposureBandsRegionTable,
  UnitExposureBandsTable,
  UnitExposureLifetimeTable,
  UnitExposureNetworkTable,
  UnitExposureRegionTable,
  UnitExposureTable,
  UnitFailureAgesNetworkTable,
  UnitFailureAgesRegionTable,
  UnitFailureKindsNetworkTable,
  UnitFailureKindsRegionTable,
  UnitFailuresTable,
  UnitFailureWorkmanshipTable,
} from './unit-exposure.ts';
import type { UsersTable, WeeklyDigestsTable } from './users.ts';

export interface Database {
  regions: RegionsTable;
  locations: LocationsTable;
  users: UsersTable;
  roleAssignments: RoleAssignmentsTable;
  sessions: SessionsTable;
  auditLog: AuditLogTable;
  invites: InvitesTable;
  mailLog: MailLogTable;
  mailSends: MailSendsTable;
  vendors: VendorsTable;
  catalogItems: CatalogItemsTable;
  customers: CustomersTable;
  vehicles: VehiclesTable;
  builds: BuildsTable;
  buildCounts: BuildCountsTable;
  buildItems: BuildItemsTable;
  buildEvents: BuildEventsTable;
  powerPlans: PowerPlansTable;
  powerPlanRevisions: PowerPlanRevisionsTable;
  warrantyClaims: WarrantyClaimsTable;
  claimEvents: ClaimEventsTable;
  claimEvidence: ClaimEvidenceTable;
  unitExposure: UnitExposureTable;
  unitExposureBands: UnitExposureBandsTable;
  unitExposureBandsNetwork: UnitExposureBandsNetworkTable;
  unitExposureNetwork: UnitExposureNetworkTable;
  unitExposureRegion: UnitExposureRegionTable;
  unitExposureBandsRegion: UnitExposureBandsRegionTable;
  unitExposureLifetime: UnitExposureLifetimeTable;
  planMargins: PlanMarginsTable;
  unitFailures: UnitFailuresTable;
  unitFailureAgesNetwork: UnitFailureAgesNetworkTable;
  unitFailureAgesRegion: UnitFailureAgesRegionTable;
  unitFailureKindsNetwork: UnitFailureKindsNetworkTable;
  unitFailureKindsRegion: UnitFailureKindsRegionTable;
  unitFailureWorkmanship: UnitFailureWorkmanshipTable;
  rollupFigures: RollupFiguresTable;
  rollupNetwork: RollupNetworkTable;
  rollupRegion: RollupRegionTable;
  accessChanges: AccessChangesTable;
  weeklyDigests: WeeklyDigestsTable;
  royaltyTerms: RoyaltyTermsTable;
  monthCloses: MonthClosesTable;
  monthCloseSums: MonthCloseSumsTable;
  salesTaxRates: SalesTaxRatesTable;
  exports: ExportsTable;
  signInAttempts: SignInAttemptsTable;
  passwordResets: PasswordResetsTable;
}
