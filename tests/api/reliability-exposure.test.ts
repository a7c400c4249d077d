import { dayOfIso, kaplanMeier } from '@busbar/calc';
import type { Db } from '@busbar/db';
import { DAYS_PER_MONTH, type ReliabilityDetail } from '@busbar/shared';
import fc from 'fast-check';
import { sql } from 'kysely';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { REFILL_UNIT_EXPOSURE } from '../../db/migrations/046-create-workmanship-counts.ts';
import { demoIds, startHarness, type Harness } from '../support/api-harness.ts';
import { afterRefill, rolledBack } from '../support/kept-tables.ts';
import { addCatalogItem, addVendor } from '../support/catalog-fixtures.ts';
import { addDeliveredUnit } from '../support/claim-fixtures.ts';

let h: Harness;
let ids: Awaited<ReturnType<typeof demoIds>>;
beforeAll(async () => {
  h = await startHarness();
  ids = await demoIds(h.db);
});
afterAll(() => h.close());

const TODAY = '2026-06-15';

/** A hand-made network: one charger at two shops, every unit written down with its install day and failure. */
async function handMadeNetwork(db: Db) {
  const vendor = await addVendor(db);
  const charger = await addCatalogItem(db, { vendorId: vendor.id, category: 'dc_dc_charger', specs: { outputA: 40 }, warrantyMonths: 12 });
  const units: { locationId: number; installedOn: string; quantity: number; failedOn: string[] }[] = [];
  let claimNumber = 0;
  async function build(code: string, deliveredAt: string | null, lines: { quantity: number; failedOn?: string[]; addedOn?: string }[]) {
    const locationId = ids.location(code);
    const base = await addDeliveredUnit(db, locationId, { deliveredAt: deliveredAt ?? '2026-01-01T00:00:00.000Z' });
    if (!deliveredAt) await db.updateTable('builds').set({ status: 'in_bay', deliveredAt: null }).where('id', '=', base.buildId).execute();
    await db.deleteFrom('buildItems').where('id', '=', base.buildItemId).execute();
    for (const line of lines) {
      const createdAt = line.addedOn ? `${line.addedOn}T10:00:00.000Z` : '2025-01-01T08:00:00.000Z';
      const item = await db
        .insertInto('buildItems')
        .values({ buildId: base.buildId, catalogItemId: charger.id, sku: charger.sku, quantity: line.quantity, serialNumber: null, unitPriceCents: 1, unitCostCents: 1, createdAt })
        .returning('id')
        .executeTakeFirstOrThrow();
      for (const failedOn of line.failedOn ?? []) {
        const n = ++claimNumber;
        await db
          .insertInto('warrantyClaims')
          .values({
            locationId, sequence: n, number: `${code}-W9${String(n).padStart(4, '0')}`, buildId: base.buildId, buildItemId: item.id, catalogItemId: charger.id,
            failedOn, failureMode: 'will_not_charge', coverage: 'vendor_defect', symptoms: 'No output', foundHow: '', laborHours: 0, outOfWarranty: 0,
            status: 'logged', dueOn: null, creditRequestedCents: 0, createdBy: null, createdAt: `${failedOn}T12:00:00.000Z`, updatedAt: `${failedOn}T12:00:00.000Z`,
          })
          .execute();
      }
      const installedOn = [deliveredAt?.slice(0, 10) ?? '', line.addedOn ?? ''].sort().at(-1)!;
      if (deliveredAt) units.push({ locationId, installedOn, quantity: line.quantity, failedOn: line.failedOn ?? [] });
    }
  }
  await build('DEN', '2025-07-01T16:00:00.000Z', [{ quantity: 1, failedOn: ['2025-09-10'] }, { quantity: 3 }]);
  await build('DEN', '2026-02-20T23:30:00.000Z', [{ quantity: 2, failedOn: ['2026-02-21'] }]);
  // A replacement added months after delivery starts its life on its own day.
  await build('BOI', '2025-11-03T09:00:00.000Z', [{ quantity: 1, failedOn: ['2026-01-05'] }, { quantity: 1, addedOn: '2026-01-06' }]);
  await build('BOI', null, [{ quantity: 5 }]);
  return { charger, units };
}

/** Unit-days counted one unit at a time: each failure ends one unit on its day, the rest run until today. */
function directUnitDays(units: { installedOn: string; quantity: number; failedOn: string[] }[]): number {
  let days = 0;
  for (const unit of units) {
    for (const failedOn of unit.failedOn) days += dayOfIso(failedOn) - dayOfIso(unit.installedOn);
    days += (unit.quantity - unit.failedOn.length) * (dayOfIso(TODAY) - dayOfIso(unit.installedOn));
  }
  return days;
}

describe('exposure from the kept tables', () => {
  it('equals a direct count of every unit of a small hand-made network, per location and in total', async () => {
    const { charger, units } = await handMadeNetwork(h.db);
    // By hand: 4 units from 2025-07-01 (one failed after 71 days), 2 from 2026-02-20 (one after 1 day),
    // 1 from 2025-11-03 (failed after 63 days) and 1 from 2026-01-06; the in-bay build counts for nothing.
    const byHand = 71 + 3 * 349 + 1 + 115 + 63 + 160;
    expect(directUnitDays(units)).toBe(byHand);

    const owner = await h.signedIn('owner@demo.busbar.test');
    const detail = (await owner.get(`/api/reliability/item/${charger.id}`).expect(200)).body as ReliabilityDetail;
    expect(detail.figures.units).toBe(8);
    expect(detail.figures.failures).toBe(3);
    expect(detail.figures.unitMonths).toBeCloseTo(byHand / DAYS_PER_MONTH, 9);
    for (const code of ['DEN', 'BOI']) {
      const point = detail.funnel.points.find((p) => p.code === code)!;
      const here = units.filter((u) => u.locationId === ids.location(code));
      expect(point.unitMonths).toBeCloseTo(directUnitDays(here) / DAYS_PER_MONTH, 9);
      expect(point.failures).toBe(here.reduce((sum, u) => sum + u.failedOn.length, 0));
    }
    // Each install month's working units here went in on one day, so grouping them loses nothing:
    // the survival curve is the Kaplan–Meier curve of the units one by one.
    const oneByOne = units.flatMap((u) => [
      ...u.failedOn.map((failedOn) => ({ time: dayOfIso(failedOn) - dayOfIso(u.installedOn), failed: true })),
      ...Array.from({ length: u.quantity - u.failedOn.length }, () => ({ time: dayOfIso(TODAY) - dayOfIso(u.installedOn), failed: false })),
    ]);
    const expected = kaplanMeier(oneByOne);
    expect(detail.survival).toHaveLength(expected.length);
    detail.survival.forEach((point, i) => {
      expect(point.months).toBeCloseTo(expected[i]!.time / DAYS_PER_MONTH, 9);
      expect([point.atRisk, point.failures]).toEqual([expected[i]!.atRisk, expected[i]!.events]);
      expect(point.survival).toBeCloseTo(expected[i]!.survival, 12);
    });
    expect(detail.survival[0]).toMatchObject({ atRisk: 8, failures: 1 });
  });
});

/** Every kept table as rows, so the tables after changes can be compared with the same tables refilled from scratch. */
async function keptTables(db: Db) {
  const cells = await sql<object>`select * from unit_exposure where units != 0 or failures != 0 order by 1, 2, 3`.execute(db);
  const bands = await sql<object>`select * from unit_exposure_bands where units != 0 or failures != 0 order by 1, 2, 3, 4, 5`.execute(db);
  const network = await sql<object>`select * from unit_exposure_network where units != 0 or failures != 0 order by 1, 2`.execute(db);
  const bandsNetwork = await sql<object>`select * from unit_exposure_bands_network where units != 0 or failures != 0 order by 1, 2, 3, 4`.execute(db);
  const region = await sql<object>`select * from unit_exposure_region where units != 0 or failures != 0 order by 1, 2, 3`.execute(db);
  const bandsRegion = await sql<object>`select * from unit_exposure_bands_region where units != 0 or failures != 0 order by 1, 2, 3, 4, 5`.execute(db);
  const lifetime = await sql<object>`select * from unit_exposure_lifetime where units != 0 or failures != 0 order by 1, 2`.execute(db);
  const failures = await sql<object>`select * from unit_failures order by claim_id`.execute(db);
  const failureSums = await Promise.all(
    // Each table by its key's columns, all but the last (the count).
    ([['ages_network', 2], ['ages_region', 3], ['kinds_network', 3], ['kinds_region', 4], ['workmanship', 2]] as const).map(async ([t, keys]) => {
      const order = sql.raw(Array.from({ length: keys }, (_, i) => i + 1).join(', '));
      return (await sql<object>`select * from ${sql.table(`unit_failure_${t}`)} order by ${order}`.execute(db)).rows;
    }),
  );
  return { cells: cells.rows, bands: bands.rows, network: network.rows, bandsNetwork: bandsNetwork.rows, region: region.rows, bandsRegion: bandsRegion.rows, lifetime: lifetime.rows, failures: failures.rows, failureSums };
}

const SUMS = sql.raw(
  ['units', 'installed_day_sum', 'failures', 'failed_installed_day_sum', 'failed_day_sum', 'warranty_failures'].map((c) => `sum(x.${c}) as ${c}`).join(', '),
);
/** The cells and bands added up by each location's region as it stands, straight from the per-location tables. */
async function cellsByRegion(db: Db) {
  const region = await sql<object>`select x.catalog_item_id, l.region_id, x.installed_month, ${SUMS}
    from unit_exposure x join locations l on l.id = x.location_id group by 1, 2, 3 having sum(x.units) != 0 or sum(x.failures) != 0 order by 1, 2, 3`.execute(db);
  const bandsRegion = await sql<object>`select x.catalog_item_id, l.region_id, x.measure, x.band, x.installed_month, ${SUMS}
    from unit_exposure_bands x join locations l on l.id = x.location_id group by 1, 2, 3, 4, 5 having sum(x.units) != 0 or sum(x.failures) != 0 order by 1, 2, 3, 4, 5`.execute(db);
  return { region: region.rows, bandsRegion: bandsRegion.rows };
}

/** The cells added up by item and location over every month, straight from the per-location table. */
async function cellsByLocation(db: Db) {
  const { rows } = await sql<object>`select x.catalog_item_id, x.location_id, ${SUMS}
    from unit_exposure x group by 1, 2 having sum(x.units) != 0 or sum(x.failures) != 0 order by 1, 2`.execute(db);
  return rows;
}

/** The failures counted one by one, by age and by kind, over the network and by each location's region as it stands, and the workmanship claims by shop. */
async function failuresCounted(db: Db) {
  const regionOf = new Map((await db.selectFrom('locations').select(['id', 'regionId']).execute()).map((l) => [l.id, l.regionId]));
  const failures = await db.selectFrom('unitFailures').select(['catalogItemId', 'locationId', 'installedDay', 'failedDay', 'coverage', 'failureMode']).execute();
  type Failure = (typeof failures)[number];
  const counted = (key: (f: Failure) => (string | number)[], names: string[], which: (f: Failure) => boolean = () => true) => {
    const counts = new Map<string, { key: (string | number)[]; failures: number }>();
    for (const f of failures.filter(which)) {
      const k = key(f);
      const entry = counts.get(JSON.stringify(k)) ?? { key: k, failures: 0 };
      counts.set(JSON.stringify(k), { ...entry, failures: entry.failures + 1 });
    }
    const byKey = (a: (string | number)[], b: (string | number)[]) => a.map((v, i) => (v < b[i]! ? -1 : v > b[i]! ? 1 : 0)).find((d) => d !== 0) ?? 0;
    return [...counts.values()].sort((a, b) => byKey(a.key, b.key)).map(({ key: k, failures: n }) => ({ ...Object.fromEntries(names.map((name, i) => [name, k[i]])), failures: n }));
  };
  const age = (f: Failure) => f.failedDay - f.installedDay;
  return [
    counted((f) => [f.catalogItemId, age(f)], ['catalogItemId', 'ageDays']),
    counted((f) => [f.catalogItemId, regionOf.get(f.locationId)!, age(f)], ['catalogItemId', 'regionId', 'ageDays']),
    counted((f) => [f.catalogItemId, f.coverage, f.failureMode], ['catalogItemId', 'coverage', 'failureMode']),
    counted((f) => [f.catalogItemId, regionOf.get(f.locationId)!, f.coverage, f.failureMode], ['catalogItemId', 'regionId', 'coverage', 'failureMode']),
    counted((f) => [f.catalogItemId, f.locationId], ['catalogItemId', 'locationId'], (f) => f.coverage === 'workmanship'),
  ];
}

const refilled = (db: Db) => afterRefill(db, REFILL_UNIT_EXPOSURE, keptTables);

describe("a unit's install day", () => {
  it("is the shop's day of the delivery: an evening delivery on a month's last day is that day, in that month", async () => {
    // 18:30 on 31 March in Denver (MDT, UTC−6) is 00:30 on 1 April in UTC.
    const deliveredAt = '2026-04-01T00:30:00.000Z';
    const shopDay = new Intl.DateTimeFormat('en-CA', { timeZone: 'America/Denver' }).format(new Date(deliveredAt));
    expect(shopDay).toBe('2026-03-31');
    const unit = await addDeliveredUnit(h.db, ids.location('DEN'), { deliveredAt });
    await h.db.updateTable('builds').set({ deliveredOn: shopDay }).where('id', '=', unit.buildId).execute();
    await h.db
      .insertInto('warrantyClaims')
      .values({
        locationId: ids.location('DEN'), sequence: 99_001, number: 'DEN-W99001', buildId: unit.buildId, buildItemId: unit.buildItemId, catalogItemId: unit.item.id,
        failedOn: shopDay, failureMode: 'will_not_charge', coverage: 'vendor_defect', symptoms: 'Dead on the way home', foundHow: '', laborHours: 0, outOfWarranty: 0,
        status: 'logged', dueOn: null, creditRequestedCents: 0, createdBy: null, createdAt: '2026-04-01T02:00:00.000Z', updatedAt: '2026-04-01T02:00:00.000Z',
      })
      .execute();
    const failure = await h.db.selectFrom('unitFailures').select(['installedDay', 'failedDay']).where('buildItemId', '=', unit.buildItemId).executeTakeFirstOrThrow();
    expect(failure).toEqual({ installedDay: dayOfIso('2026-03-31'), failedDay: dayOfIso('2026-03-31') });
    // The cell the unit was first counted in, before the shop's day was set, stays behind empty.
    const cells = await h.db.selectFrom('unitExposure').select(['installedMonth', 'units', 'failures']).where('catalogItemId', '=', unit.item.id).where('units', '>', 0).execute();
    expect(cells).toEqual([{ installedMonth: '2026-03', units: 1, failures: 1 }]);
  });
});

describe('the kept tables follow every change', () => {
  it('match a refill from scratch after any mix of deliveries, corrections, claims, plans, moves and shops changing region, the regions and lifetimes summing their cells and the failure counts counting the failures', async () => {
    const units = await h.db.selectFrom('buildItems').select(['id', 'buildId']).execute();
    const builds = [...new Set(units.map((u) => u.buildId))];
    const claims = await h.db.selectFrom('warrantyClaims').select('id').execute();
    const regions = (await h.db.selectFrom('regions').select('id').execute()).map((r) => r.id);
    const pick = <T>(list: T[]) => fc.integer({ min: 0, max: list.length - 1 }).map((i) => list[i]!);
    const day = fc.integer({ min: 0, max: 500 }).map((d) => new Date(Date.UTC(2025, 0, 1) + d * 86_400_000).toISOString());
    const change = fc.oneof(
      fc.record({ kind: fc.constant('status' as const), buildId: pick(builds), delivered: fc.boolean(), at: day }),
      fc.record({ kind: fc.constant('deliveredOn' as const), buildId: pick(builds), at: day }),
      fc.record({ kind: fc.constant('quantity' as const), id: pick(units.map((u) => u.id)), quantity: fc.integer({ min: 1, max: 6 }) }),
      fc.record({ kind: fc.constant('failedOn' as const), id: pick(claims.map((c) => c.id)), at: day }),
      fc.record({ kind: fc.constant('plan' as const), buildId: pick(builds), band: fc.integer({ min: 0, max: 4 }) }),
      fc.record({ kind: fc.constant('move' as const), buildId: pick(builds), code: fc.constantFrom('DEN', 'BOI', 'AUS') }),
      fc.record({ kind: fc.constant('region' as const), code: fc.constantFrom('DEN', 'BOI', 'AUS'), regionId: pick(regions) }),
      fc.record({ kind: fc.constant('coverage' as const), id: pick(claims.map((c) => c.id)), workmanship: fc.boolean(), at: fc.option(day) }),
    );
    await fc.assert(
      fc.asyncProperty(fc.array(change, { minLength: 1, maxLength: 12 }), async (changes) => {
        await rolledBack(h.db, async () => {
          for (const c of changes) await apply(h.db, c);
          const kept = await keptTables(h.db);
          expect(kept).toEqual(await refilled(h.db));
          expect({ region: kept.region, bandsRegion: kept.bandsRegion }).toEqual(await cellsByRegion(h.db));
          expect(kept.lifetime).toEqual(await cellsByLocation(h.db));
          expect(kept.failureSums).toEqual(await failuresCounted(h.db));
        });
      }),
      { seed: 10_019, numRuns: 60 },
    );
  });
});

type Change =
  | { kind: 'status'; buildId: number; delivered: boolean; at: string }
  | { kind: 'deliveredOn'; buildId: number; at: string }
  | { kind: 'quantity'; id: number; quantity: number }
  | { kind: 'failedOn'; id: number; at: string }
  | { kind: 'plan'; buildId: number; band: number }
  | { kind: 'move'; buildId: number; code: string }
  | { kind: 'region'; code: string; regionId: number }
  | { kind: 'coverage'; id: number; workmanship: boolean; at: string | null };

async function apply(db: Db, c: Change) {
  if (c.kind === 'status') {
    // The shop's day of the delivery, as the app keeps it: here a shop seven hours behind UTC.
    const shopDay = new Date(Date.parse(c.at) - 7 * 3_600_000).toISOString().slice(0, 10);
    const values = c.delivered ? { status: 'delivered' as const, deliveredAt: c.at, deliveredOn: shopDay } : { status: 'quality_check' as const, deliveredAt: null, deliveredOn: null };
    await db.updateTable('builds').set(values).where('id', '=', c.buildId).execute();
  } else if (c.kind === 'deliveredOn') {
    // The day alone corrected.
    await db.updateTable('builds').set({ deliveredOn: c.at.slice(0, 10) }).where('id', '=', c.buildId).where('status', '=', 'delivered').execute();
  } else if (c.kind === 'quantity') await db.updateTable('buildItems').set({ quantity: c.quantity }).where('id', '=', c.id).execute();
  else if (c.kind === 'failedOn') await db.updateTable('warrantyClaims').set({ failedOn: c.at.slice(0, 10) }).where('id', '=', c.id).execute();
  else if (c.kind === 'coverage') {
    // Who pays, and with it sometimes the day it failed, in one update as the claim form saves them.
    const coverage = c.workmanship ? ('workmanship' as const) : ('vendor_defect' as const);
    await db.updateTable('warrantyClaims').set(c.at ? { coverage, failedOn: c.at.slice(0, 10) } : { coverage }).where('id', '=', c.id).execute();
  }
  else if (c.kind === 'region') await db.updateTable('locations').set({ regionId: c.regionId }).where('id', '=', ids.location(c.code)).execute();
  else if (c.kind === 'move') await db.updateTable('builds').set({ locationId: ids.location(c.code) }).where('id', '=', c.buildId).execute();
  else if (c.band === 0) await db.deleteFrom('planMargins').where('buildId', '=', c.buildId).execute();
  else {
    const bands = { dropBand: c.band, loadBand: 5 - c.band, dischargeBand: c.band };
    const exists = await db.selectFrom('planMargins').select('buildId').where('buildId', '=', c.buildId).executeTakeFirst();
    if (exists) await db.updateTable('planMargins').set(bands).where('buildId', '=', c.buildId).execute();
    else await db.insertInto('planMargins').values({ buildId: c.buildId, ...bands }).execute();
  }
}
