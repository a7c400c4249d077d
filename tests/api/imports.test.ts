import { dayOfIso } from '@busbar/calc';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import * as importedLinesFromDelivery from '../../db/migrations/054-imported-lines-from-delivery.ts';
import { demoIds, startHarness, type Agent, type Harness } from '../support/api-harness.ts';
import { addParts } from '../support/build-fixtures.ts';
import { SIGN_INS } from '../support/staff-fixtures.ts';

let h: Harness;
let lead: Agent;
let parts: Awaited<ReturnType<typeof addParts>>;
let den: number;

const HEADER = 'customer_name,customer_email,vehicle_year,vehicle_body_style,vehicle_make,vehicle_model,status,booked_for,delivered_on,lead_technician_email,labor_hours,items';
const csv = (...rows: string[]) => [HEADER, ...rows].join('\r\n');
const count = async (table: 'builds' | 'customers' | 'vehicles' | 'buildItems') =>
  Number((await h.db.selectFrom(table).select((eb) => eb.fn.countAll<number>().as('n')).executeTakeFirstOrThrow()).n);

beforeAll(async () => {
  h = await startHarness();
  den = (await demoIds(h.db)).location('DEN');
  parts = await addParts(h.db);
  lead = await h.signedIn(SIGN_INS.lead);
});
afterAll(() => h.close());

describe('importing historical builds', () => {
  it('shows in a dry run what each row would create, writes nothing, then imports all rows', async () => {
    const file = csv(
      `Orla Fenwick,orla@example.test,2019,van,Alder,Trekker,delivered,2025-03-01,2025-03-04,tech@demo.busbar.test,4.5,"${parts.battery.sku} #IMP-1; ${parts.fuse.sku} x2"`,
      `Orla Fenwick,orla@example.test,2019,van,Alder,Trekker,delivered,2025-08-10,2025-08-10,,1.5,${parts.charger.sku} #IMP-2`,
      `"Bayard, Tom",,2022,SUV,Castor,Ridgeline,cancelled,2025-05-02,,,0,`,
    );
    const before = await count('builds');
    const dry = await lead.post('/api/imports/builds').send({ locationId: den, csv: file, dryRun: true });
    expect(dry.status).toBe(200);
    expect(dry.body.ok).toBe(true);
    expect(dry.body.created).toBe(0);
    expect(dry.body.rows.map((r: { line: number; summary: string }) => [r.line, r.summary])).toEqual([
      [2, 'Delivered 2025-03-04: Orla Fenwick, 2019 Alder Trekker, 2 component lines, 4.5 h labor'],
      [3, 'Delivered 2025-08-10: Orla Fenwick, 2019 Alder Trekker, 1 component line, 1.5 h labor'],
      [4, 'Cancelled: Bayard, Tom, 2022 Castor Ridgeline, 0 component lines, 0 h labor'],
    ]);
    expect(await count('builds')).toBe(before);

    const real = await lead.post('/api/imports/builds').send({ locationId: den, csv: file, dryRun: false });
    expect(real.body).toMatchObject({ ok: true, created: 3 });
    const imported = await h.db.selectFrom('builds').selectAll().where('id', '>', 0).orderBy('id', 'desc').limit(3).execute();
    const first = imported[2]!;
    // 17:00 in Denver on 4 March 2025 (MST, UTC−7) is 00:00 UTC on 5 March.
    expect(first).toMatchObject({ status: 'delivered', deliveredAt: '2025-03-05T00:00:00.000Z', bookedFor: '2025-03-01', laborHours: 4.5 });
    // Hand-worked: $899.00 + 2 × $12.50 + 4.5 h × $145.00 = $924.00 + $652.50 = $1,576.50
    expect(first.totalCents).toBe(157650);
    // The same e-mail is one customer with one vehicle; a row without an e-mail is a new customer.
    const customers = new Set(imported.map((b) => b.customerId));
    expect(customers.size).toBe(2);
    expect(new Set(imported.slice(1).map((b) => b.vehicleId)).size).toBe(1);
    expect(imported[0]).toMatchObject({ status: 'cancelled', deliveredAt: null, totalCents: 0 });
  });

  it("files each row's VIN and plate with its vehicle, finds the builds by them, and refuses a VIN that does not add up", async () => {
    const header = 'customer_name,customer_email,vehicle_year,vehicle_body_style,vehicle_make,vehicle_model,vehicle_vin,vehicle_plate,delivered_on,items';
    // Check digits worked in tests/external/vin.test.ts (1M8GDM9AXKP042788: 49 CFR 565 worked example).
    const file = (...rows: string[]) => [header, ...rows].join('\r\n');
    const rows = [
      `Wren Calloway,wren@example.test,2021,van,Alder,Trekker,,OLD 1,2024-02-01,${parts.fuse.sku}`,
      `Wren Calloway,wren@example.test,2021,van,Alder,Trekker,1m8gdm9axkp 042788,wrn 42,2025-03-04,${parts.fuse.sku}`,
      `Wren Calloway,wren@example.test,2021,van,Alder,Trekker,1M8GDM9AXKP042788,,2025-06-01,${parts.fuse.sku} x2`,
    ];
    const bad = await lead.post('/api/imports/builds').send({ locationId: den, csv: file(...rows, `Bad Vin,,2021,van,Alder,Trekker,1M8GDM9A1KP042788,,2025-06-01,${parts.fuse.sku}`), dryRun: true });
    expect(bad.body.ok).toBe(false);
    expect(bad.body.rows[3].errors).toEqual({ vehicle_vin: 'This VIN does not add up: check each character against the vehicle (the 9th is a check digit)' });
    expect(bad.body.rows[1].summary).toBe('Delivered 2025-03-04: Wren Calloway, 2021 Alder Trekker (VIN 1M8GDM9AXKP042788), 1 component line, 0 h labor');

    const real = await lead.post('/api/imports/builds').send({ locationId: den, csv: file(...rows), dryRun: false });
    expect(real.body).toMatchObject({ ok: true, created: 3 });
    const [withoutVin, first, second] = await h.db
      .selectFrom('builds as b')
      .innerJoin('vehicles as v', 'v.id', 'b.vehicleId')
      .select(['b.id', 'b.number', 'v.id as vehicleId', 'v.vin', 'v.plate'])
      .orderBy('b.id', 'desc')
      .limit(3)
      .execute()
      .then((r) => r.reverse());
    // A vehicle on file without a VIN is not taken for the one with it: the customer may have two of the model.
    expect(withoutVin).toMatchObject({ vin: null, plate: 'OLD 1' });
    expect(first).toMatchObject({ vin: '1M8GDM9AXKP042788', plate: 'WRN 42' });
    expect(second!.vehicleId).toBe(first!.vehicleId);
    expect(withoutVin!.vehicleId).not.toBe(first!.vehicleId);
    const found = await lead.get('/api/builds').query({ q: 'KP042788' });
    expect(found.body.items.map((b: { number: string }) => b.number).sort()).toEqual([first!.number, second!.number].sort());
    // Each row carries its vehicle's VIN and plate, so the list can say which one the search found.
    expect(found.body.items[0]).toMatchObject({ vehicleVin: '1M8GDM9AXKP042788', vehiclePlate: 'WRN 42' });
    expect((await lead.get(`/api/builds/${first!.id}`)).body).toMatchObject({ vehicleVin: '1M8GDM9AXKP042788', vehiclePlate: 'WRN 42' });
    const byPlate = await lead.get('/api/builds').query({ q: 'WRN 42' });
    expect(byPlate.body.items.map((b: { number: string }) => b.number).sort()).toEqual([first!.number, second!.number].sort());
  });

  it("counts an imported build's units from their delivery: a claim may give a failure before the import, and reliability ages them from delivery", async () => {
    const file = csv(`Ines Marlowe,ines@example.test,2020,van,Alder,Trekker,delivered,2025-02-01,2025-02-03,,2,"${parts.battery.sku} #IMP-LIFE-1"`);
    expect((await lead.post('/api/imports/builds').send({ locationId: den, csv: file, dryRun: false })).body).toMatchObject({ ok: true, created: 1 });
    const unit = await h.db
      .selectFrom('buildItems as i')
      .innerJoin('builds as b', 'b.id', 'i.buildId')
      .select(['i.id', 'i.buildId', 'i.createdAt', 'b.deliveredAt', 'b.createdAt as recordedAt'])
      .where('i.serialNumber', '=', 'IMP-LIFE-1')
      .executeTakeFirstOrThrow();
    expect(unit.createdAt).toBe(unit.deliveredAt);
    // Failed months before the import, long after the delivery.
    const claim = await lead.post('/api/claims').send({ buildItemId: unit.id, failedOn: '2025-06-01', failureMode: 'will_not_charge', coverage: 'vendor_defect', symptoms: 'Stopped charging' });
    expect(claim.status).toBe(201);
    const age = async () => h.db.selectFrom('unitFailures').select(['installedDay', 'failedDay']).where('buildItemId', '=', unit.id).executeTakeFirstOrThrow();
    expect(await age()).toEqual({ installedDay: dayOfIso('2025-02-03'), failedDay: dayOfIso('2025-06-01') });

    // A line an earlier import wrote as added at the import is put back at the delivery (migration 054).
    await h.db.updateTable('buildItems').set({ createdAt: unit.recordedAt }).where('id', '=', unit.id).execute();
    expect((await age()).installedDay).toBe(dayOfIso(unit.recordedAt.slice(0, 10)));
    await importedLinesFromDelivery.up(h.db);
    expect((await h.db.selectFrom('buildItems').select('createdAt').where('id', '=', unit.id).executeTakeFirstOrThrow()).createdAt).toBe(unit.deliveredAt);
    expect(await age()).toEqual({ installedDay: dayOfIso('2025-02-03'), failedDay: dayOfIso('2025-06-01') });
  });

  it('gives a build delivered today the time of its import, not a later one', async () => {
    // The harness's clock: 15:00 UTC on 15 June 2026, 09:00 in Denver, before 17:00 there.
    const file = csv(`Tobin Ashcroft,,2021,van,Alder,Trekker,delivered,2026-06-15,2026-06-15,,1,${parts.fuse.sku}`);
    expect((await lead.post('/api/imports/builds').send({ locationId: den, csv: file, dryRun: false })).body).toMatchObject({ ok: true, created: 1 });
    const build = await h.db.selectFrom('builds').select(['deliveredAt', 'deliveredOn', 'createdAt']).orderBy('id', 'desc').limit(1).executeTakeFirstOrThrow();
    expect(build).toEqual({ deliveredAt: '2026-06-15T15:00:00.000Z', deliveredOn: '2026-06-15', createdAt: '2026-06-15T15:00:00.000Z' });
  });

  it('names every bad cell by row and column and writes nothing if any row fails', async () => {
    const file = csv(
      `Good Row,,2020,pickup,Alder,Hauler,delivered,2025-01-02,2025-01-03,,1,${parts.fuse.sku}`,
      `,,1890,boat,,Hauler,finished,2025-13-01,,nobody@example.test,-1,"${parts.battery.sku} x2; NOPE-1"`,
      `Late Delivery,,2020,pickup,Alder,Hauler,delivered,2025-02-10,2025-02-01,,1,${parts.fuse.sku} #S1`,
      `Repeat Serial,,2020,pickup,Alder,Hauler,delivered,2025-02-10,2025-02-11,,1,${parts.battery.sku} #DUP-1; ${parts.battery.sku} #DUP-1`,
    );
    const before = { builds: await count('builds'), customers: await count('customers') };
    const res = await lead.post('/api/imports/builds').send({ locationId: den, csv: file, dryRun: false });
    expect(res.body.ok).toBe(false);
    expect(res.body.created).toBe(0);
    const [good, bad, late, repeat] = res.body.rows;
    expect(good.errors).toEqual({});
    expect(Object.keys(bad.errors).sort()).toEqual(
      ['booked_for', 'customer_name', 'items', 'labor_hours', 'lead_technician_email', 'status', 'vehicle_body_style', 'vehicle_make', 'vehicle_year'].sort(),
    );
    expect(bad.errors.items).toBe(`${parts.battery.sku} needs one entry per unit: ${parts.battery.sku} #SERIAL`);
    expect(late.errors).toEqual({ delivered_on: 'Delivered before it was booked', items: `${parts.fuse.sku} has no serial numbers` });
    expect(repeat.errors).toEqual({ items: `Serial number DUP-1 of ${parts.battery.sku} is also on line 5` });
    expect({ builds: await count('builds'), customers: await count('customers') }).toEqual(before);
  });

  it('refuses a serial number already installed, and a file it cannot read', async () => {
    const res = await lead.post('/api/imports/builds').send({ locationId: den, csv: csv(`A B,,2020,van,C,D,delivered,,2025-01-01,,0,${parts.battery.sku} #IMP-1`), dryRun: true });
    expect(res.body.rows[0].errors).toEqual({ items: `Serial number IMP-1 of ${parts.battery.sku} is already recorded in Busbar` });
    const header = await lead.post('/api/imports/builds').send({ locationId: den, csv: 'customer,colour\nx,y', dryRun: true });
    expect(header.body.rows[0].errors).toMatchObject({ customer: 'Unknown column', colour: 'Unknown column', customer_name: 'Missing column' });
    const open = await lead.post('/api/imports/builds').send({ locationId: den, csv: `${HEADER}\n"unclosed`, dryRun: true });
    expect(open.body.rows[0].errors).toEqual({ _: 'A quoted field that starts on line 2 is never closed' });
  });

  it('lets only those who may book builds at the location import there', async () => {
    const file = csv(`A B,,2020,van,C,D,delivered,,2025-01-01,,0,${parts.fuse.sku}`);
    const avl = (await demoIds(h.db)).location('AVL');
    expect((await lead.post('/api/imports/builds').send({ locationId: avl, csv: file, dryRun: true })).status).toBe(404);
    const tech = await h.signedIn(SIGN_INS.tech);
    expect((await tech.post('/api/imports/builds').send({ locationId: den, csv: file, dryRun: true })).status).toBe(403);
    const bad = await lead.post('/api/imports/builds').send({ locationId: den, csv: '', dryRun: 'yes' });
    expect(Object.keys(bad.body.error.fields).sort()).toEqual(['csv', 'dryRun']);
  });
});
