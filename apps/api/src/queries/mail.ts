import type { Db } from '@busbar/db';
import type { MailEntry, Page } from '@busbar/shared';

export async function logMail(db: Db, entry: Omit<MailEntry, 'id'>): Promise<void> {
  const { to, ...rest } = entry;
  await db.insertInto('mailLog').values({ ...rest, toAddress: to }).execute();
}

export async function listMail(db: Db, page: number, pageSize: number): Promise<Page<MailEntry>> {
  const [items, count] = await Promise.all([
    db
      .selectFrom('mailLog')
      .select(['id', 'sentAt', 'toAddress as to', 'subject', 'text', 'status', 'error'])
      .orderBy('id', 'desc')
      .limit(pageSize)
      .offset((page - 1) * pageSize)
      .execute(),
    db.selectFrom('mailLog').select((eb) => eb.fn.countAll<number>().as('n')).executeTakeFirstOrThrow(),
  ]);
  return { items, total: Number(count.n), page, pageSize };
}
