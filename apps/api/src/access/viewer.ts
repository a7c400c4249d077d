import type { Db } from '@busbar/db';
import { createAbility, defineRulesFor, type AppAbility, type AppRule, type AssignmentView, type RuleAssignment } from '@busbar/shared';
import { assignmentsOf } from '../queries/assignments.ts';
import type { LocationScope } from './locations.ts';

/** The signed-in person with what they may do, built fresh for every request. */
export interface Viewer {
  id: number;
  email: string;
  name: string;
  assignments: AssignmentView[];
  rules: AppRule[];
  ability: AppAbility;
  /** Every location of the network when the viewer was loaded, and the region of each. */
  locationIds: number[];
  regionOf: Map<number, number>;
  /** Where the person may do what, worked out as first asked (see locationScope). */
  scopes: Map<string, LocationScope>;
}

/** Resolves each assignment to the locations it covers, as defineRulesFor needs. */
function toRuleAssignments(views: AssignmentView[], locations: { id: number; regionId: number }[]): RuleAssignment[] {
  return views.map((a) => ({
    role: a.role,
    scope: a.scope,
    regionId: a.regionId,
    locationId: a.locationId,
    locationIds:
      a.scope === 'network'
        ? locations.map((l) => l.id)
        : a.scope === 'region'
          ? locations.filter((l) => l.regionId === a.regionId).map((l) => l.id)
          : [a.locationId!],
  }));
}

/** Loads an active person and their ability; null when they do not exist or may not sign in. */
export async function loadViewer(db: Db, userId: number): Promise<Viewer | null> {
  const user = await db
    .selectFrom('users')
    .select(['id', 'email', 'name'])
    .where('id', '=', userId)
    .where('status', '=', 'active')
    .executeTakeFirst();
  if (!user) return null;
  const [assignments, locations] = await Promise.all([
    assignmentsOf(db, [userId]),
    db.selectFrom('locations').select(['id', 'regionId']).execute(),
  ]);
  const views = assignments.map(({ userId: _, ...view }) => view);
  const rules = defineRulesFor({ id: user.id, assignments: toRuleAssignments(views, locations) });
  return { ...user, assignments: views, rules, ability: createAbility(rules), locationIds: locations.map((l) => l.id), regionOf: new Map(locations.map((l) => [l.id, l.regionId])), scopes: new Map() };
}
