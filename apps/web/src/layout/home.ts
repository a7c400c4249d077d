import { ROLES, type AssignmentView, type Role } from '@busbar/shared';

type Home = 'overview' | 'claims' | 'compare' | 'my-bay' | 'shop-week';

/**
 * Where each role lands after signing in (DESIGN.md, "home"): the owner and regional managers on
 * the comparison of their locations, leads on their shop's week, technicians on their bay, the
 * clerk on the claim queue; the accountant's home comes with month close, the overview until then.
 */
const HOME_BY_ROLE: Record<Role, Home> = {
  owner: 'compare',
  regional_manager: 'compare',
  location_lead: 'shop-week',
  technician: 'my-bay',
  warranty_clerk: 'claims',
  accountant: 'overview',
};

/** The home of a person's first role in the order of ROLES (the widest work first). */
export function homeOf(assignments: Pick<AssignmentView, 'role'>[]): Home {
  const first = ROLES.find((role) => assignments.some((a) => a.role === role));
  return first ? HOME_BY_ROLE[first] : 'overview';
}
