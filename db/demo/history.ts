/**
 * Two years of the demo network's work on top of its staff: vendors, the catalog, customers,
 * vehicles and builds with their parts, serial numbers and status changes, up to the clock.
 * Every shop is busier in spring and summer and loses about one build in eleven before the bay.
 * Differences worth finding (numbers in profiles.ts):
 * - Denver (DEN) is the flagship and the busiest shop.
 * - Portland (PDX) books about 1.6 times the network's labor hours for the same jobs.
 * - Phoenix (PHX) sells solar: about 45 % of its builds are solar-and-inverter builds, elsewhere 16 %.
 * - Boise (BOI) buys nearly all its house batteries (about 88 %) from Northvane, elsewhere 30 %.
 * - Burlington (BTV) opened about 200 days before the clock and is still the smallest shop.
 * Warranty claims follow the delivered units (failure rates in claims-rates.ts, invented):
 * - Austin (AUS) has clearly more workmanship claims: loose or burnt connections within months of
 *   the install, about twelve times the network's rate; over half of its claims are workmanship.
 * - Tidewell Relay 40 A chargers (TDW-DC40) made 12 to 10 months before the clock are a bad batch:
 *   serial numbers TW<yymm>- of those three months (TW2506- to TW2508- with the clock in June
 *   2026) fail several times as often as the item's other serials.
 * - About two in three delivered builds with a house battery and a DC-DC charger carry a power plan
 *   (plans.ts), in every design-margin band; units on builds whose plan runs a conductor past its
 *   allowed drop or its amperage come loose or burn at their connections about four times as often.
 * - Electronics fail early, batteries and compressors wear out. Within two years nearly only the
 *   flooded battery (NVB-FLD115, 12 months) outlives its warranty: those come back as goodwill,
 *   logged by the lead. Claims reach every status by the clock.
 */
import type { Role } from '@busbar/shared';
import type { Db } from '../connect.ts';
import { DEMO_CATALOG, SERIALIZED_CATEGORIES } from './catalog.ts';
import { historyRows, type CatalogEntry } from './history-rows.ts';
import { DEMO_AREAS, type Area } from './customers.ts';
import { claimContext } from './claims-context.ts';
import { claimMaker } from './claims-rows.ts';
import { insertInChunks, nextIds } from './insert.ts';
import { PLAN_STREAM, planMaker } from './plans.ts';
import { LOCATION_PROFILES, type LocationProfile } from './profiles.ts';
import { seededRandom } from './random.ts';
import { simulateShop, type Shop } from './shop-history.ts';
import { DEMO_VENDORS } from './vendors.ts';

/** The claims draw from a stream of their own, so the builds stay as they were without them. */
export const CLAIM_STREAM = 0xc1a1_7e57;

export interface HistoryOptions {
  now: Date;
  seed: number;
}

/** The locations with their leads and technicians, as the staff part of the generator left them. */
export async function loadShops(db: Db, profiles: Record<string, LocationProfile>, areas: Record<string, Area>): Promise<Shop[]> {
  const locations = await db.selectFrom('locations').select(['id', 'code', 'name', 'timeZone', 'laborRateCents']).orderBy('id').execute();
  const staff = await db.selectFrom('roleAssignments').select(['userId', 'role', 'locationId']).orderBy('id').execute();
  const holders = (locationId: number, role: Role) => staff.filter((s) => s.locationId === locationId && s.role === role).map((s) => s.userId);
  return locations.map((location) => {
    const profile = profiles[location.code];
    const area = areas[location.code];
    const [leadId] = holders(location.id, 'location_lead');
    const technicianIds = holders(location.id, 'technician');
    if (!profile || !area || leadId === undefined || technicianIds.length === 0) throw new Error(`${location.code} is not a staffed demo shop`);
    return { ...location, leadId, technicianIds, profile, area };
  });
}

/** Inserts the vendors and the catalog; answers each item by SKU. */
export async function insertCatalog(db: Db): Promise<Map<string, CatalogEntry>> {
  const vendorIds = new Map<string, { id: number; serialPrefix: string }>();
  for (const { code, serialPrefix, ...vendor } of DEMO_VENDORS) {
    const row = await db.insertInto('vendors').values(vendor).returning('id').executeTakeFirstOrThrow();
    vendorIds.set(code, { id: row.id, serialPrefix });
  }
  const entries = new Map<string, CatalogEntry>();
  for (const { vendor, specs, ...item } of DEMO_CATALOG) {
    const { id: vendorId, serialPrefix } = vendorIds.get(vendor)!;
    const serialized = SERIALIZED_CATEGORIES.has(item.category);
    const row = await db
      .insertInto('catalogItems')
      .values({ ...item, vendorId, specs: JSON.stringify(specs), serialized: serialized ? 1 : 0 })
      .returning('id')
      .executeTakeFirstOrThrow();
    entries.set(item.sku, { id: row.id, serialized, serialPrefix, unitPriceCents: item.unitPriceCents, unitCostCents: item.unitCostCents });
  }
  return entries;
}

/** Adds the history to a database that holds the demo staff; run it in the same transaction. */
export async function seedDemoHistory(db: Db, options: HistoryOptions): Promise<void> {
  // Its own stream, so the staff drawn from the same seed stay as they were.
  const random = seededRandom(options.seed ^ 0x5eed_b00c);
  const nowMs = options.now.getTime();
  const shops = await loadShops(db, LOCATION_PROFILES, DEMO_AREAS);
  const catalog = await insertCatalog(db);
  const simulated = shops.map((shop) => simulateShop(random, shop, nowMs));
  const firstId = await nextIds(db);
  const rows = historyRows(random, { builds: simulated.flatMap((s) => s.builds) }, catalog, firstId, nowMs);
  const plans = planMaker(seededRandom(options.seed ^ PLAN_STREAM), firstId.plan)(rows);
  const claims = claimMaker(seededRandom(options.seed ^ CLAIM_STREAM), { ...(await claimContext(db, catalog, nowMs)), everyStatus: true });
  claims.add(rows, plans.tightBuilds);
  const claimRows = claims.flush(Infinity);
  await insertInChunks(db, 'customers', rows.customers);
  await insertInChunks(db, 'vehicles', rows.vehicles);
  await insertInChunks(db, 'builds', rows.builds);
  // Margins before the lines, so their triggers find no units yet to move.
  await insertInChunks(db, 'powerPlans', plans.powerPlans);
  await insertInChunks(db, 'powerPlanRevisions', plans.powerPlanRevisions);
  await insertInChunks(db, 'planMargins', plans.planMargins);
  await insertInChunks(db, 'buildItems', [...rows.buildItems, ...claimRows.buildItems]);
  await insertInChunks(db, 'buildEvents', [...rows.buildEvents, ...claimRows.buildEvents]);
  await insertInChunks(db, 'warrantyClaims', claimRows.warrantyClaims);
  await insertInChunks(db, 'claimEvents', claimRows.claimEvents);
  await insertInChunks(db, 'auditLog', rows.auditLog);
}
