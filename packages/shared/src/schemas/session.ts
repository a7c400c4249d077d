import { z } from 'zod';
import type { AppRule } from '../ability.ts';
import { ROLES, SCOPES } from '../roles.ts';
import { emailSchema } from './common.ts';

export const signInBody = z.strictObject({
  email: emailSchema,
  password: z.string().min(1, 'Enter your password').max(200),
});
export type SignInBody = z.infer<typeof signInBody>;

export const assignmentView = z.object({
  id: z.number(),
  role: z.enum(ROLES),
  scope: z.enum(SCOPES),
  regionId: z.number().nullable(),
  regionName: z.string().nullable(),
  locationId: z.number().nullable(),
  locationCode: z.string().nullable(),
  locationName: z.string().nullable(),
});
export type AssignmentView = z.infer<typeof assignmentView>;

export interface SessionPerson {
  id: number;
  email: string;
  name: string;
}

/** What sign-in and `GET /api/session` answer. */
export interface SessionView {
  person: SessionPerson;
  assignments: AssignmentView[];
  rules: AppRule[];
  /** The server's date (YYYY-MM-DD, UTC), so screens count months from the same day as the figures. */
  today: string;
}
