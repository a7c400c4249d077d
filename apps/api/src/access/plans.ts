import { evaluatePlan, type PlanInput, type PlanResult } from '@busbar/calc';
import type { Db } from '@busbar/db';
import { subject } from '@casl/ability';
import type { PlanView } from '@busbar/shared';
import { HttpError, notFound } from '../errors.ts';
import { findPlan, type PlanRow } from '../queries/plans.ts';
import type { Viewer } from './viewer.ts';

export const canOnPlan = (viewer: Viewer, action: 'read' | 'create' | 'update', plan: { locationId: number }) =>
  viewer.ability.can(action, subject('Plan', { ...plan }));

/** A plan the person may read, or 404 — also for a plan of a location they cannot see. */
export async function loadPlan(db: Db, viewer: Viewer, id: number): Promise<PlanRow> {
  const row = await findPlan(db, id);
  if (!row || !canOnPlan(viewer, 'read', row)) throw notFound('plan');
  return row;
}

export function planView(row: PlanRow): PlanView {
  return { ...row, input: JSON.parse(row.input) as PlanInput, result: JSON.parse(row.result) as PlanResult };
}

/**
 * The server's own evaluation of a plan. calc rejects what the schema cannot see (an AC load
 * without an inverter, more running hours than active hours) with a RangeError whose message
 * starts with the field, e.g. `loads[0].hoursPerDay`; it is answered as a 400 on that field,
 * named as zod names it (`input.loads.0.hoursPerDay`), with the rest of the message beside it.
 */
export function evaluateInput(input: PlanInput): PlanResult {
  try {
    return evaluatePlan(input);
  } catch (error) {
    if (!(error instanceof RangeError)) throw error;
    const [name = '', ...rest] = error.message.split(' ');
    const problem = rest.join(' ');
    const field = `input.${name.replace(/\[(\d+)\]/g, '.$1')}`;
    throw new HttpError(400, 'invalid', error.message, { [field]: problem.charAt(0).toUpperCase() + problem.slice(1) });
  }
}
