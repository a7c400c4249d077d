import type { Db } from '@busbar/db';
import type { AuditEntry, Page } from '@busbar/shared';
import { cappedCount, decodeCursor, encodeCursor, offsetOf } from './paging.ts';

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

/** One page of the audit log, newest first: by page number, or after a `cursor` at any depth. */
export async function listAudit(db: Db, filter: { entity?: string | undefined; page: number; pageSize: number; cursor?: string | undefined }): Promise<Page<AuditEntry>> {
  let matching = db.selectFrom('auditLog as a');
  if (filter.entity) matching = matching.where('a.entity', '=', filter.entity);
  let pageIds = matching.select('a.id').orderBy('a.id', 'desc').limit(filter.pageSize);
  if (filter.cursor) pageIds = pageIds.where('a.id', '<', decodeCursor(filter.cursor).id);
  else pageIds = pageIds.offset(offsetOf(filter.page, filter.pageSize));
  const [keys, count] = await Promise.all([pageIds.execute(), cappedCount(db, matching.select('a.id'))]);
  const rows = keys.length === 0 ? [] : await db
    .selectFrom('auditLog as a')
    .leftJoin('users as u', 'u.id', 'a.actorId')
    .select(['a.id', 'a.at', 'a.actorId', 'u.name as actorName', 'a.action', 'a.entity', 'a.entityId', 'a.before', 'a.after'])
    .where('a.id', 'in', keys.map((k) => k.id))
    .orderBy('a.id', 'desc')
    .execute();
  const parse = (text: string | null) => (text === null ? null : JSON.parse(text));
  const items = rows.map((r) => ({ ...r, before: parse(r.before), after: parse(r.after) }));
  const last = items.length === filter.pageSize ? items.at(-1) : undefined;
  return { items, ...count, page: filter.page, pageSize: filter.pageSize, nextCursor: last ? encodeCursor({ value: null, id: last.id }) : null };
}
