import type { Db } from '../connect.ts';
import { DEMO_CATALOG } from './catalog.ts';
import type { ClaimShop } from './claims-draw.ts';
import type { ClaimCatalogEntry, ClaimContext } from './claims-rows.ts';
import type { CatalogEntry } from './history-rows.ts';
import { DEMO_VENDORS } from './vendors.ts';

async function lastId(db: Db, table: 'buildItems' | 'warrantyClaims'): Promise<number> {
  const row = await db.selectFrom(table).select((eb) => eb.fn.max('id').as('id')).executeTakeFirst();
  return Number(row?.id ?? 0);
}

/** Each location with its zone, approval limit and the people who log, answer and credit its claims. */
async function claimShops(db: Db): Promise<Map<number, ClaimShop>> {
  const locations = await db.selectFrom('locations').select(['id', 'code', 'timeZone', 'regionId', 'claimApprovalLimitCents']).orderBy('id').execute();
  const staff = await db.selectFrom('roleAssignments').select(['userId', 'role', 'locationId', 'regionId']).orderBy('id').execute();
  const holder = (role: string, where: (s: (typeof staff)[number]) => boolean) => {
    const found = staff.find((s) => s.role === role && where(s));
    if (!found) throw new Error(`the demo network has no ${role} for a location's claims`);
    return found.userId;
  };
  return new Map(
    locations.map((l) => [
      l.id,
      {
        id: l.id,
        code: l.code,
        timeZone: l.timeZone,
        approvalLimitCents: l.claimApprovalLimitCents,
        clerkId: holder('warranty_clerk', (s) => s.locationId === l.id),
        leadId: holder('location_lead', (s) => s.locationId === l.id),
        managerId: holder('regional_manager', (s) => s.regionId === l.regionId),
      },
    ]),
  );
}

/** What the claim generator needs from a database that holds the demo staff and catalog. */
export async function claimContext(db: Db, catalog: ReadonlyMap<string, CatalogEntry>, nowMs: number): Promise<ClaimContext> {
  const entries = new Map<number, ClaimCatalogEntry>();
  for (const item of DEMO_CATALOG) {
    const entry = catalog.get(item.sku);
    const vendor = DEMO_VENDORS.find((v) => v.code === item.vendor);
    if (entry && vendor) entries.set(entry.id, { sku: item.sku, category: item.category, warrantyMonths: item.warrantyMonths, serialPrefix: entry.serialPrefix, rmaEmail: vendor.rmaEmail });
  }
  return {
    shops: await claimShops(db),
    catalog: entries,
    firstId: { buildItem: (await lastId(db, 'buildItems')) + 1, claim: (await lastId(db, 'warrantyClaims')) + 1 },
    nowMs,
  };
}
