import type { Db } from '@busbar/db';
import { SPEC_SCHEMAS, type Category, type VehicleView } from '@busbar/shared';

let serial = 0;

/** A vendor straight in the database, with a name no other fixture uses. */
export async function addVendor(db: Db, fields: { name?: string; rmaEmail?: string; active?: boolean } = {}) {
  const n = ++serial;
  const values = {
    name: fields.name ?? `Fixture Vendor ${n}`,
    rmaEmail: fields.rmaEmail ?? `rma.${n}@vendor.busbar.test`,
    defaultWarrantyMonths: 24,
    active: fields.active === false ? 0 : 1,
  };
  const row = await db.insertInto('vendors').values(values).returning('id').executeTakeFirstOrThrow();
  return { id: row.id, name: values.name, rmaEmail: values.rmaEmail };
}

export interface ItemFields {
  vendorId: number;
  sku?: string;
  name?: string;
  category?: Category;
  /** Checked against the category's schema, so fixture items are ones the API would accept. */
  specs?: Record<string, unknown>;
  serialized?: boolean;
  unitCostCents?: number;
  unitPriceCents?: number;
  warrantyMonths?: number;
  active?: boolean;
}

/** A catalog item straight in the database; by default a serialized 100 Ah LiFePO4 house battery. */
export async function addCatalogItem(db: Db, fields: ItemFields) {
  const n = ++serial;
  const category = fields.category ?? 'house_battery';
  const specs = SPEC_SCHEMAS[category].parse(fields.specs ?? { chemistry: 'lifepo4', capacityAh: 100, nominalV: 12.8 });
  const values = {
    vendorId: fields.vendorId,
    sku: fields.sku ?? `FX-${n}`,
    name: fields.name ?? `Fixture item ${n}`,
    category,
    specs: JSON.stringify(specs),
    serialized: (fields.serialized ?? true) ? 1 : 0,
    unitCostCents: fields.unitCostCents ?? 40_000,
    unitPriceCents: fields.unitPriceCents ?? 65_000,
    warrantyMonths: fields.warrantyMonths ?? 24,
    active: fields.active === false ? 0 : 1,
  };
  const row = await db.insertInto('catalogItems').values(values).returning('id').executeTakeFirstOrThrow();
  return { id: row.id, ...values, specs };
}

/** A customer of a location straight in the database, with every contact field filled. */
export async function addCustomer(db: Db, locationId: number, fields: { name?: string; email?: string; phone?: string } = {}) {
  const n = ++serial;
  const values = {
    locationId,
    name: fields.name ?? `Fixture Customer ${n}`,
    email: fields.email ?? `customer.${n}@mail.busbar.test`,
    phone: fields.phone ?? `555-01${String(n).padStart(2, '0')}`,
    addressLine1: `${n} Fixture Road`,
    addressLine2: '',
    city: 'Golden',
    region: 'CO',
    postalCode: '80401',
    notes: '',
    createdAt: '2026-06-01T12:00:00.000Z',
  };
  const row = await db.insertInto('customers').values(values).returning('id').executeTakeFirstOrThrow();
  return { id: row.id, ...values };
}

/** A vehicle of a customer straight in the database, at the customer's location. */
export async function addVehicle(db: Db, customer: { id: number; locationId: number }, fields: Partial<Pick<VehicleView, 'year' | 'bodyStyle' | 'make' | 'model'>> = {}) {
  const values = {
    customerId: customer.id,
    locationId: customer.locationId,
    year: fields.year ?? 2021,
    bodyStyle: fields.bodyStyle ?? 'pickup',
    make: fields.make ?? 'Fixture Motors',
    model: fields.model ?? 'Hauler Fieldline',
    notes: '',
    vin: null,
    plate: null,
    mileage: null,
    mileageReadOn: null,
  };
  const row = await db.insertInto('vehicles').values(values).returning('id').executeTakeFirstOrThrow();
  return { id: row.id, ...values };
}

/** Row counts of every table these routes write, to show a refused request wrote nothing. */
export async function catalogRows(db: Db) {
  const count = async (table: 'vendors' | 'catalogItems' | 'customers' | 'vehicles' | 'auditLog') =>
    Number((await db.selectFrom(table).select((eb) => eb.fn.countAll<number>().as('n')).executeTakeFirstOrThrow()).n);
  return {
    vendors: await count('vendors'),
    catalogItems: await count('catalogItems'),
    customers: await count('customers'),
    vehicles: await count('vehicles'),
    auditLog: await count('auditLog'),
  };
}

/** The audit rows of one record, oldest first, with before and after parsed. */
export async function auditOf(db: Db, entity: string, entityId: number) {
  const rows = await db
    .selectFrom('auditLog')
    .select(['at', 'actorId', 'action', 'before', 'after'])
    .where('entity', '=', entity)
    .where('entityId', '=', entityId)
    .orderBy('id')
    .execute();
  const parse = (text: string | null) => (text === null ? null : (JSON.parse(text) as unknown));
  return rows.map((r) => ({ ...r, before: parse(r.before), after: parse(r.after) }));
}
