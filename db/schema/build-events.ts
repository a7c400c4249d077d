import type { Generated } from 'kysely';
import type { BuildStatus } from '@busbar/shared';

export interface BuildEventsTable {
  id: Generated<number>;
  buildId: number;
  at: string;
  actorId: number | null;
  kind: 'status' | 'correction';
  fromStatus: BuildStatus | null;
  toStatus: BuildStatus | null;
  note: string;
}
