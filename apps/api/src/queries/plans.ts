import type { PlanInput, PlanResult } from '@busbar/calc';
import type { Db } from '@busbar/db';
import type { PlanRevisionView } from '@busbar/shared';
import { stale } from '../errors.ts';

export interface PlanRow {
  id: number;
  buildId: number | null;
  locationId: number;
  name: string;
  input: string;
  result: string;
  version: number;
  updatedAt: string;
  updatedByName: string | null;
}

function plansWithNames(db: Db) {
  return db
    .selectFrom('powerPlans as p')
    .leftJoin('users as u', 'u.id', 'p.updatedBy')
    .select(['p.id', 'p.buildId', 'p.locationId', 'p.name', 'p.input', 'p.result', 'p.version', 'p.updatedAt', 'u.name as updatedByName']);
}

export function findPlan(db: Db, id: number): Promise<PlanRow | undefined> {
  return plansWithNames(db).where('p.id', '=', id).executeTakeFirst();
}

export function findBuildPlan(db: Db, buildId: number): Promise<PlanRow | undefined> {
  return plansWithNames(db).where('p.buildId', '=', buildId).executeTakeFirst();
}

/** Quick plans (not attached to a build) at the given locations, most recently saved first. */
export async function listQuickPlans(db: Db, locationIds: number[]): Promise<PlanRow[]> {
  if (locationIds.length === 0) return [];
  return plansWithNames(db)
    .where('p.buildId', 'is', null)
    .where('p.locationId', 'in', locationIds)
    .orderBy('p.updatedAt', 'desc')
    .orderBy('p.id', 'desc')
    .execute();
}

export function planRevisions(db: Db, planId: number): Promise<PlanRevisionView[]> {
  return db
    .selectFrom('powerPlanRevisions as r')
    .innerJoin('users as u', 'u.id', 'r.savedBy')
    .select(['r.version', 'r.savedAt', 'u.name as savedByName', 'r.note'])
    .where('r.planId', '=', planId)
    .orderBy('r.version', 'desc')
    .execute();
}

/** One save: who, when, the evaluated inputs and why, when a reason is owed. */
export interface PlanSave {
  at: string;
  actorId: number;
  input: PlanInput;
  result: PlanResult;
  note: string;
}

/** Stores a new plan at version 1 with its first revision; answers its id. */
export async function insertPlan(db: Db, plan: { buildId: number | null; locationId: number; name: string }, save: PlanSave): Promise<number> {
  const row = await db
    .insertInto('powerPlans')
    .values({
      ...plan,
      input: JSON.stringify(save.input),
      result: JSON.stringify(save.result),
      version: 1,
      createdBy: save.actorId,
      createdAt: save.at,
      updatedAt: save.at,
      updatedBy: save.actorId,
    })
    .returning('id')
    .executeTakeFirstOrThrow();
  await addRevision(db, row.id, 1, save);
  return row.id;
}

/**
 * Saves a plan only if nobody saved it since `version` was read (else 409 stale), moving it to
 * the next version and recording that version as a revision.
 */
export async function revisePlan(db: Db, id: number, version: number, save: PlanSave, patch: { name?: string; buildId?: number } = {}): Promise<void> {
  const result = await db
    .updateTable('powerPlans')
    .set({
      ...patch,
      input: JSON.stringify(save.input),
      result: JSON.stringify(save.result),
      version: version + 1,
      updatedAt: save.at,
      updatedBy: save.actorId,
    })
    .where('id', '=', id)
    .where('version', '=', version)
    .executeTakeFirst();
  if (result.numUpdatedRows !== 1n) throw stale();
  await addRevision(db, id, version + 1, save);
}

async function addRevision(db: Db, planId: number, version: number, save: PlanSave): Promise<void> {
  await db
    .insertInto('powerPlanRevisions')
    .values({ planId, version, input: JSON.stringify(save.input), savedAt: save.at, savedBy: save.actorId, note: save.note })
    .execute();
}
