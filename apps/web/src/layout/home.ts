import { ROLES, type AssignmentView, type Role } from '@busbar/shared';

type Home = 'overview' | 'claims' | 'compare' | 'my-bay' | 'shop-week' | 'closes';

/**
 * Where each role lands after signing in (DESIGN.md, "home"): the owner and regional managers on
 * the comparison of their locations, leads on their shop's week, technicians on their bay, the
 * clerk on the claim queue, the accountant on the month close.
 */
const HOME_BY_ROLE: Record<Role, Home> = {
  owner: 'compare',
  regional_manager: 'compare',
  location_lead: 'shop-week',
  technician: 'my-bay',
  warranty_clerk: 'claims',
  accountant: 'closes',
};

/** The home of a person's first role in the order of ROLES (the widest work first). */
export function homeOf(assignments: Pick<AssignmentView, 'role'>[]): Home {
  const first = ROLES.find((role) => assignments.some((a) => a.role === role));
  return first ? HOME_BY_ROLE[first] : 'overview';
}
