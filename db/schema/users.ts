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
}
