import { evaluatePlan, planVerdict, type PlanInput, type PlanResult } from '@busbar/calc';
import type { Db } from '@busbar/db';
import { subject } from '@casl/ability';
import type { PlanView, QuickPlanSummary } from '@busbar/shared';
import { HttpError, notFound } from '../errors.ts';
import { planStock } from '../queries/plan-stock.ts';
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

/** A plan as read: its stored inputs with the result evaluated now (recommendations rounded to the catalog's sizes), so it is never a stale computation's. */
export async function planView(db: Db, row: PlanRow): Promise<PlanView> {
  const input = JSON.parse(row.input) as PlanInput;
  return { ...row, input, result: evaluatePlan(input, { stock: await planStock(db) }) };
}

/** Quick plans as listed: each with its verdict, evaluated now, without inputs or the rest of the result. */
export async function quickPlanSummaries(db: Db, rows: PlanRow[]): Promise<QuickPlanSummary[]> {
  const stock = await planStock(db);
  return rows.map(({ input, ...row }) => ({ ...row, verdict: planVerdict(JSON.parse(input) as PlanInput, { stock }) }));
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
