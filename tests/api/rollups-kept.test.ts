import type { Db } from '@busbar/db';
import { CATEGORIES, type BuildStatus } from '@busbar/shared';
import fc from 'fast-check';
import { sql } from 'kysely';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { MIX_CATEGORIES } from '../../db/migrations/021-create-rollups.ts';
import { REFILL_ROLLUPS } from '../../db/migrations/042-create-rollup-sums.ts';
import { refillRollups } from '../../apps/api/src/queries/rollups-refill.ts';
import { startHarness, type Harness } from '../support/api-harness.ts';
import { afterRefill, rolledBack } from '../support/kept-tables.ts';
import { addCustomerWithVehicle, addParts } from '../support/build-fixtures.ts';

let h: Harness;
beforeAll(async () => {
  h = await startHarness();
  await smallNetwork(h.db);
});
afterAll(() => h.close());

const STATUSES: BuildStatus[] = ['draft', 'quoted', 'booked', 'in_bay', 'quality_check', 'delivered', 'cancelled'];

/** Eight builds a shop in every status, two to three lines each, deliveries around midnight UTC, claims on a few delivered lines. */
async function smallNetwork(db: Db) {
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

/** The kept table without its emptied rows, in key order. */
async function keptTables(db: Db) {
  const rows = await sql<Record<string, unknown>>`select * from rollup_figures order by 1, 2, 3`.execute(db);
  const key = ['grain', 'period', 'locationId'];
  return rows.rows.filter((row) => Object.entries(row).some(([column, value]) => !key.includes(column) && value !== 0));
}

const refilled = (db: Db) => afterRefill(db, REFILL_ROLLUPS, keptTables);

/** The network's and the regions' kept sums (migration 042), and the same summed from the locations' rows; neither with emptied rows. */
async function networkAndRegions(db: Db) {
  const { rows } = await sql<{ name: string }>`select name from pragma_table_info('rollup_figures')`.execute(db);
  const figures = rows.map((r) => r.name).filter((name) => !['grain', 'period', 'location_id'].includes(name));
  const any = (of: (f: string) => string) => figures.map((f) => `${of(f)} <> 0`).join(' or ');
  const read = async (query: string) => (await sql.raw<Record<string, unknown>>(query).execute(db)).rows;
  const summed = figures.map((f) => `sum(f.${f}) as ${f}`).join(', ');
  return {
    kept: {
      network: await read(`select grain, period, ${figures.join(', ')} from rollup_network where ${any((f) => f)} order by 1, 2`),
      regions: await read(`select grain, period, region_id, ${figures.join(', ')} from rollup_region where ${any((f) => f)} order by 1, 2, 3`),
    },
    summed: {
      network: await read(`select f.grain, f.period, ${summed} from rollup_figures f group by 1, 2 having ${any((f) => `sum(f.${f})`)} order by 1, 2`),
      regions: await read(`select f.grain, f.period, l.region_id, ${summed} from rollup_figures f join locations l on l.id = f.location_id
        group by 1, 2, 3 having ${any((f) => `sum(f.${f})`)} order by 1, 2, 3`),
    },
  };
}

async function expectSumsAgree(db: Db) {
  const { kept, summed } = await networkAndRegions(db);
  expect(kept).toEqual(summed);
  return kept;
}

type Change =
  | { kind: 'create'; like: number; bookedFor: string; status: BuildStatus }
  | { kind: 'import'; like: number; at: string; lines: number[] }
  | { kind: 'edit'; buildId: number; laborHours: number; totalCents: number; partsCostCents: number; bookedFor: string | null }
  | { kind: 'status'; buildId: number; status: BuildStatus; at: string; localDay: boolean }
  | { kind: 'addLine'; buildId: number; itemId: number }
  | { kind: 'changeLine'; lineId: number; itemId: number }
  | { kind: 'removeLine'; lineId: number }
  | { kind: 'takeBack'; buildId: number }
  | { kind: 'claim'; lineId: number; at: string; laborHours: number; requested: number }
  | { kind: 'claimEdit'; claimId: number; received: number | null; laborHours: number }
  | { kind: 'rate'; buildId: number; rate: number }
  | { kind: 'move'; buildId: number; locationId: number }
  | { kind: 'category'; itemId: number; category: 'inverter' | 'solar_panel' | 'fuse_block' };

let counter = 0;

/** Applies one change straight to the tables, as the API, the importer or a bulk correction would write it. */
async function apply(db: Db, c: Change) {
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
    await db.updateTable('warrantyClaims').set({ creditReceivedCents: c.received, laborHours: c.laborHours }).where('id', '=', c.claimId).execute();
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

describe('the roll-up table follows every change', () => {
  it('has a job-mix column for every category of the catalog', () => {
    expect(MIX_CATEGORIES).toEqual([...CATEGORIES]);
  });

  it('match a refill from scratch after any mix of creates, edits, status changes, cancellations, corrections, claims and imports', async () => {
    const builds = (await h.db.selectFrom('builds').select('id').orderBy('id').execute()).map((b) => b.id);
    const lines = (await h.db.selectFrom('buildItems').select('id').orderBy('id').execute()).map((l) => l.id);
    const claims = (await h.db.selectFrom('warrantyClaims').select('id').execute()).map((c) => c.id);
    const items = (await h.db.selectFrom('catalogItems').select('id').execute()).map((i) => i.id);
    const locations = (await h.db.selectFrom('locations').select('id').execute()).map((l) => l.id);
    const pick = (list: number[]) => fc.integer({ min: 0, max: list.length - 1 }).map((i) => list[i]!);
    // Moments around midnight UTC of days across a year boundary and a year apart.
    const at = fc.tuple(fc.integer({ min: 330, max: 400 }), fc.integer({ min: 0, max: 1439 }))
      .map(([d, m]) => new Date(Date.UTC(2025, 0, 1) + d * 86_400_000 + m * 60_000).toISOString());
    const day = at.map((iso) => iso.slice(0, 10));
    const cents = fc.integer({ min: 0, max: 500_000 });
    const hours = fc.integer({ min: 0, max: 40 }).map((q) => q / 4);
    const change: fc.Arbitrary<Change> = fc.oneof(
      fc.record({ kind: fc.constant('create' as const), like: pick(builds), bookedFor: day, status: fc.constantFrom<BuildStatus>('draft', 'booked', 'in_bay') }),
      fc.record({ kind: fc.constant('import' as const), like: pick(builds), at, lines: fc.array(pick(items), { minLength: 1, maxLength: 3 }) }),
      fc.record({ kind: fc.constant('edit' as const), buildId: pick(builds), laborHours: hours, totalCents: cents, partsCostCents: cents, bookedFor: fc.option(day) }),
      fc.record({ kind: fc.constant('status' as const), buildId: pick(builds), status: fc.constantFrom(...STATUSES), at, localDay: fc.boolean() }),
      fc.record({ kind: fc.constant('addLine' as const), buildId: pick(builds), itemId: pick(items) }),
      fc.record({ kind: fc.constant('changeLine' as const), lineId: pick(lines), itemId: pick(items) }),
      fc.record({ kind: fc.constant('removeLine' as const), lineId: pick(lines) }),
      fc.record({ kind: fc.constant('takeBack' as const), buildId: pick(builds) }),
      fc.record({ kind: fc.constant('claim' as const), lineId: pick(lines), at, laborHours: hours, requested: cents }),
      fc.record({ kind: fc.constant('claimEdit' as const), claimId: pick(claims), received: fc.option(cents), laborHours: hours }),
      fc.record({ kind: fc.constant('rate' as const), buildId: pick(builds), rate: fc.integer({ min: 5_000, max: 20_000 }) }),
      fc.record({ kind: fc.constant('move' as const), buildId: pick(builds), locationId: pick(locations) }),
      fc.record({ kind: fc.constant('category' as const), itemId: pick(items), category: fc.constantFrom('inverter' as const, 'solar_panel' as const, 'fuse_block' as const) }),
    );
    const before = await keptTables(h.db);
    expect(before).toEqual(await refilled(h.db));
    expect(before.length).toBeGreaterThan(100);
    expect((await expectSumsAgree(h.db)).regions.length).toBeGreaterThan(40);
    await fc.assert(
      fc.asyncProperty(fc.array(change, { minLength: 1, maxLength: 15 }), async (changes) => {
        await rolledBack(h.db, async () => {
          for (const c of changes) await apply(h.db, c);
          expect(await keptTables(h.db)).toEqual(await refilled(h.db));
          await expectSumsAgree(h.db);
        });
      }),
      { seed: 10_021, numRuns: 120 },
    );
  }, 60_000);

  it("keeps the regions' sums when a location moves to another region", async () => {
    const locations = await h.db.selectFrom('locations').select(['id', 'regionId']).orderBy('id').execute();
    const moved = locations[0]!;
    const other = locations.find((l) => l.regionId !== moved.regionId)!;
    const before = await expectSumsAgree(h.db);
    await rolledBack(h.db, async () => {
      await h.db.updateTable('locations').set({ regionId: other.regionId }).where('id', '=', moved.id).execute();
      const after = await expectSumsAgree(h.db);
      expect(after.network).toEqual(before.network);
      expect(after.regions).not.toEqual(before.regions);
    });
  });

  it('is rebuilt by the refill command after it was changed behind the triggers', async () => {
    const kept = await keptTables(h.db);
    await sql`delete from rollup_figures where grain = 'month'`.execute(h.db);
    await sql`update rollup_figures set revenue_cents = 0 where grain = 'day'`.execute(h.db);
    await sql`update rollup_network set builds_delivered = builds_delivered + 1`.execute(h.db);
    await sql`delete from rollup_region where grain = 'week'`.execute(h.db);
    expect(await keptTables(h.db)).not.toEqual(kept);
    await refillRollups(h.db);
    expect(await keptTables(h.db)).toEqual(kept);
    await expectSumsAgree(h.db);
  });
});
