import type { AppAbility, BuildView } from '@busbar/shared';
import { subject } from '@casl/ability';
import { buildSubject } from '../builds/buildAccess.ts';

/** Plans of a location as a CASL subject. */
export const planSubject = (locationId: number) => subject('Plan', { locationId });

/**
 * May the person change this build's power plan? Planning is work on the build (its lead
 * technician or the lead); after delivery only the lead corrects it; a cancelled build is closed.
 */
export function canEditBuildPlan(ability: AppAbility, build: BuildView, hasPlan: boolean): boolean {
  if (build.status === 'cancelled') return false;
  if (!ability.can(hasPlan ? 'update' : 'create', planSubject(build.locationId))) return false;
  return ability.can(build.status === 'delivered' ? 'plan' : 'update', buildSubject(build));
}

/** May the person see the power plans of a location at all? */
export const canReadPlans = (ability: AppAbility, locationId: number) => ability.can('read', planSubject(locationId));
