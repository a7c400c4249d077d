import type { Db } from '@busbar/db';
import { subject } from '@casl/ability';
import type { AppAbility, Subject } from '@busbar/shared';

/**
 * A copy of a row without the fields the person may not read (DESIGN.md: field rules hold in
 * lists, details and exports alike). `scope` is the record the rules' conditions are checked
 * against: the row itself, or for a build's items, the build.
 */
export function readable<T extends object>(ability: AppAbility, type: Exclude<Subject, 'all'>, row: T, scope: object = row): Partial<T> {
  const target = subject(type, { ...scope });
  const out: Partial<T> = {};
  for (const [key, value] of Object.entries(row)) {
    if (ability.can('read', target, key)) out[key as keyof T] = value;
  }
  return out;
}

/** Ids of the locations where the person may do `action` on records of `type`. */
export async function locationsWhere(db: Db, ability: AppAbility, action: 'read' | 'create', type: Exclude<Subject, 'all'>): Promise<number[]> {
  const ids = (await db.selectFrom('locations').select('id').execute()).map((l) => l.id);
  return ids.filter((locationId) => ability.can(action, subject(type, { locationId })));
}
