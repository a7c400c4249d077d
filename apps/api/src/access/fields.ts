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
