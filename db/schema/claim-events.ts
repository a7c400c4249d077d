import type { ClaimStatus } from '@busbar/shared';
import type { Generated } from 'kysely';

/** One step of a claim along its workflow, with who took it and why. */
export interface ClaimEventsTable {
  id: Generated<number>;
  claimId: number;
  at: string;
  actorId: number | null;
  fromStatus: ClaimStatus | null;
  toStatus: ClaimStatus;
  note: string;
}
