import type { Db } from '@busbar/db';

/**
 * The audit rows the API would have written for the demo history's status changes (the small demo
 * keeps none; the network generator does the same), so the log's filters have two years of
 * people, builds and times to find. Answers how many rows it wrote.
 */
export async function auditDemoStatuses(db: Db): Promise<number> {
  const events = await db.selectFrom('buildEvents').select(['buildId', 'at', 'actorId', 'fromStatus', 'toStatus']).where('kind', '=', 'status').orderBy('id').execute();
  const rows = events.map((e) => ({
    at: e.at,
    actorId: e.actorId,
    action: e.fromStatus ? 'build.status' : 'build.create',
    entity: 'build',
    entityId: e.buildId,
    before: e.fromStatus ? JSON.stringify({ status: e.fromStatus }) : null,
    after: JSON.stringify({ status: e.toStatus }),
  }));
  for (let i = 0; i < rows.length; i += 500) await db.insertInto('auditLog').values(rows.slice(i, i + 500)).execute();
  return rows.length;
}
