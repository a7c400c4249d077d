import type { Db } from '@busbar/db';
import { CLAIM_STATUSES, type BuildStatus, type ClaimStatus } from '@busbar/shared';
import fc from 'fast-check';
import { addCustomerWithVehicle, addParts } from './build-fixtures.ts';

/**
 * Changes written straight to builds, their lines and claims, as the API, the importer or a bulk
 * correction would write them: for checking that tables kept by triggers match a refill from scratch.
 */
const STATUSES: BuildStatus[] = ['draft', 'quoted', 'booked', 'in_bay', 'quality_check', 'delivered', 'cancelled'];

/** Eight builds a shop in every status, two to three lines each, deliveries around midnight UTC, claims on a few delivered lines. */
export async function smallNetwork(db: Db) {
  const { battery, charger, fuse } = await addParts(db);
  const locations = await db.selectFrom('locations').select(['id', 'laborRateCents']).execute();
  let n = 0;
  for (const location of locations) {
    const { customer, vehicle } = await addCustomerWithVehicle(db, location.id);
    for (let i = 0; i < 8; i++) {
      n++;
      const status = i < 3 ? 'delivered' : STATUSES[i - 3]!;
      const deliveredAt = new Date(Date.UTC(2025, 11, 20 + i * 3, (n * 7) % 24, 30)).toISOString();
      const build = await db
        .insertInto('builds')
        .values({
          locationId: location.id, sequence: n, number: `S-${n}`, customerId: customer.id, vehicleId: vehicle.id, status, leadTechnicianId: null,
          bookedFor: deliveredAt.slice(0, 10), startedAt: null, deliveredAt: status === 'delivered' ? deliveredAt : null, deliveredOn: status === 'delivered' ? deliveredAt.slice(0, 10) : null,
          laborHours: 1 + i / 4, laborRateCents: location.laborRateCents, laborCents: 0, partsPriceCents: 0, partsCostCents: 40_000 + n, totalCents: 90_000 + n * 10,
          notes: '', createdBy: null, createdAt: '2025-12-01T12:00:00.000Z', updatedAt: '2025-12-01T12:00:00.000Z',
        })
        .returning('id')
        .executeTakeFirstOrThrow();
      for (const item of i % 2 ? [battery, fuse] : [charger, fuse, battery]) await addLine(db, build.id, item.id);
    }
  }
  const delivered = await db.selectFrom('buildItems as i').innerJoin('builds as b', 'b.id', 'i.buildId').select('i.id').where('b.status', '=', 'delivered').where('i.catalogItemId', '=', charger.id).execute();
  for (const [k, line] of delivered.entries()) {
    await apply(db, { kind: 'claim', lineId: line.id, at: new Date(Date.UTC(2026, 0, 2 + k, 23, 10)).toISOString(), laborHours: k / 2, requested: 10_000 * k });
  }
}

export type Change =
  | { kind: 'create'; like: number; bookedFor: string; status: BuildStatus }
  | { kind: 'import'; like: number; at: string; lines: number[] }
  | { kind: 'edit'; buildId: number; laborHours: number; laborCents: number; partsPriceCents: number; totalCents: number; partsCostCents: number; bookedFor: string | null }
  | { kind: 'status'; buildId: number; status: BuildStatus; at: string; localDay: boolean }
  | { kind: 'addLine'; buildId: number; itemId: number }
  | { kind: 'changeLine'; lineId: number; itemId: number }
  | { kind: 'removeLine'; lineId: number }
  | { kind: 'takeBack'; buildId: number }
  | { kind: 'claim'; lineId: number; at: string; laborHours: number; requested: number }
  | { kind: 'claimEdit'; claimId: number; received: number | null; laborHours: number; requested: number; status: ClaimStatus }
  | { kind: 'rate'; buildId: number; rate: number }
  | { kind: 'move'; buildId: number; locationId: number }
  | { kind: 'category'; itemId: number; category: 'inverter' | 'solar_panel' | 'fuse_block' };

let counter = 0;

/** Applies one change straight to the tables, as the API, the importer or a bulk correction would write it. */
export async function apply(db: Db, c: Change) {
  if (c.kind === 'create' || c.kind === 'import') {
    const like = await db.selectFrom('builds').selectAll().where('id', '=', c.like).executeTakeFirst();
    if (!like) return;
    const n = ++counter;
    const delivered = c.kind === 'import';
    const { id: _, version: __, ...fields } = like;
    const row = await db
      .insertInto('builds')
      .values({
        ...fields, sequence: 900_000 + n, number: `T-${n}`, status: delivered ? 'delivered' : c.status,
        bookedFor: delivered ? c.at.slice(0, 10) : c.bookedFor, deliveredAt: delivered ? c.at : null, deliveredOn: delivered ? c.at.slice(0, 10) : null,
      })
      .returning('id')
      .executeTakeFirstOrThrow();
    if (c.kind === 'import') for (const itemId of c.lines) await addLine(db, row.id, itemId);
  } else if (c.kind === 'edit') {
    const { buildId, kind: _, ...values } = c;
    await db.updateTable('builds').set(values).where('id', '=', buildId).execute();
  } else if (c.kind === 'status') {
    const delivered = c.status === 'delivered';
    await db.updateTable('builds')
      .set({ status: c.status, deliveredAt: delivered ? c.at : null, deliveredOn: delivered && c.localDay ? c.at.slice(0, 10) : null })
      .where('id', '=', c.buildId)
      .execute();
  } else if (c.kind === 'addLine') await addLine(db, c.buildId, c.itemId);
  else if (c.kind === 'changeLine') await db.updateTable('buildItems').set({ catalogItemId: c.itemId }).where('id', '=', c.lineId).execute();
  else if (c.kind === 'removeLine') await refusedIfReferred(db.deleteFrom('buildItems').where('id', '=', c.lineId).execute());
  else if (c.kind === 'takeBack') await refusedIfReferred(db.deleteFrom('builds').where('id', '=', c.buildId).execute());
  else if (c.kind === 'claim') {
    const line = await db.selectFrom('buildItems as i').innerJoin('builds as b', 'b.id', 'i.buildId').select(['i.id', 'i.buildId', 'i.catalogItemId', 'b.locationId']).where('i.id', '=', c.lineId).executeTakeFirst();
    if (!line) return;
    const n = ++counter;
    await db
      .insertInto('warrantyClaims')
      .values({
        locationId: line.locationId, sequence: 900_000 + n, number: `T-W${n}`, buildId: line.buildId, buildItemId: line.id, catalogItemId: line.catalogItemId,
        failedOn: c.at.slice(0, 10), failureMode: 'will_not_charge', coverage: 'vendor_defect', symptoms: 'No output', foundHow: '', laborHours: c.laborHours,
        outOfWarranty: 0, status: 'logged', dueOn: null, creditRequestedCents: c.requested, createdBy: null, createdAt: c.at, loggedOn: c.at.slice(0, 10), updatedAt: c.at,
      })
      .execute();
  } else if (c.kind === 'claimEdit') {
    await db.updateTable('warrantyClaims').set({ creditReceivedCents: c.received, laborHours: c.laborHours, creditRequestedCents: c.requested, status: c.status }).where('id', '=', c.claimId).execute();
  } else if (c.kind === 'rate') await db.updateTable('builds').set({ laborRateCents: c.rate }).where('id', '=', c.buildId).execute();
  else if (c.kind === 'move') await db.updateTable('builds').set({ locationId: c.locationId, sequence: 900_000 + ++counter }).where('id', '=', c.buildId).execute();
  else await db.updateTable('catalogItems').set({ category: c.category }).where('id', '=', c.itemId).execute();
}

/** A line or build that a claim or plan refers to cannot go: the statement is refused whole, triggers and all. */
async function refusedIfReferred(deletion: Promise<unknown>) {
  try {
    await deletion;
  } catch (error) {
    if ((error as { code?: string }).code !== 'SQLITE_CONSTRAINT_FOREIGNKEY') throw error;
  }
}

async function addLine(db: Db, buildId: number, itemId: number) {
  const item = await db.selectFrom('catalogItems').select(['sku', 'unitPriceCents', 'unitCostCents']).where('id', '=', itemId).executeTakeFirstOrThrow();
  await db.insertInto('buildItems').values({ buildId, catalogItemId: itemId, quantity: 1, serialNumber: null, ...item, createdAt: '2026-01-01T00:00:00.000Z' }).execute();
}

/** Any change to the small network's builds, lines, claims, shops and catalog, of the rows there now. */
export async function anyChange(db: Db): Promise<fc.Arbitrary<Change>> {
  const builds = (await db.selectFrom('builds').select('id').orderBy('id').execute()).map((b) => b.id);
  const lines = (await db.selectFrom('buildItems').select('id').orderBy('id').execute()).map((l) => l.id);
  const claims = (await db.selectFrom('warrantyClaims').select('id').execute()).map((c) => c.id);
  const items = (await db.selectFrom('catalogItems').select('id').execute()).map((i) => i.id);
  const locations = (await db.selectFrom('locations').select('id').execute()).map((l) => l.id);
  const pick = (list: number[]) => fc.integer({ min: 0, max: list.length - 1 }).map((i) => list[i]!);
  // Moments around midnight UTC of days across a year boundary and a year apart.
  const at = fc.tuple(fc.integer({ min: 330, max: 400 }), fc.integer({ min: 0, max: 1439 }))
    .map(([d, m]) => new Date(Date.UTC(2025, 0, 1) + d * 86_400_000 + m * 60_000).toISOString());
  const day = at.map((iso) => iso.slice(0, 10));
  const cents = fc.integer({ min: 0, max: 500_000 });
  const hours = fc.integer({ min: 0, max: 40 }).map((q) => q / 4);
  return fc.oneof(
    fc.record({ kind: fc.constant('create' as const), like: pick(builds), bookedFor: day, status: fc.constantFrom<BuildStatus>('draft', 'booked', 'in_bay') }),
    fc.record({ kind: fc.constant('import' as const), like: pick(builds), at, lines: fc.array(pick(items), { minLength: 1, maxLength: 3 }) }),
    fc.record({ kind: fc.constant('edit' as const), buildId: pick(builds), laborHours: hours, laborCents: cents, partsPriceCents: cents, totalCents: cents, partsCostCents: cents, bookedFor: fc.option(day) }),
    fc.record({ kind: fc.constant('status' as const), buildId: pick(builds), status: fc.constantFrom(...STATUSES), at, localDay: fc.boolean() }),
    fc.record({ kind: fc.constant('addLine' as const), buildId: pick(builds), itemId: pick(items) }),
    fc.record({ kind: fc.constant('changeLine' as const), lineId: pick(lines), itemId: pick(items) }),
    fc.record({ kind: fc.constant('removeLine' as const), lineId: pick(lines) }),
    fc.record({ kind: fc.constant('takeBack' as const), buildId: pick(builds) }),
    fc.record({ kind: fc.constant('claim' as const), lineId: pick(lines), at, laborHours: hours, requested: cents }),
    fc.record({ kind: fc.constant('claimEdit' as const), claimId: pick(claims), received: fc.option(cents), laborHours: hours, requested: cents, status: fc.constantFrom(...CLAIM_STATUSES) }),
    fc.record({ kind: fc.constant('rate' as const), buildId: pick(builds), rate: fc.integer({ min: 5_000, max: 20_000 }) }),
    fc.record({ kind: fc.constant('move' as const), buildId: pick(builds), locationId: pick(locations) }),
    fc.record({ kind: fc.constant('category' as const), itemId: pick(items), category: fc.constantFrom('inverter' as const, 'solar_panel' as const, 'fuse_block' as const) }),
  );
}
