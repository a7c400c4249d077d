import { subject } from '@casl/ability';
import { permittedFieldsOf } from '@casl/ability/extra';
import type { AppAbility, Subject } from '@busbar/shared';

/**
 * A copy of a row without the fields the person may not read (DESIGN.md: field rules hold in
 * lists, details and exports alike). `scope` is the record the rules' conditions are checked
 * against: the row itself, or for a build's items, the build. The rules are read once per row
 * (permittedFieldsOf), not once per field: a page of 50 builds asked about 1,300 fields.
 */
export function readable<T extends object>(ability: AppAbility, type: Exclude<Subject, 'all'>, row: T, scope: object = row): Partial<T> {
  const keys = Object.keys(row);
  const allowed = new Set(permittedFieldsOf(ability, 'read', subject(type, { ...scope }), { fieldsFrom: (rule) => rule.fields ?? keys }));
  const out: Partial<T> = {};
  for (const key of keys) {
    if (allowed.has(key)) out[key as keyof T] = row[key as keyof T];
  }
  return out;
}
