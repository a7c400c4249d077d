import type { Generated } from 'kysely';

export interface PowerPlansTable {
  id: Generated<number>;
  /** Null for a quick plan not yet attached to a build; a build has at most one plan. */
  buildId: number | null;
  locationId: number;
  name: string;
  /** JSON of the PlanInput (packages/calc); its result is evaluated whenever the plan is read. */
  input: string;
  version: Generated<number>;
  createdBy: number | null;
  createdAt: string;
  updatedAt: string;
  updatedBy: number | null;
}
