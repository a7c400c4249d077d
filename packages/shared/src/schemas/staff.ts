import { z } from 'zod';
import { ROLE_SCOPES, ROLES, scopeFor } from '../roles.ts';
import { emailSchema, idSchema, newPasswordSchema, optionalText, pageQuery, personNameSchema } from './common.ts';
import type { AssignmentView } from './session.ts';

export const PERSON_STATUSES = ['active', 'invited', 'inactive'] as const;
export type PersonStatus = (typeof PERSON_STATUSES)[number];

/** A role at a scope: a location, a region, or neither (the whole network). */
const roleAtScope = {
  role: z.enum(ROLES, { error: 'Choose a role' }),
  locationId: idSchema.nullish(),
  regionId: idSchema.nullish(),
};

function checkScope(value: { role: (typeof ROLES)[number]; locationId?: number | null; regionId?: number | null }, ctx: z.RefinementCtx) {
  if (scopeFor(value.role, value) !== null) return;
  // Name the field given at the wrong scope, or else the one this role needs.
  const given = value.locationId != null ? 'locationId' : value.regionId != null ? 'regionId' : null;
  const needed = ROLE_SCOPES[value.role].includes('location') ? 'locationId' : 'regionId';
  const message = given ? 'This role cannot be held at that scope' : needed === 'locationId' ? 'Choose a location' : 'Choose a region';
  ctx.addIssue({ code: 'custom', path: [given ?? needed], message });
}

export const grantRoleBody = z.strictObject(roleAtScope).superRefine(checkScope);
export type GrantRoleBody = z.infer<typeof grantRoleBody>;

export const inviteBody = z
  .strictObject({ email: emailSchema, name: personNameSchema, ...roleAtScope })
  .superRefine(checkScope);
export type InviteBody = z.infer<typeof inviteBody>;

export const staffQuery = z.strictObject({
  locationId: idSchema.optional(),
  status: z.enum([...PERSON_STATUSES, 'all']).default('all'),
  q: optionalText(100).optional(),
  ...pageQuery,
});
export type StaffQuery = z.infer<typeof staffQuery>;

export const roleParams = z.strictObject({ id: idSchema, assignmentId: idSchema });

/** Invite tokens are 32 random bytes in base64url. */
export const inviteToken = z.string().regex(/^[A-Za-z0-9_-]{43}$/, 'This invite link is not valid');
export const inviteTokenParams = z.strictObject({ token: inviteToken });
export const acceptInviteBody = z.strictObject({ token: inviteToken, password: newPasswordSchema });
export type AcceptInviteBody = z.infer<typeof acceptInviteBody>;

/** A member of staff as one viewer sees them: only the assignments the viewer may read. */
export interface StaffPerson {
  id: number;
  email: string;
  name: string;
  status: PersonStatus;
  assignments: AssignmentView[];
  lastSignInAt: string | null;
  /** Whether the viewer may deactivate, reactivate or re-invite this person: they could remove every role held. */
  canManage: boolean;
}

export interface InviteView {
  email: string;
  name: string;
  expiresAt: string;
}
