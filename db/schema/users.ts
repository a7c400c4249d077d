import type { Generated } from 'kysely';

export interface UsersTable {
  id: Generated<number>;
  email: string;
  name: string;
  /** scrypt hash in PHC-like form; null until an invited person sets a password. */
  passwordHash: string | null;
  status: 'active' | 'invited' | 'inactive';
  createdAt: string;
  lastSignInAt: string | null;
  /** 1 while the person wants the weekly e-mail of last week's figures (leads and regional managers get one). */
  weeklyDigest: Generated<number>;
}

export interface WeeklyDigestsTable {
  userId: number;
  /** The Monday of the week the e-mail covered (the roll-ups' week key). */
  week: string;
  sentAt: string;
}
