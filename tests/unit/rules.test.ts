import { subject } from '@casl/ability';
import { COST_FIELDS, CONTACT_FIELDS, createAbility, defineRulesFor, PRICE_FIELDS, type RuleAssignment } from '@busbar/shared';
import { describe, expect, it } from 'vitest';

// A network of two regions: region 1 holds locations 1 and 2, region 2 holds location 3.
const ALL = [1, 2, 3];
const at = (role: RuleAssignment['role'], locationId: number): RuleAssignment => ({
  role,
  scope: 'location',
  regionId: null,
  locationId,
  locationIds: [locationId],
});
const network = (role: RuleAssignment['role']): RuleAssignment => ({ role, scope: 'network', regionId: null, locationId: null, locationIds: ALL });
const region1 = (role: RuleAssignment['role']): RuleAssignment => ({ role, scope: 'region', regionId: 1, locationId: null, locationIds: [1, 2] });

const abilityOf = (...assignments: RuleAssignment[]) => createAbility(defineRulesFor({ id: 7, assignments }));
const build = (locationId: number, extra: Record<string, unknown> = {}) => subject('Build', { locationId, ...extra });
const staffRole = (role: string, locationId: number) => subject('RoleAssignment', { role, scope: 'location', regionId: null, locationId });

describe('defineRulesFor', () => {
  it('lets the owner do everything, every field included', () => {
    const ability = abilityOf(network('owner'));
    expect(ability.can('manage', 'all')).toBe(true);
    expect(ability.can('read', 'CatalogItem', 'unitCostCents')).toBe(true);
    expect(ability.can('create', staffRole('location_lead', 3))).toBe(true);
  });

  it('keeps a location lead to their own shop and below their own role', () => {
    const ability = abilityOf(at('location_lead', 1));
    expect(ability.can('update', build(1))).toBe(true);
    expect(ability.can('read', build(2))).toBe(false);
    expect(ability.can('create', staffRole('technician', 1))).toBe(true);
    expect(ability.can('create', staffRole('warranty_clerk', 1))).toBe(true);
    expect(ability.can('approve', subject('Claim', { locationId: 1, aboveLimit: false }))).toBe(true);
    expect(ability.can('approve', subject('Claim', { locationId: 1, aboveLimit: true }))).toBe(false);
    expect(ability.can('send', subject('Claim', { locationId: 1, aboveLimit: true }))).toBe(true);
    expect(ability.can('create', staffRole('location_lead', 1))).toBe(false);
    expect(ability.can('create', staffRole('technician', 2))).toBe(false);
    expect(ability.can('read', 'AuditLog')).toBe(false);
  });

  it('lets a regional manager read their region and appoint its leads only', () => {
    const ability = abilityOf(region1('regional_manager'));
    expect(ability.can('read', build(2))).toBe(true);
    expect(ability.can('read', build(3))).toBe(false);
    expect(ability.can('update', build(1))).toBe(false);
    expect(ability.can('approve', subject('Claim', { locationId: 1 }))).toBe(true);
    expect(ability.can('approve', subject('Claim', { locationId: 1, aboveLimit: true }))).toBe(true);
    expect(ability.can('approve', subject('Claim', { locationId: 3, aboveLimit: false }))).toBe(false);
    expect(ability.can('create', staffRole('location_lead', 2))).toBe(true);
    expect(ability.can('create', staffRole('location_lead', 3))).toBe(false);
    expect(ability.can('create', staffRole('technician', 1))).toBe(false);
    expect(ability.can('read', subject('Region', { id: 1 }))).toBe(true);
    expect(ability.can('read', subject('Region', { id: 2 }))).toBe(false);
  });

  it('lets a technician change only the builds they lead, and hides costs', () => {
    const ability = abilityOf(at('technician', 1));
    expect(ability.can('read', build(1))).toBe(true);
    expect(ability.can('update', build(1, { leadTechnicianId: 7 }))).toBe(true);
    expect(ability.can('update', build(1, { leadTechnicianId: 8 }))).toBe(false);
    for (const field of COST_FIELDS) {
      expect(ability.can('read', 'CatalogItem', field)).toBe(false);
      expect(ability.can('read', build(1), field)).toBe(false);
    }
    expect(ability.can('read', 'CatalogItem', 'unitPriceCents')).toBe(true);
    expect(ability.can('read', 'RoleAssignment')).toBe(false);
  });

  it('hides prices and costs from a warranty clerk, who works claims of their shops', () => {
    const ability = abilityOf(at('warranty_clerk', 1), at('warranty_clerk', 2));
    expect(ability.can('create', subject('Claim', { locationId: 2 }))).toBe(true);
    expect(ability.can('create', subject('Claim', { locationId: 3 }))).toBe(false);
    expect(ability.can('approve', subject('Claim', { locationId: 1 }))).toBe(false);
    for (const field of [...COST_FIELDS, ...PRICE_FIELDS]) expect(ability.can('read', build(1), field)).toBe(false);
    expect(ability.can('read', build(1), 'number')).toBe(true);
  });

  it('shows the accountant money but never customer contact details, and lets them change nothing', () => {
    const ability = abilityOf(network('accountant'));
    expect(ability.can('read', build(3), 'totalCents')).toBe(true);
    expect(ability.can('export', subject('Report', { locationId: 2 }))).toBe(true);
    for (const field of CONTACT_FIELDS) expect(ability.can('read', subject('Customer', { locationId: 1 }), field)).toBe(false);
    expect(ability.can('read', subject('Customer', { locationId: 1 }), 'name')).toBe(true);
    for (const action of ['create', 'update', 'delete', 'approve', 'send'] as const) {
      expect(ability.can(action, build(1))).toBe(false);
      expect(ability.can(action, subject('Claim', { locationId: 1 }))).toBe(false);
    }
  });

  it('keeps a regional accountant inside their region', () => {
    const ability = abilityOf(region1('accountant'));
    expect(ability.can('read', build(1))).toBe(true);
    expect(ability.can('read', build(3))).toBe(false);
  });

  it('takes the union of assignments: a field hidden by one role shows where another role reads it', () => {
    const ability = abilityOf(at('technician', 1), at('location_lead', 2));
    expect(ability.can('read', build(1), 'costCents')).toBe(false);
    expect(ability.can('read', build(2), 'costCents')).toBe(true);
    // The catalog is network-wide: leading any shop shows its costs.
    expect(ability.can('read', 'CatalogItem', 'unitCostCents')).toBe(true);
    const accountantAndClerk = abilityOf(at('warranty_clerk', 3), network('accountant'));
    expect(accountantAndClerk.can('read', build(3), 'totalCents')).toBe(true);
  });

  it('lets technicians and leads make and change power plans at their shop, and the readers only read them', () => {
    const plan = (locationId: number) => subject('Plan', { locationId });
    for (const role of ['technician', 'location_lead'] as const) {
      const ability = abilityOf(at(role, 1));
      for (const action of ['read', 'create', 'update'] as const) {
        expect(ability.can(action, plan(1))).toBe(true);
        expect(ability.can(action, plan(2))).toBe(false);
      }
    }
    const readers = [abilityOf(at('warranty_clerk', 1)), abilityOf(region1('regional_manager')), abilityOf(region1('accountant'))];
    for (const ability of readers) {
      expect(ability.can('read', plan(1))).toBe(true);
      expect(ability.can('read', plan(3))).toBe(false);
      for (const action of ['create', 'update'] as const) expect(ability.can(action, plan(1))).toBe(false);
    }
    expect(abilityOf(network('accountant')).can('read', plan(3))).toBe(true);
    expect(abilityOf(network('owner')).can('update', plan(3))).toBe(true);
    expect(abilityOf().can('read', plan(1))).toBe(false);
  });

  it('rejects an unknown role instead of granting nothing silently', () => {
    const unknown = { ...at('technician', 1), role: 'janitor' } as unknown as RuleAssignment;
    expect(() => defineRulesFor({ id: 1, assignments: [unknown] })).toThrow(/Unknown role/);
  });

  it('grants nothing to a person without assignments', () => {
    const ability = abilityOf();
    expect(ability.can('read', build(1))).toBe(false);
    expect(ability.can('read', 'CatalogItem')).toBe(false);
  });
});
