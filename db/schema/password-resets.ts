import type { Generated } from 'kysely';

export interface PasswordResetsTable {
  id: Generated<number>;
  userId: number;
  /** SHA-256 of the token: the token itself only ever exists in the e-mail. */
  tokenHash: string;
  createdAt: string;
  expiresAt: string;
  usedAt: string | null;
}
