import type { Generated } from 'kysely';
import type { Role, Scope } from '@busbar/shared';

export interface RoleAssignmentsTable {
  id: Generated<number>;
  userId: number;
  role: Role;
  scope: Scope;
  regionId: number | null;
  locationId: number | null;
  createdAt: string;
  createdBy: number | null;
}
