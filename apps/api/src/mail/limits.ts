import type { Db } from '@busbar/db';
import { HttpError } from '../errors.ts';

/** Limited e-mail is counted over the last hour. */
export const MAIL_LIMIT_WINDOW_MS = 3_600_000;

/** One limit a message counts against: at most `max` an hour under `key`; `refusal` says which, in words. */
export interface MailLimit {
  key: string;
  max: number;
  refusal: string;
}

/** A person who has not accepted their invite is sent at most 3 new links an hour, and one sender sends at most 20. */
export const reinviteLimits = (personId: number, senderId: number): MailLimit[] => [
  { key: `reinvite:person:${personId}`, max: 3, refusal: 'This person has already been sent 3 invites in the last hour.' },
  { key: `reinvite:sender:${senderId}`, max: 20, refusal: 'You have already sent 20 invites again in the last hour.' },
];

/** One sender invites at most 50 new people an hour: enough to staff a new shop, not to flood addresses. */
export const newInviteLimits = (senderId: number): MailLimit[] => [
  { key: `invite:sender:${senderId}`, max: 50, refusal: 'You have already invited 50 new people in the last hour.' },
];

/** A claim's return request is tried at most 3 times an hour, and one person sends at most 60 return requests an hour. */
export const vendorRequestLimits = (claimId: number, senderId: number): MailLimit[] => [
  { key: `vendor-request:claim:${claimId}`, max: 3, refusal: "This claim's return request has already been tried 3 times in the last hour." },
  { key: `vendor-request:sender:${senderId}`, max: 60, refusal: 'You have already sent 60 return requests in the last hour.' },
];

/**
 * Counts one message against each limit before it is sent (a failed send counts too: the limits
 * spare the mail server and the recipient as much as the sender), or refuses it with a 429 saying
 * when to try again. The rows go in first and are counted after, in the database every app
 * process shares, so two requests racing for the last place can both be refused but never both
 * let through.
 */
export async function countMail(db: Db, limits: MailLimit[], now: Date): Promise<void> {
  const at = now.toISOString();
  const since = new Date(now.getTime() - MAIL_LIMIT_WINDOW_MS).toISOString();
  const keys = limits.map((l) => l.key);
  await db.deleteFrom('mailSends').where('limitKey', 'in', keys).where('at', '<=', since).execute();
  const ids = (await db.insertInto('mailSends').values(keys.map((limitKey) => ({ limitKey, at }))).returning('id').execute()).map((r) => r.id);
  for (const limit of limits) {
    const earlier = await db.selectFrom('mailSends').select('at').where('limitKey', '=', limit.key).where('at', '>', since).where('id', 'not in', ids).orderBy('at').execute();
    if (earlier.length < limit.max) continue;
    await db.deleteFrom('mailSends').where('id', 'in', ids).execute();
    // Free again once enough of the counted ones are an hour old.
    const freeAt = Date.parse(earlier[earlier.length - limit.max]!.at) + MAIL_LIMIT_WINDOW_MS;
    const minutes = Math.max(1, Math.ceil((freeAt - now.getTime()) / 60_000));
    throw new HttpError(429, 'too_many_mails', `${limit.refusal} Try again in ${minutes} minute${minutes === 1 ? '' : 's'}.`);
  }
}
