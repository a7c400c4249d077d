import type { Db } from '@busbar/db';
import { subject } from '@casl/ability';
import type { BuildDetail, BuildView } from '@busbar/shared';
import { conflict, forbidden, HttpError, notFound } from '../errors.ts';
import { buildEvents, buildItems, findBuild, type BuildRow } from '../queries/builds.ts';
import { readable } from './fields.ts';
import type { Viewer } from './viewer.ts';

/** A build the person may read, or 404 — also for a build of a location they cannot see. */
export async function loadBuild(db: Db, viewer: Viewer, id: number): Promise<BuildRow> {
  const row = await findBuild(db, id);
  if (!row || !viewer.ability.can('read', subject('Build', { ...row }))) throw notFound('build');
  return row;
}

/** A build as this person may read it: money fields they may not see are left out. */
export function buildView(viewer: Viewer, row: BuildRow): Partial<BuildView> {
  return readable(viewer.ability, 'Build', { ...row, marginCents: row.partsPriceCents - row.partsCostCents });
}

export async function buildDetail(db: Db, viewer: Viewer, id: number): Promise<Partial<BuildDetail>> {
  const row = await loadBuild(db, viewer, id);
  const [items, events] = await Promise.all([buildItems(db, id), buildEvents(db, id)]);
  return {
    ...buildView(viewer, row),
    items: items.map((item) => readable(viewer.ability, 'Build', item, row)) as BuildDetail['items'],
    events,
  };
}

/**
 * May the person change this build with `action`? Cancelled builds are closed; delivered builds
 * take only corrections by someone who plans the build's work, each with a note that is recorded.
 * Answers whether the change is such a correction.
 */
export function authorizeBuildChange(viewer: Viewer, row: BuildRow, action: 'update' | 'plan', correctionNote?: string): boolean {
  const target = subject('Build', { ...row });
  if (row.status === 'cancelled') throw conflict('A cancelled build cannot be changed');
  if (row.status === 'delivered') {
    if (!viewer.ability.can('plan', target)) throw forbidden('A delivered build can be corrected only by its location lead');
    if (!correctionNote) {
      throw new HttpError(400, 'invalid', 'Say why this delivered build is being corrected', { correctionNote: 'Enter the reason for the correction' });
    }
    return true;
  }
  if (!viewer.ability.can(action, target)) throw forbidden('You cannot change this build');
  return false;
}
