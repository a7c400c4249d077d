import { subject } from '@casl/ability';
import { COST_FIELDS, CONTACT_FIELDS, createAbility, defineRulesFor, PRICE_FIELDS, type RuleAssignment, type Subject } from '@busbar/shared';
import { describe, expect, it } from 'vitest';
import { readable } from '../../apps/api/src/access/fields.ts';

// A network of two regions: region 1 holds locations 1 and 2, region 2 holds location 3.
const at = (role: RuleAssignment['role'], locationId: number): RuleAssignment => ({ role, scope: 'location', regionId: null, locationId, locationIds: [locationId] });
const region1 = (role: RuleAssignment['role']): RuleAssignment => ({ role, scope: 'region', regionId: 1, locationId: null, locationIds: [1, 2] });
const network = (role: RuleAssignment['role']): RuleAssignment => ({ role, scope: 'network', regionId: null, locationId: null, locationIds: [1, 2, 3] });

const PEOPLE: Record<string, RuleAssignment[]> = {
  owner: [network('owner')],
  'a technician': [at('technician', 1)],
  'a technician at one shop who leads another': [at('technician', 1), at('location_lead', 2)],
  'a warranty clerk who is a technician elsewhere': [at('warranty_clerk', 1), at('technician', 2)],
  'a regional accountant': [region1('accountant')],
  'a regional manager who is a technician in the other region': [region1('regional_manager'), at('technician', 3)],
};

const buildRow = (id: number, locationId: number) => ({
  id,
  number: `B-${id}`,
  locationId,
  status: 'delivered',
  notes: 'fitted',
  ...Object.fromEntries([...COST_FIELDS, ...PRICE_FIELDS].map((field, i) => [field, 100 * id + i])),
});
const customerRow = (id: number, locationId: number) => ({ id, locationId, name: `Customer ${id}`, ...Object.fromEntries(CONTACT_FIELDS.map((field) => [field, `${field} ${id}`])) });

/** The row's fields and values CASL itself lets the person read, asked one field at a time, in the row's order. */
const fieldByField = (ability: ReturnType<typeof createAbility>, type: Exclude<Subject, 'all'>, row: Record<string, unknown>, scope: Record<string, unknown> = row) =>
  Object.entries(row).filter(([field]) => ability.can('read', subject(type, { ...scope }), field));

describe('readable', () => {
  // Shops in turn, so an answer kept for one shop's rows would show on the next shop's.
  const shops = [2, 1, 3, 1, 2, 3, 2];

  it.each(Object.entries(PEOPLE))("keeps the fields CASL lets %s read, row by row, as the rows' shops change", (_who, assignments) => {
    const ability = createAbility(defineRulesFor({ id: 7, assignments }));
    for (const [i, locationId] of shops.entries()) {
      const build = buildRow(i + 1, locationId);
      expect(Object.entries(readable(ability, 'Build', build))).toEqual(fieldByField(ability, 'Build', build));
      const customer = customerRow(i + 1, locationId);
      expect(Object.entries(readable(ability, 'Customer', customer))).toEqual(fieldByField(ability, 'Customer', customer));
      // A build's line is judged by its build; a line lists other fields than the build.
      const line = { id: 50 + i, sku: 'SKU-1', quantity: 1, unitPriceCents: 999, unitCostCents: 555 };
      expect(Object.entries(readable(ability, 'Build', line, build))).toEqual(fieldByField(ability, 'Build', line, build));
    }
  });

  it('shows costs where a person leads and hides them where they only work, on one page', () => {
    const ability = createAbility(defineRulesFor({ id: 7, assignments: PEOPLE['a technician at one shop who leads another']! }));
    const page = shops.filter((shop) => shop !== 3).map((shop, i) => readable(ability, 'Build', buildRow(i + 1, shop)));
    expect(page.map((row) => [row.locationId, 'partsCostCents' in row])).toEqual(shops.filter((shop) => shop !== 3).map((shop) => [shop, shop === 2]));
  });

  it('answers each person by their own rules, though their rows agree', () => {
    const owner = createAbility(defineRulesFor({ id: 1, assignments: PEOPLE.owner! }));
    const technician = createAbility(defineRulesFor({ id: 2, assignments: PEOPLE['a technician']! }));
    const row = buildRow(1, 1);
    expect(readable(owner, 'Build', row)).toHaveProperty('partsCostCents');
    expect(readable(technician, 'Build', row)).not.toHaveProperty('partsCostCents');
    expect(readable(owner, 'Build', row)).toHaveProperty('partsCostCents');
  });

  it('copies a field named __proto__ as a field, leaving the copy an ordinary object', () => {
    const owner = createAbility(defineRulesFor({ id: 1, assignments: PEOPLE.owner! }));
    const row = JSON.parse('{"id": 1, "locationId": 1, "__proto__": null}') as Record<string, unknown>;
    const copy = readable(owner, 'Customer', row);
    expect(Object.getPrototypeOf(copy)).toBe(Object.prototype);
    expect(Object.entries(copy)).toEqual([['id', 1], ['locationId', 1], ['__proto__', null]]);
  });
});
