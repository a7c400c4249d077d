import { z } from 'zod';
import { idSchema, pageQuery } from './common.ts';
import type { PlanView } from './plans.ts';

export const quickPlanQuery = z.strictObject({ locationId: idSchema.optional(), regionId: idSchema.optional(), ...pageQuery });
export type QuickPlanQuery = z.infer<typeof quickPlanQuery>;

/** A quick plan in a list: what it is and its verdict, without its inputs or full result. */
export interface QuickPlanSummary extends Omit<PlanView, 'input' | 'result'> {
  verdict: PlanView['result']['verdict'];
}
