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
  /** Whether they get the weekly e-mail of last week's figures (sent to leads and regional managers). */
  weeklyDigest: boolean;
}

/** A person's own settings, changed by themselves. */
export const sessionSettingsBody = z.strictObject({ weeklyDigest: z.boolean({ error: 'Say whether you want the weekly e-mail' }) });
export type SessionSettingsBody = z.infer<typeof sessionSettingsBody>;

/** What sign-in and `GET /api/session` answer. */
export interface SessionView {
  person: SessionPerson;
  assignments: AssignmentView[];
  rules: AppRule[];
  /** The server's date (YYYY-MM-DD, UTC), so screens count months from the same day as the figures. */
  today: string;
}
