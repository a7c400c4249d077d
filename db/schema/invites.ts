import type { Generated } from 'kysely';

export interface InvitesTable {
  id: Generated<number>;
  userId: number;
  /** SHA-256 of the token: the token itself only ever exists in the e-mail. */
  tokenHash: string;
  createdAt: string;
  createdBy: number | null;
  expiresAt: string;
  usedAt: string | null;
}
