import { buildTotals } from '@busbar/calc';
import type { Db } from '@busbar/db';
import { BUILD_HISTORY_CAP, BUILD_STATUS_LABELS, type BuildHistory, type BuildHistoryEntry, type BuildStatus } from '@busbar/shared';
import type { Updateable } from 'kysely';
import type { Database } from '@busbar/db';
import type { LocationScope } from '../access/locations.ts';
import { stale } from '../errors.ts';
import { loadAuditNames, referencesOf } from './audit-names.ts';
import { auditWords } from './audit-words.ts';
import { buildEvents } from './builds.ts';

/**
 * Applies a change to a build only if nobody changed it since `version` was read, and moves it
 * to the next version; a stale edit throws 409.
 */
export async function changeBuild(
  db: Db,
  id: number,
  version: number,
  at: string,
  patch: Updateable<Database['builds']> = {},
): Promise<void> {
  const result = await db
    .updateTable('builds')
    .set((eb) => ({ ...patch, updatedAt: at, version: eb('version', '+', 1) }))
    .where('id', '=', id)
    .where('version', '=', version)
    .executeTakeFirst();
  if (result.numUpdatedRows !== 1n) throw stale();
}

/** Stores the totals of a build from its items and labor (see `buildTotals`). */
export async function recomputeTotals(db: Db, id: number): Promise<void> {
  const build = await db.selectFrom('builds').select(['laborHours', 'laborRateCents']).where('id', '=', id).executeTakeFirstOrThrow();
  const lines = await db.selectFrom('buildItems').select(['quantity', 'unitPriceCents', 'unitCostCents']).where('buildId', '=', id).execute();
  const totals = buildTotals(lines, build.laborHours, build.laborRateCents);
  await db
    .updateTable('builds')
    .set({
      laborCents: totals.laborCents,
      partsPriceCents: totals.partsPriceCents,
      partsCostCents: totals.partsCostCents,
      totalCents: totals.totalCents,
    })
    .where('id', '=', id)
    .execute();
}

export async function addBuildEvent(
  db: Db,
  event: { buildId: number; at: string; actorId: number; kind: 'status' | 'correction'; fromStatus?: BuildStatus | null; toStatus?: BuildStatus | null; note: string },
): Promise<void> {
  await db
    .insertInto('buildEvents')
    .values({ fromStatus: null, toStatus: null, ...event })
    .execute();
}

/** The build that already holds this serial number of this SKU, if any. */
export function serialHolder(db: Db, sku: string, serialNumber: string, exceptItemId = 0) {
  return db
    .selectFrom('buildItems as i')
    .innerJoin('builds as b', 'b.id', 'i.buildId')
    .select(['b.id', 'b.number', 'b.locationId'])
    .where('i.sku', '=', sku)
    .where('i.serialNumber', '=', serialNumber)
    .where('i.id', '!=', exceptItemId)
    .executeTakeFirst();
}

const historyKind = (action: string, reason: string | null): BuildHistoryEntry['kind'] =>
  reason || action === 'build.correct' ? 'correction' : ['build.create', 'build.status', 'build.import'].includes(action) ? 'status' : 'change';

/**
 * A build's history in words, newest first: its audit rows (read by the `audit_log_record_at`
 * index), and the timeline events no audit row of the build stands for (a power plan's or a
 * warranty replacement's correction, which the log keeps on the plan or the claim). Names come
 * from `scope`; money is never said here, whoever reads it.
 */
export async function buildHistory(db: Db, scope: LocationScope, build: { id: number; number: string }): Promise<BuildHistory> {
  const [audits, events] = await Promise.all([
    db
      .selectFrom('auditLog as a')
      .leftJoin('users as u', 'u.id', 'a.actorId')
      .select(['a.id', 'a.at', 'a.actorId', 'u.name as actorName', 'a.action', 'a.entity', 'a.entityId', 'a.before', 'a.after'])
      .where('a.entity', '=', 'build')
      .where('a.entityId', '=', build.id)
      .orderBy('a.at', 'desc')
      .orderBy('a.id', 'desc')
      .limit(BUILD_HISTORY_CAP + 1)
      .execute(),
    buildEvents(db, build.id),
  ]);
  const rows = audits.map((r) => ({ ...r, before: r.before === null ? null : JSON.parse(r.before), after: r.after === null ? null : JSON.parse(r.after) }));
  const names = await loadAuditNames(db, scope, referencesOf(rows));
  const entries: BuildHistoryEntry[] = rows.slice(0, BUILD_HISTORY_CAP).map((r) => {
    const words = auditWords(r, names, { money: false, onBuild: true, whole: scope === 'all' });
    return { key: `a${r.id}`, at: r.at, actorName: r.actorName, kind: historyKind(r.action, words.reason), summary: words.summary, details: words.details, reason: words.reason };
  });
  const audited = new Set(rows.map((r) => r.at));
  for (const e of events.filter((e) => !audited.has(e.at))) {
    const correction = e.kind === 'correction';
    const summary = correction ? 'Corrected after delivery' : e.fromStatus ? `Status: ${BUILD_STATUS_LABELS[e.fromStatus]} → ${BUILD_STATUS_LABELS[e.toStatus!]}` : `Created as ${BUILD_STATUS_LABELS[e.toStatus!]}`;
    const note = e.note.trim();
    entries.push({ key: `e${e.id}`, at: e.at, actorName: e.actorName, kind: correction ? 'correction' : 'status', summary, details: !correction && note ? [`Note: ${note}`] : [], reason: correction ? note || null : null });
  }
  entries.sort((a, b) => b.at.localeCompare(a.at) || Number(b.key.slice(1)) - Number(a.key.slice(1)));
  return { number: build.number, entries: entries.slice(0, BUILD_HISTORY_CAP), more: rows.length > BUILD_HISTORY_CAP || entries.length > BUILD_HISTORY_CAP };
}
