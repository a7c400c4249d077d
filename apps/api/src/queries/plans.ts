import type { PlanInput } from '@busbar/calc';
import type { Db } from '@busbar/db';
import type { PlanRevisionView } from '@busbar/shared';
import type { LocationScope } from '../access/locations.ts';
import { stale } from '../errors.ts';
import { cappedCount, offsetOf } from './paging.ts';

export interface PlanRow {
  id: number;
  buildId: number | null;
  locationId: number;
  name: string;
  /** JSON of the PlanInput; the result is evaluated from it whenever the plan is read. */
  input: string;
  version: number;
  updatedAt: string;
  updatedByName: string | null;
}

function plansWithNames(db: Db) {
  return db
    .selectFrom('powerPlans as p')
    .leftJoin('users as u', 'u.id', 'p.updatedBy')
    .select(['p.id', 'p.buildId', 'p.locationId', 'p.name', 'p.input', 'p.version', 'p.updatedAt', 'u.name as updatedByName']);
}

export function findPlan(db: Db, id: number): Promise<PlanRow | undefined> {
  return plansWithNames(db).where('p.id', '=', id).executeTakeFirst();
}

export function findBuildPlan(db: Db, buildId: number): Promise<PlanRow | undefined> {
  return plansWithNames(db).where('p.buildId', '=', buildId).executeTakeFirst();
}

/** One page of quick plans (not attached to a build) in the scope, most recently saved first. */
export async function listQuickPlans(db: Db, scope: LocationScope, paging: { page: number; pageSize: number }) {
  const { page, pageSize } = paging;
  if (scope !== 'all' && scope.length === 0) return { rows: [], total: 0, totalCapped: false, page, pageSize };
  let matching = db.selectFrom('powerPlans as p').where('p.buildId', 'is', null);
  if (scope !== 'all') matching = matching.where('p.locationId', 'in', scope);
  const [rows, count] = await Promise.all([
    matching
      .leftJoin('users as u', 'u.id', 'p.updatedBy')
      .select(['p.id', 'p.buildId', 'p.locationId', 'p.name', 'p.input', 'p.version', 'p.updatedAt', 'u.name as updatedByName'])
      .orderBy('p.updatedAt', 'desc')
      .orderBy('p.id', 'desc')
      .limit(pageSize)
      .offset(offsetOf(page, pageSize))
      .execute(),
    cappedCount(db, matching.select('p.id')),
  ]);
  return { rows: rows as PlanRow[], ...count, page, pageSize };
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

/** One save: who, when, the inputs (evaluated before saving) and why, when a reason is owed. */
export interface PlanSave {
  at: string;
  actorId: number;
  input: PlanInput;
  note: string;
}

/** Stores a new plan at version 1 with its first revision; answers its id. */
export async function insertPlan(db: Db, plan: { buildId: number | null; locationId: number; name: string }, save: PlanSave): Promise<number> {
  const row = await db
    .insertInto('powerPlans')
    .values({
      ...plan,
      input: JSON.stringify(save.input),
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
