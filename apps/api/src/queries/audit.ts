import type { Db } from '@busbar/db';
import type { AuditEntry, AuditQuery, Page } from '@busbar/shared';
import type { LocationScope } from '../access/locations.ts';
import { invalidField } from '../errors.ts';
import { loadAuditNames, referencesOf } from './audit-names.ts';
import { auditWords } from './audit-words.ts';
import { afterKey, cappedCount, decodeCursor, encodeCursor, offsetOf } from './paging.ts';

export interface AuditWrite {
  at: string;
  actorId: number | null;
  action: string;
  entity: string;
  entityId: number | null;
  before?: unknown;
  after?: unknown;
}

/** Records who changed what, when, with the record before and after. */
export async function writeAudit(db: Db, entry: AuditWrite): Promise<void> {
  const json = (value: unknown) => (value === undefined || value === null ? null : JSON.stringify(value));
  await db
    .insertInto('auditLog')
    .values({ ...entry, before: json(entry.before), after: json(entry.after) })
    .execute();
}

/** Who reads the log: the locations whose records are named to them, and whether money is shown. */
export interface AuditReader {
  scope: LocationScope;
  money: boolean;
}

const instant = (time: string) => new Date(time).toISOString();
const parse = (text: string | null): unknown => (text === null ? null : JSON.parse(text));

/** The build a number names, if the reader sees it; otherwise the filter is refused in words. */
async function buildIdOf(db: Db, reader: AuditReader, number: string): Promise<number> {
  let query = db.selectFrom('builds').select('id').where('number', '=', number);
  if (reader.scope !== 'all') query = query.where('locationId', 'in', reader.scope.length ? reader.scope : [0]);
  const row = await query.executeTakeFirst();
  if (!row) throw invalidField('buildNumber', `No build numbered ${number} at the shops you see`);
  return row.id;
}

/**
 * One page of the audit log, newest first (by time, then id), each row in words: by page number,
 * or after a `cursor` at any depth. Every filter reads an index in time order (migration 033).
 */
export async function listAudit(db: Db, reader: AuditReader, filter: AuditQuery): Promise<Page<AuditEntry>> {
  const buildId = filter.buildNumber ? await buildIdOf(db, reader, filter.buildNumber) : undefined;
  let matching = db.selectFrom('auditLog as a');
  if (filter.actorId) matching = matching.where('a.actorId', '=', filter.actorId);
  if (filter.entity || buildId) matching = matching.where('a.entity', '=', buildId ? 'build' : filter.entity!);
  if (filter.entityId || buildId) matching = matching.where('a.entityId', '=', buildId ?? filter.entityId!);
  if (filter.from) matching = matching.where('a.at', '>=', instant(filter.from));
  if (filter.to) matching = matching.where('a.at', '<', instant(filter.to));
  let pageIds = matching.select(['a.id', 'a.at']).orderBy('a.at', 'desc').orderBy('a.id', 'desc').limit(filter.pageSize);
  if (filter.cursor) pageIds = pageIds.where(afterKey('a.at', 'a.id', 'desc', decodeCursor(filter.cursor)));
  else pageIds = pageIds.offset(offsetOf(filter.page, filter.pageSize));
  const [keys, count] = await Promise.all([pageIds.execute(), cappedCount(db, matching.select('a.id'))]);
  const rows = keys.length === 0 ? [] : await db
    .selectFrom('auditLog as a')
    .leftJoin('users as u', 'u.id', 'a.actorId')
    .select(['a.id', 'a.at', 'a.actorId', 'u.name as actorName', 'a.action', 'a.entity', 'a.entityId', 'a.before', 'a.after'])
    .where('a.id', 'in', keys.map((k) => k.id))
    .orderBy('a.at', 'desc')
    .orderBy('a.id', 'desc')
    .execute();
  const parsed = rows.map((r) => ({ ...r, before: parse(r.before), after: parse(r.after) }));
  const names = await loadAuditNames(db, reader.scope, referencesOf(parsed));
  // Outside the whole network, names come only through the scoped lookup and the stored record stays unsaid.
  const whole = reader.scope === 'all' && reader.money;
  const items = parsed.map((r) => {
    const actorName = whole || r.actorId === null ? r.actorName : (names.users.get(r.actorId) ?? 'A person outside your shops');
    const row = { ...r, actorName, before: whole ? r.before : null, after: whole ? r.after : null };
    return { ...row, ...auditWords({ ...r, actorName }, names, { money: reader.money, whole }) };
  });
  const last = items.length === filter.pageSize ? items.at(-1) : undefined;
  return { items, ...count, page: filter.page, pageSize: filter.pageSize, nextCursor: last ? encodeCursor({ value: last.at, id: last.id }) : null };
}
