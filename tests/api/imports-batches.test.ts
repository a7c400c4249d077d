import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { checkImport } from '../../apps/api/src/imports/check-rows.ts';
import { writeImport, type ImportLocation } from '../../apps/api/src/imports/write-rows.ts';
import { demoIds, startHarness, type Harness } from '../support/api-harness.ts';
import { addParts } from '../support/build-fixtures.ts';
import { SIGN_INS } from '../support/staff-fixtures.ts';

/**
 * An import is written a batch of rows per transaction, so a person's save never waits for the
 * whole file; it is still written whole or not at all. The other import tests write at the app's
 * own pace.
 */
let h: Harness;
let parts: Awaited<ReturnType<typeof addParts>>;
let location: ImportLocation;
let actorId: number;

const HEADER = 'customer_name,customer_email,vehicle_year,vehicle_body_style,vehicle_make,vehicle_model,status,booked_for,delivered_on,lead_technician_email,labor_hours,items';
/** Rows over several batches; every third customer comes back for a second build. */
const file = (tag: string, rows: number) =>
  [HEADER, ...Array.from({ length: rows }, (_, i) => `Customer ${tag} ${i % 170},${tag}${i % 170}@example.test,2020,van,Alder,Trekker,delivered,2025-03-01,2025-03-04,,2,"${parts.battery.sku} #${tag}-${i}; ${parts.fuse.sku} x2"`)].join('\r\n');

/** No time for a second row in a batch, and no pause between batches. */
const ONE_ROW_AT_A_TIME = { batchMs: 0, pauseMs: 0 };

const counts = async () => {
  const n = async (table: 'builds' | 'customers' | 'vehicles' | 'buildItems' | 'buildEvents' | 'auditLog') =>
    Number((await h.db.selectFrom(table).select((eb) => eb.fn.countAll<number>().as('n')).executeTakeFirstOrThrow()).n);
  return { builds: await n('builds'), customers: await n('customers'), vehicles: await n('vehicles'), lines: await n('buildItems'), events: await n('buildEvents'), audit: await n('auditLog') };
};

beforeAll(async () => {
  h = await startHarness();
  const ids = await demoIds(h.db);
  parts = await addParts(h.db);
  const den = await h.db.selectFrom('locations').select(['id', 'code', 'timeZone', 'laborRateCents']).where('id', '=', ids.location('DEN')).executeTakeFirstOrThrow();
  location = den;
  actorId = ids.user(SIGN_INS.lead);
}, 60_000);
afterAll(() => h.close());

describe('an import written in batches', () => {
  it('writes every row of a file longer than a batch, in file order, with its events and audit entries', async () => {
    const before = await counts();
    const { rows } = await checkImport(h.db, location, file('A', 250), '2026-06-15T12:00:00.000Z');
    expect(rows).toHaveLength(250);
    // A row per batch: every row starts a batch of its own, and customers come back across batches.
    expect(await writeImport(h.db, location, rows, actorId, '2026-06-15T12:00:00.000Z', ONE_ROW_AT_A_TIME)).toBe(250);
    const after = await counts();
    expect(after).toEqual({ ...before, builds: before.builds + 250, customers: before.customers + 170, vehicles: before.vehicles + 170, lines: before.lines + 500, events: before.events + 250, audit: before.audit + 250 });
    const serials = await h.db.selectFrom('buildItems').select('serialNumber').where('serialNumber', 'like', 'A-%').orderBy('buildId').execute();
    expect(serials.map((s) => s.serialNumber)).toEqual(Array.from({ length: 250 }, (_, i) => `A-${i}`));
  });

  it('takes back the batches already written when a later one fails, leaving the database as it was', async () => {
    const { rows } = await checkImport(h.db, location, file('B', 250), '2026-06-15T12:00:00.000Z');
    expect(rows).toHaveLength(250);
    // Someone records row 231's serial number on another build after the file was checked.
    const other = await h.db.selectFrom('builds').select('id').where('locationId', '=', location.id).orderBy('id').limit(1).executeTakeFirstOrThrow();
    await h.db.insertInto('buildItems').values({ buildId: other.id, catalogItemId: parts.battery.id, sku: parts.battery.sku, quantity: 1, serialNumber: 'B-230', unitPriceCents: 1, unitCostCents: 1, createdAt: '2026-06-15T11:00:00.000Z' }).execute();
    const before = await counts();
    // 230 batches are written when row 231's fails.
    await expect(writeImport(h.db, location, rows, actorId, '2026-06-15T12:00:00.000Z', ONE_ROW_AT_A_TIME)).rejects.toThrow(/unique/i);
    expect(await counts()).toEqual(before);
    expect(await h.db.selectFrom('buildItems').select('buildId').where('serialNumber', 'like', 'B-%').execute()).toEqual([{ buildId: other.id }]);
  });
});
