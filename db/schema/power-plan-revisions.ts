import type { Generated } from 'kysely';

/** Every save of a plan, so earlier versions and corrections after delivery stay on record. */
export interface PowerPlanRevisionsTable {
  id: Generated<number>;
  planId: number;
  version: number;
  /** JSON of the PlanInput saved at this version. */
  input: string;
  savedAt: string;
  savedBy: number;
  note: string;
}
