import { AbilityBuilder, createMongoAbility, subject, type ForcedSubject, type MongoAbility, type RawRuleOf } from '@casl/ability';
import { COST_FIELDS, CONTACT_FIELDS, PRICE_FIELDS } from './fields.ts';
import type { Role, Scope } from './roles.ts';

/** `plan` is the lead's part of a build: quoting, booking, cancelling, correcting after delivery. */
export type Action = 'manage' | 'read' | 'create' | 'update' | 'plan' | 'delete' | 'approve' | 'send' | 'export';
export type Subject =
  | 'all'
  | 'Region'
  | 'Location'
  | 'RoleAssignment'
  | 'AuditLog'
  | 'Mail'
  | 'CatalogItem'
  | 'Vendor'
  | 'Customer'
  | 'Vehicle'
  | 'Build'
  | 'Claim'
  | 'Report'
  | 'Reliability'
  | 'Plan';

/** A subject is named by type, or is a record tagged with CASL's `subject(type, row)`. */
export type AppAbility = MongoAbility<[Action, Subject | ForcedSubject<Exclude<Subject, 'all'>>]>;
export type AppRule = RawRuleOf<AppAbility>;
/** Rules are written against subject names with plain Mongo-style conditions. */
type RuleAbility = MongoAbility;

/** One role assignment as the rules need it: the server resolves a region to its locations. */
export interface RuleAssignment {
  role: Role;
  scope: Scope;
  regionId: number | null;
  locationId: number | null;
  /** Every location the assignment covers (one for a location, all of a region's, or all). */
  locationIds: number[];
}

export interface RulePerson {
  id: number;
  assignments: RuleAssignment[];
}

type Builder = AbilityBuilder<RuleAbility>;

/** A condition on a location-bound record; a network-wide assignment needs none. */
function atLocations(a: RuleAssignment, key = 'locationId'): Record<string, unknown> | undefined {
  return a.scope === 'network' ? undefined : { [key]: { $in: a.locationIds } };
}

const LOCATION_STAFF_ROLES: Role[] = ['technician', 'warranty_clerk'];

/** Records not bound to a location: read across the network by every role that reads them. */
const NETWORK_SUBJECTS: Subject[] = ['CatalogItem', 'Vendor'];

/** Fields a role does not read, by subject (DESIGN.md, "Roles and scopes"). */
const HIDDEN_FIELDS: Partial<Record<Role, Partial<Record<Subject, readonly string[]>>>> = {
  technician: { CatalogItem: COST_FIELDS, Build: COST_FIELDS },
  warranty_clerk: { CatalogItem: [...COST_FIELDS, ...PRICE_FIELDS], Build: [...COST_FIELDS, ...PRICE_FIELDS] },
  accountant: { Customer: CONTACT_FIELDS },
};

const grantsByRole: Record<Role, (b: Builder, a: RuleAssignment, person: RulePerson) => void> = {
  owner({ can }) {
    can('manage', 'all');
  },

  regional_manager({ can }, a) {
    const at = atLocations(a);
    can('read', 'Region', { id: a.regionId });
    can('read', 'Location', { id: { $in: a.locationIds } });
    can('read', ['Build', 'Customer', 'Vehicle', 'Claim', 'Report', 'Plan'], at);
    can('approve', 'Claim', at);
    can('read', 'Reliability', at);
    can('read', ['CatalogItem', 'Vendor']);
    can('read', 'RoleAssignment', at);
    can('read', 'RoleAssignment', { regionId: a.regionId });
    can(['create', 'delete'], 'RoleAssignment', { ...at, role: 'location_lead' });
  },

  location_lead({ can }, a) {
    const at = atLocations(a);
    can('read', 'Location', { id: { $in: a.locationIds } });
    can(['read', 'create', 'update'], ['Build', 'Customer', 'Vehicle', 'Claim', 'Plan'], at);
    can('plan', 'Build', at);
    can('send', 'Claim', at);
    can('read', 'Reliability', at);
    can('read', 'Report', at);
    // Up to the location's approval limit; a claim's subject says whether its credit is above it.
    can('approve', 'Claim', { ...at, aboveLimit: { $ne: true } });
    can('read', ['CatalogItem', 'Vendor']);
    can('read', 'RoleAssignment', at);
    can(['create', 'delete'], 'RoleAssignment', { ...at, role: { $in: LOCATION_STAFF_ROLES } });
  },

  technician({ can }, a, person) {
    const at = atLocations(a);
    can('read', 'Location', { id: { $in: a.locationIds } });
    can('read', ['Build', 'Customer', 'Vehicle'], at);
    can('update', 'Build', { ...at, leadTechnicianId: person.id });
    can(['read', 'create', 'update'], 'Plan', at);
    can('read', ['CatalogItem', 'Vendor']);
  },

  warranty_clerk({ can }, a) {
    const at = atLocations(a);
    can('read', 'Location', { id: { $in: a.locationIds } });
    can('read', ['Build', 'Customer', 'Vehicle', 'Plan'], at);
    can(['read', 'create', 'update', 'send'], 'Claim', at);
    can('read', ['CatalogItem', 'Vendor']);
  },

  accountant({ can }, a) {
    const at = atLocations(a);
    can('read', 'Region', a.scope === 'region' ? { id: a.regionId } : undefined);
    can('read', 'Location', a.scope === 'network' ? undefined : { id: { $in: a.locationIds } });
    can('read', ['Build', 'Customer', 'Vehicle', 'Claim', 'Report', 'Plan'], at);
    can('export', 'Report', at);
    can('read', ['CatalogItem', 'Vendor']);
  },
};

function grantsOf(a: RuleAssignment, person: RulePerson): AppRule[] {
  const define = grantsByRole[a.role];
  if (!define) throw new Error(`Unknown role: ${String(a.role)}`);
  const builder = new AbilityBuilder<RuleAbility>(createMongoAbility);
  define(builder, a, person);
  return builder.rules as AppRule[];
}

/**
 * Field rules with union semantics: a field stays hidden only where no other assignment of the
 * person reads the same subject with that field. A technician who also leads another shop sees
 * costs at the shop they lead and nowhere else.
 */
function fieldDenials(person: RulePerson, grants: AppRule[][]): AppRule[] {
  const { cannot, rules } = new AbilityBuilder<RuleAbility>(createMongoAbility);
  const readersOf = (subject: Subject, field: string) =>
    person.assignments.filter(
      (b, j) => !HIDDEN_FIELDS[b.role]?.[subject]?.includes(field) && createAbility(grants[j]).can('read', subject),
    );
  for (const a of person.assignments) {
    for (const [subject, fields] of Object.entries(HIDDEN_FIELDS[a.role] ?? {}) as [Subject, readonly string[]][]) {
      for (const field of fields) {
        const readers = readersOf(subject, field);
        if (readers.some((b) => b.scope === 'network' || NETWORK_SUBJECTS.includes(subject))) continue;
        const covered = new Set(readers.flatMap((b) => b.locationIds));
        const denied = a.locationIds.filter((id) => !covered.has(id));
        if (NETWORK_SUBJECTS.includes(subject) || covered.size === 0) cannot('read', subject, field);
        else if (denied.length > 0) cannot('read', subject, field, { locationId: { $in: denied } });
      }
    }
  }
  return rules as AppRule[];
}

/** The single definition of what a person may do: the union of their role assignments. */
export function defineRulesFor(person: RulePerson): AppRule[] {
  const grants = person.assignments.map((a) => grantsOf(a, person));
  return [...grants.flat(), ...fieldDenials(person, grants)];
}

/** Builds a CASL ability from rules (on the server per request, in the web after sign-in). */
export function createAbility(rules: AppRule[] = []): AppAbility {
  return createMongoAbility<AppAbility>(rules);
}

/**
 * A claim as the rules see it: its location, and whether `creditCents` (the credit to approve) is
 * above the location's approval limit. A lead approves up to the limit, the regional manager above it.
 */
export function claimRuleSubject(claim: { locationId: number; approvalLimitCents?: number }, creditCents = 0) {
  const aboveLimit = claim.approvalLimitCents !== undefined && creditCents > claim.approvalLimitCents;
  return subject('Claim', { locationId: claim.locationId, aboveLimit });
}
