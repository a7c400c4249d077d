import type { Db } from '@busbar/db';
import type { MailEntry, Page } from '@busbar/shared';
import { cappedCount, decodeCursor, encodeCursor, offsetOf } from './paging.ts';

export async function logMail(db: Db, entry: Omit<MailEntry, 'id'>): Promise<void> {
  const { to, ...rest } = entry;
  await db.insertInto('mailLog').values({ ...rest, toAddress: to }).execute();
}

/** One page of the mail log, newest first: by page number, or after a `cursor` at any depth. */
export async function listMail(db: Db, filter: { page: number; pageSize: number; cursor?: string | undefined }): Promise<Page<MailEntry>> {
  const { page, pageSize } = filter;
  let rows = db
    .selectFrom('mailLog')
    .select(['id', 'sentAt', 'toAddress as to', 'subject', 'text', 'status', 'error'])
    .orderBy('id', 'desc')
    .limit(pageSize);
  if (filter.cursor) rows = rows.where('id', '<', decodeCursor(filter.cursor).id);
  else rows = rows.offset(offsetOf(page, pageSize));
  const [items, count] = await Promise.all([rows.execute(), cappedCount(db, db.selectFrom('mailLog').select('id'))]);
  const last = items.length === pageSize ? items.at(-1) : undefined;
  return { items, ...count, page, pageSize, nextCursor: last ? encodeCursor({ value: null, id: last.id }) : null };
}
