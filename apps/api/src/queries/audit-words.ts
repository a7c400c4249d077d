import { ROLE_LABELS, type Role } from '@busbar/shared';
import { fieldChanges, nameOf, valueWords, type WordsOptions } from './audit-field-words.ts';
import { ENTITY_KINDS, type AuditNames, type AuditRowRef } from './audit-names.ts';

export type { WordsOptions } from './audit-field-words.ts';

export interface AuditWords {
  /** What happened, in one sentence. */
  summary: string;
  /** The record by its number or name ("Build DEN-00012"), or by its kind where the reader may not see it. */
  record: string;
  /** Each changed value in words. */
  details: string[];
  /** The person's reason, kept with a correction after delivery. */
  reason: string | null;
}

export interface AuditRowWords extends AuditRowRef {
  action: string;
  actorName: string | null;
}

type Side = Record<string, unknown>;
const sideOf = (value: unknown): Side => (value && typeof value === 'object' && !Array.isArray(value) ? (value as Side) : {});
const text = (value: unknown) => (typeof value === 'string' && value.trim() ? value.trim() : null);
const capital = (words: string) => words.charAt(0).toUpperCase() + words.slice(1);
const lower = (words: string) => words.charAt(0).toLowerCase() + words.slice(1);
/** An action or entity nobody taught the words: `claim_item.merge` → "Claim item merge". */
const plainly = (code: string) => capital(code.replace(/[._]+/g, ' ').trim());

const RECORD_WORDS: Record<string, string> = {
  build: 'Build',
  claim: 'Warranty claim',
  customer: 'Customer',
  vehicle: 'Vehicle',
  user: 'Person',
  location: 'Shop',
  vendor: 'Vendor',
  catalog_item: 'Catalog item',
};

/** The record a row changed, by its number or name ("A build" where the reader may not see which). */
export function recordWords(row: AuditRowRef, names: AuditNames): string {
  const kind = ENTITY_KINDS[row.entity];
  if (kind) {
    const name = names[kind].get(row.entityId as never);
    if (!name) return capital(nameOf(names, kind, null));
    if (row.entity === 'plan') return name.startsWith('"') ? `Quick plan ${name}` : `Power plan of ${name}`;
    return `${RECORD_WORDS[row.entity]} ${name}`;
  }
  if (row.entity === 'role_assignment') {
    const userId = sideOf(row.after).userId ?? sideOf(row.before).userId;
    return `Role of ${nameOf(names, 'users', userId)}`;
  }
  if (row.entity === 'export') return `Export ${row.entityId ?? ''}`.trim();
  return `${plainly(row.entity)}${row.entityId === null ? '' : ` ${row.entityId}`}`;
}

/** Whether the reader's names include the record the row changed (unknown kinds only for a reader of everything). */
function recordNamed(row: AuditRowRef, names: AuditNames): boolean {
  const kind = ENTITY_KINDS[row.entity];
  if (kind) return names[kind].has(row.entityId as never);
  if (row.entity === 'role_assignment') return names.users.has((sideOf(row.after).userId ?? sideOf(row.before).userId) as never);
  return false;
}

/** A build line in words: "2 × 200 Ah house battery (SKU NV-LFP200)", with its serial number when it has one. */
function lineWords(line: Side, names: AuditNames): string {
  const sku = String(line.sku ?? '');
  const name = names.skus.get(sku);
  const what = name ? `${name} (SKU ${sku})` : `SKU ${sku}`;
  const serial = text(line.serialNumber);
  if (serial) return `${what}, serial ${serial}`;
  return `${line.quantity ?? 1} × ${what}`;
}

function lineChangeWords(before: Side, after: Side, names: AuditNames): string {
  const what = lineWords({ ...after, serialNumber: null, quantity: after.quantity }, names).replace(/^\d+ × /, '');
  const parts: string[] = [];
  if (before.serialNumber !== after.serialNumber) {
    const was = text(before.serialNumber);
    const now = text(after.serialNumber);
    parts.push(!was ? `Serial of ${what} recorded: ${now}` : !now ? `Serial ${was} of ${what} cleared` : `Serial of ${what} changed from ${was} to ${now}`);
  }
  if (before.quantity !== after.quantity) parts.push(`Quantity of ${what} changed from ${before.quantity} to ${after.quantity}`);
  return parts.join('; ') || `${capital(what)} saved unchanged`;
}

/** Where a session action came from: the address and browser its row keeps. */
function originWords(after: Side): string[] {
  const address = text(after.address) ?? text(after.ip) ?? text(after.ipAddress);
  const agent = text(after.userAgent) ?? text(after.agent);
  return [...(address ? [`From address ${address}`] : []), ...(agent ? [`Browser: ${agent}`] : [])];
}

/**
 * One audit row in words. `onBuild` leaves out the build's own number (the build's page says it).
 * Money stays out unless `options.money`; names come only from `names`, already limited to the reader's scope,
 * and a reader of less than the `whole` network hears nothing stored of a record outside it.
 */
export function auditWords(row: AuditRowWords, names: AuditNames, options: WordsOptions & { onBuild?: boolean; whole: boolean }): AuditWords {
  const before = sideOf(row.before);
  const after = sideOf(row.after);
  const record = recordWords(row, names);
  const ofBuild = options.onBuild ? '' : ` on ${lower(record)}`;
  const person = row.entity === 'user' ? nameOf(names, 'users', row.entityId) : (row.actorName ?? 'Someone');
  const reason = text(after.reason);
  const changes = () => fieldChanges(before, after, names, options);
  const status = (from: unknown, to: unknown) => `${valueWords('status', from, names)} → ${valueWords('status', to, names)}`;
  const note = text(after.note) ? [`Note: ${text(after.note)}`] : [];
  // A record the reader may not see is said by its kind only: none of its stored values either.
  const hidden = !options.whole && !recordNamed(row, names);
  const says = (summary: string, details: string[] = []) => ({ summary: capital(summary), record, details: hidden ? [] : details, reason: hidden ? null : reason });

  switch (row.action) {
    case 'build.create':
      return says(options.onBuild ? 'Created the build as Draft' : `Created ${lower(record)}`, changes().filter((d) => !d.startsWith('Number')));
    case 'build.import':
      return says(`Imported${options.onBuild ? '' : ` ${lower(record)}`} from line ${after.line ?? '?'} of a file`);
    case 'build.status':
      return says(`${options.onBuild ? 'Status' : record}: ${status(before.status, after.status)}`, note);
    case 'build.update':
      return says(`Changed${options.onBuild ? ' the build' : ` ${lower(record)}`}`, changes());
    case 'build.correct':
      return says(`Corrected${options.onBuild ? ' the delivered build' : ` delivered ${lower(record)}`}`, changes());
    case 'build.item.add':
      return says(`Added ${lineWords(after, names)}${ofBuild}`);
    case 'build.item.update':
      return says(`${lineChangeWords(before, after, names)}${ofBuild}`);
    case 'build.item.remove':
      return says(`Removed ${lineWords(before, names)}${ofBuild}`);
    case 'claim.create':
      return says(`Logged ${lower(record)}`);
    case 'claim.status':
      return says(`${record}: ${status(before.status, after.status)}`, [...note, ...changes().filter((d) => !d.startsWith('Status'))]);
    case 'claim.send':
      return says(`Sent ${lower(record)} to the vendor`, note);
    case 'claim.evidence.add':
      return says(`Added evidence to ${lower(record)}`);
    case 'claim.evidence.delete':
      return says(`Deleted evidence from ${lower(record)}`, note);
    case 'claim.replace':
      return says(`Recorded the replacement unit of ${lower(record)}: ${lineWords(after, names)}`);
    case 'person.invite':
      return says(`Invited ${person}`, changes());
    case 'person.reinvite':
      return says(`Sent ${person} a new invitation`);
    case 'person.accept_invite':
      return says(`${person} accepted the invitation`);
    case 'person.deactivate':
      return says(`Deactivated ${person}`);
    case 'person.reactivate':
      return says(`Reactivated ${person}`);
    case 'person.password_change':
      return says(`${person} changed their password`, originWords(after));
    case 'person.password_reset_link':
      return says(`A link to choose a new password was sent to ${person}`, originWords(after));
    case 'person.password_reset':
      return says(`Password of ${person} was reset`, originWords(after));
    case 'session.sign_in':
      return says(`${person} signed in`, originWords(after));
    case 'session.sign_in_failed':
      return says(`${after.during === 'password_change' ? 'Wrong password while changing it' : 'Failed sign-in'}${row.entityId === null && text(after.email) ? ` as ${text(after.email)}` : ` for ${person}`}`, originWords(after));
    case 'session.locked':
      return says(`Sign-in locked for ${row.entityId === null && text(after.email) ? text(after.email) : person} after repeated failures`, originWords(after));
    case 'session.sign_out':
      return says(`${person} signed out`, originWords(after));
    case 'role.grant':
    case 'role.remove': {
      const side = row.action === 'role.grant' ? after : before;
      const where = side.locationId ? ` at ${valueWords('locationId', side.locationId, names)}` : side.regionId ? ` in ${valueWords('regionId', side.regionId, names)}` : ' across the network';
      const role = ROLE_LABELS[side.role as Role] ?? String(side.role);
      const who = nameOf(names, 'users', side.userId);
      return says(row.action === 'role.grant' ? `Made ${who} ${role}${where}` : `Took the role ${role}${where} from ${who}`);
    }
    case 'close.final':
      return says(`Closed ${String(after.month ?? 'a month')} as final for ${lower(record)}`);
    case 'export.create':
      return says(`Asked for an export of ${String(after.month ?? 'a month')}`, after.format ? [`Format: ${String(after.format)}`] : []);
    case 'plan.create':
    case 'plan.update':
    case 'plan.correct':
    case 'plan.attach': {
      const verb = { 'plan.create': 'Drew', 'plan.update': 'Saved', 'plan.correct': 'Corrected', 'plan.attach': 'Attached' }[row.action];
      const build = after.buildId ? ` of build ${valueWords('buildId', after.buildId, names)}` : '';
      return says(`${verb} the power plan${build}`, note);
    }
  }
  const [kind, verb] = row.action.split('.');
  if (kind === row.entity && (verb === 'create' || verb === 'update')) return says(`${verb === 'create' ? 'Added' : 'Changed'} ${lower(record)}`, changes());
  return says(`${plainly(row.action)}: ${record}`, changes());
}
