import { designMargins, type PlanResult } from '@busbar/calc';
import type { Db } from '@busbar/db';

/**
 * Keeps a build's design-margin bands (`plan_margins`) as its plan says, in the transaction that
 * saves the plan: the result's bands, or no row when the build has no plan (null) or its plan's
 * margins cannot be known (no circuits, no planned house bank), so its units count as "no plan".
 * Triggers move the build's units and failures between the `unit_exposure` bands (migration 019).
 */
export async function keepPlanMargins(db: Db, buildId: number, result: PlanResult | null): Promise<void> {
  const margins = result && designMargins(result);
  if (!margins) {
    await db.deleteFrom('planMargins').where('buildId', '=', buildId).execute();
    return;
  }
  const { dropBand, loadBand, dischargeBand } = margins;
  const current = await db.selectFrom('planMargins').select(['dropBand', 'loadBand', 'dischargeBand']).where('buildId', '=', buildId).executeTakeFirst();
  // An unchanged row is left alone: rewriting it would move every unit of the build out and back in.
  if (current && current.dropBand === dropBand && current.loadBand === loadBand && current.dischargeBand === dischargeBand) return;
  // Insert or update, never an upsert: an upsert fires the insert triggers before the update ones,
  // and the units would be taken out of their old bands twice.
  if (current) await db.updateTable('planMargins').set({ dropBand, loadBand, dischargeBand }).where('buildId', '=', buildId).execute();
  else await db.insertInto('planMargins').values({ buildId, dropBand, loadBand, dischargeBand }).execute();
}
