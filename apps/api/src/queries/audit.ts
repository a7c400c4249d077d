import type { Db } from '@busbar/db';
import type { AuditEntry, Page } from '@busbar/shared';

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

export async function listAudit(db: Db, filter: { entity?: string | undefined; page: number; pageSize: number }): Promise<Page<AuditEntry>> {
  let query = db.selectFrom('auditLog as a').leftJoin('users as u', 'u.id', 'a.actorId');
  if (filter.entity) query = query.where('a.entity', '=', filter.entity);
  const [rows, count] = await Promise.all([
    query
      .select(['a.id', 'a.at', 'a.actorId', 'u.name as actorName', 'a.action', 'a.entity', 'a.entityId', 'a.before', 'a.after'])
      .orderBy('a.id', 'desc')
      .limit(filter.pageSize)
      .offset((filter.page - 1) * filter.pageSize)
      .execute(),
    query.select((eb) => eb.fn.countAll<number>().as('n')).executeTakeFirstOrThrow(),
  ]);
  const parse = (text: string | null) => (text === null ? null : JSON.parse(text));
  const items = rows.map((r) => ({ ...r, before: parse(r.before), after: parse(r.after) }));
  return { items, total: Number(count.n), page: filter.page, pageSize: filter.pageSize };
}
