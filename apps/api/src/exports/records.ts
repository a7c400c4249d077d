import { dayOfIso, isoDay } from '@busbar/calc';
import type { Db } from '@busbar/db';
import type { Category, ClaimStatus } from '@busbar/shared';
import { sql } from 'kysely';
import type { LocationScope } from '../access/locations.ts';

/** The records an export reads: the days from `first` to `last` (YYYY-MM-DD, each location's own), at the locations of `scope`. */
export interface ExportRange {
  db: Db;
  first: string;
  last: string;
  scope: LocationScope;
}

/** Builds read a batch at a time; a batch's lines are read with it. */
const BUILDS_PER_BATCH = 500;
const CLAIMS_PER_BATCH = 1_000;

const inScope = (scope: LocationScope, column: string) => (scope === 'all' ? sql<boolean>`1` : sql<boolean>`${sql.ref(column)} in (${sql.join(scope.length > 0 ? scope : [0])})`);

/** The builds delivered in the range; `+` keeps SQLite on the day index rather than the status index (see month-close-figures.ts). */
const deliveredIn = ({ db, first, last, scope }: ExportRange) =>
  db.selectFrom('builds as b').where(sql`+b.status`, '=', 'delivered').where('b.deliveredOn', '>=', first).where('b.deliveredOn', '<=', last).where(inScope(scope, 'b.locationId'));

/** The warranty claims logged in the range. */
const loggedIn = ({ db, first, last, scope }: ExportRange) =>
  db.selectFrom('warrantyClaims as w').where('w.loggedOn', '>=', first).where('w.loggedOn', '<=', last).where(inScope(scope, 'w.locationId'));

export interface DeliveredBuild {
  id: number;
  number: string;
  shop: string;
  deliveredOn: string;
  customer: string;
  laborHours: number;
  laborCents: number;
  partsPriceCents: number;
  totalCents: number;
  partsCostCents: number;
}

/**
 * The builds delivered in the range, by day delivered, a batch at a time: a day's builds in turn, by
 * where the last batch of the day ended (not by offset). A batch never reads past its day, whatever
 * plan SQLite picks: a batch read after the last one's day and id over the whole range could be
 * planned as every build of the range at each location, sorted for each batch (1.1 s a batch over
 * a year of 200 shops, where a day's builds take milliseconds).
 */
export async function* deliveredBuilds(range: ExportRange, perBatch = BUILDS_PER_BATCH): AsyncIterable<DeliveredBuild[]> {
  for (let day = dayOfIso(range.first); day <= dayOfIso(range.last); day++) {
    const on = isoDay(day);
    let afterId = 0;
    for (;;) {
      const batch = await deliveredIn({ ...range, first: on, last: on })
        .innerJoin('locations as l', 'l.id', 'b.locationId')
        .innerJoin('customers as c', 'c.id', 'b.customerId')
        .where('b.id', '>', afterId)
        .orderBy('b.id')
        .limit(perBatch)
        .select(['b.id', 'b.number', 'l.code as shop', 'c.name as customer', 'b.laborHours', 'b.laborCents', 'b.partsPriceCents', 'b.totalCents', 'b.partsCostCents'])
        .select(sql<string>`b.delivered_on`.as('deliveredOn'))
        .execute();
      if (batch.length > 0) yield batch;
      if (batch.length < perBatch) break;
      afterId = batch[batch.length - 1]!.id;
    }
  }
}

export interface BuildLine {
  buildNumber: string;
  shop: string;
  deliveredOn: string;
  sku: string;
  item: string;
  category: Category;
  serialNumber: string | null;
  quantity: number;
  unitPriceCents: number;
  unitCostCents: number;
  removedOn: string | null;
}

/** Every line of the builds delivered in the range, in the builds' order; lines taken out under warranty too, as the build's totals count them. */
export async function* buildLines(range: ExportRange): AsyncIterable<BuildLine[]> {
  for await (const builds of deliveredBuilds(range)) {
    const lines = await range.db
      .selectFrom('buildItems as i')
      .innerJoin('catalogItems as ci', 'ci.id', 'i.catalogItemId')
      .where('i.buildId', 'in', builds.map((b) => b.id))
      .orderBy('i.id')
      .select(['i.buildId', 'i.sku', 'ci.name as item', 'ci.category', 'i.serialNumber', 'i.quantity', 'i.unitPriceCents', 'i.unitCostCents', 'i.removedOn'])
      .execute();
    const byBuild = new Map<number, typeof lines>();
    for (const line of lines) {
      const ofBuild = byBuild.get(line.buildId);
      if (ofBuild) ofBuild.push(line);
      else byBuild.set(line.buildId, [line]);
    }
    yield builds.flatMap((b) => (byBuild.get(b.id) ?? []).map(({ buildId: _, ...line }) => ({ ...line, buildNumber: b.number, shop: b.shop, deliveredOn: b.deliveredOn })));
  }
}

const count = sql<number>`count(*)`.as('n');

/** How many lines the builds delivered in the range have. */
export const countBuildLines = async (range: ExportRange) => (await deliveredIn(range).innerJoin('buildItems as i', 'i.buildId', 'b.id').select(count).executeTakeFirstOrThrow()).n;

/** How many builds were delivered in the range. */
export const countDeliveredBuilds = async (range: ExportRange) => (await deliveredIn(range).select(count).executeTakeFirstOrThrow()).n;

export interface LoggedClaim {
  id: number;
  number: string;
  shop: string;
  loggedOn: string;
  buildNumber: string;
  sku: string;
  item: string;
  vendor: string;
  status: ClaimStatus;
  creditRequestedCents: number;
  creditReceivedCents: number | null;
}

/** The warranty claims logged in the range, by day logged, a batch at a time. */
export async function* loggedClaims(range: ExportRange): AsyncIterable<LoggedClaim[]> {
  let after = { on: '', id: 0 };
  for (;;) {
    const batch = await loggedIn(range)
      .innerJoin('locations as l', 'l.id', 'w.locationId')
      .innerJoin('builds as b', 'b.id', 'w.buildId')
      .innerJoin('buildItems as i', 'i.id', 'w.buildItemId')
      .innerJoin('catalogItems as ci', 'ci.id', 'w.catalogItemId')
      .innerJoin('vendors as v', 'v.id', 'ci.vendorId')
      .where(sql<boolean>`(w.logged_on, w.id) > (${after.on}, ${after.id})`)
      .orderBy('w.loggedOn')
      .orderBy('w.id')
      .limit(CLAIMS_PER_BATCH)
      .select(['w.id', 'w.number', 'l.code as shop', 'b.number as buildNumber', 'i.sku', 'ci.name as item', 'v.name as vendor', 'w.status', 'w.creditRequestedCents', 'w.creditReceivedCents'])
      .select(sql<string>`w.logged_on`.as('loggedOn'))
      .execute();
    if (batch.length === 0) return;
    yield batch;
    const end = batch[batch.length - 1]!;
    after = { on: end.loggedOn, id: end.id };
  }
}

export const countLoggedClaims = async (range: ExportRange) => (await loggedIn(range).select(count).executeTakeFirstOrThrow()).n;
