import type { AuditLogTable } from './audit-log.ts';
import type { BuildEventsTable } from './build-events.ts';
import type { BuildItemsTable } from './build-items.ts';
import type { BuildsTable } from './builds.ts';
import type { CatalogItemsTable } from './catalog-items.ts';
import type { CustomersTable } from './customers.ts';
import type { VehiclesTable } from './vehicles.ts';
import type { VendorsTable } from './vendors.ts';
import type { InvitesTable } from './invites.ts';
import type { LocationsTable } from './locations.ts';
import type { MailLogTable } from './mail-log.ts';
import type { PowerPlanRevisionsTable } from './power-plan-revisions.ts';
import type { PowerPlansTable } from './power-plans.ts';
import type { RegionsTable } from './regions.ts';
import type { RoleAssignmentsTable } from './role-assignments.ts';
import type { SessionsTable } from './sessions.ts';
import type { UsersTable } from './users.ts';

export interface Database {
  regions: RegionsTable;
  locations: LocationsTable;
  users: UsersTable;
  roleAssignments: RoleAssignmentsTable;
  sessions: SessionsTable;
  auditLog: AuditLogTable;
  invites: InvitesTable;
  mailLog: MailLogTable;
  vendors: VendorsTable;
  catalogItems: CatalogItemsTable;
  customers: CustomersTable;
  vehicles: VehiclesTable;
  builds: BuildsTable;
  buildItems: BuildItemsTable;
  buildEvents: BuildEventsTable;
  powerPlans: PowerPlansTable;
  powerPlanRevisions: PowerPlanRevisionsTable;
}
