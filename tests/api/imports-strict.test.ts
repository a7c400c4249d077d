import { notUtf8 } from '@busbar/shared';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { demoIds, startHarness, type Agent, type Harness } from '../support/api-harness.ts';
import { addParts } from '../support/build-fixtures.ts';
import { SIGN_INS } from '../support/staff-fixtures.ts';

let h: Harness;
let lead: Agent;
let parts: Awaited<ReturnType<typeof addParts>>;
let den: number;

const HEADER = 'customer_name,customer_phone,vehicle_year,vehicle_body_style,vehicle_make,vehicle_model,status,booked_for,delivered_on,items,notes';
const csv = (...rows: string[]) => [HEADER, ...rows].join('\r\n');
const check = (file: string) => lead.post('/api/imports/builds').send({ locationId: den, csv: file, dryRun: true });
const CONTROL = 'Take out the invisible control characters (such as NUL) pasted into this text';

beforeAll(async () => {
  h = await startHarness();
  den = (await demoIds(h.db)).location('DEN');
  parts = await addParts(h.db);
  lead = await h.signedIn(SIGN_INS.lead);
});
afterAll(() => h.close());

describe('the header of an import', () => {
  it.each(['__proto__', 'constructor', 'prototype'])('refuses a column named %s, by its place', async (name) => {
    const res = await check(`${HEADER},${name}\r\nA B,,2020,van,C,D,delivered,,2025-01-01,${parts.fuse.sku},`);
    expect(res.body.ok).toBe(false);
    expect(res.body.rows).toEqual([{ line: 1, summary: 'Header', errors: { _: `The column 12 is named "${name}", which is not a column of the import` } }]);
  });

  it('refuses a column named twice, a column without a name and an unknown column, naming each', async () => {
    const res = await check(`${HEADER},Customer_Name,,colour\r\nA B,,2020,van,C,D,delivered,,2025-01-01,${parts.fuse.sku},,A B,,red`);
    expect(res.body.ok).toBe(false);
    expect(res.body.rows[0].errors).toEqual({
      customer_name: 'Named twice: columns 1 and 12',
      colour: 'Unknown column',
      _: 'The column 13 has no name',
    });
  });
});

describe('the values of an import', () => {
  it('checks each cell by the rule of the form that takes it', async () => {
    const res = await check(
      csv(
        `Orla\u0000Fenwick,call me,0x7E3,van,Alder,Trek\u0085ker,delivered,,2025-01-01,${parts.battery.sku} #AB$1,`,
        `Bayard Tom,,2e3,van,${'m'.repeat(61)},Ridgeline,delivered,,2025-01-01,${'S'.repeat(41)},`,
        `Good Row,+1 (303) 555-0100,2020,van,Alder,Trekker,delivered,,2025-01-01,${parts.fuse.sku},"Gate code 4411\n\tcall first"`,
      ),
    );
    const [first, second, good] = res.body.rows;
    expect(first.errors).toEqual({
      customer_name: CONTROL,
      customer_phone: 'Digits, spaces and + ( ) - . only',
      vehicle_year: 'Enter a year',
      vehicle_model: CONTROL,
      items: `The serial number in "${parts.battery.sku} #AB$1": Letters, digits and . / _ - only`,
    });
    expect(second.errors).toEqual({
      vehicle_year: 'Enter a year',
      vehicle_make: 'Use at most 60 characters',
      items: `The SKU in "${'S'.repeat(41)}": Use at most 40 characters`,
    });
    expect(good.errors).toEqual({});
  });

  it('refuses delivery and booking dates after the shop’s today', async () => {
    // 15:00 UTC on 15 June is 09:00 in Denver: today there is 15 June.
    h.clock.now = new Date('2026-06-15T15:00:00Z');
    const res = await check(
      csv(
        `On Time,,2020,van,C,D,delivered,2026-06-15,2026-06-15,${parts.fuse.sku},`,
        `Too Soon,,2020,van,C,D,delivered,,2026-06-16,${parts.fuse.sku},`,
        `Booked Ahead,,2020,van,C,D,cancelled,2026-07-01,,,`,
      ),
    );
    const [onTime, delivered, booked] = res.body.rows;
    expect(onTime.errors).toEqual({});
    expect(delivered.errors).toEqual({ delivered_on: 'This date is after today (2026-06-15): import only builds already delivered' });
    expect(booked.errors).toEqual({ booked_for: 'This date is after today (2026-06-15): book a build still to come in Busbar itself' });

    // 00:30 UTC on 16 June is still 15 June in Denver (18:30 MDT).
    h.clock.now = new Date('2026-06-16T00:30:00Z');
    const evening = await check(csv(`Too Soon,,2020,van,C,D,delivered,,2026-06-16,${parts.fuse.sku},`));
    expect(evening.body.rows[0].errors).toEqual({ delivered_on: 'This date is after today (2026-06-15): import only builds already delivered' });
    h.clock.now = new Date('2026-06-15T15:00:00Z');
  });

  it('takes a cancelled row whose serialized parts have no serial numbers, and still asks a delivered one for them', async () => {
    const res = await lead.post('/api/imports/builds').send({
      locationId: den,
      dryRun: false,
      csv: csv(`Never Fitted,,2021,pickup,Alder,Hauler,cancelled,2025-05-02,,"${parts.battery.sku}; ${parts.charger.sku} x2",`),
    });
    expect(res.body).toMatchObject({ ok: true, created: 1 });
    const build = await h.db.selectFrom('builds').select(['id', 'status']).orderBy('id', 'desc').limit(1).executeTakeFirstOrThrow();
    expect(build.status).toBe('cancelled');
    const lines = await h.db.selectFrom('buildItems').select(['sku', 'quantity', 'serialNumber']).where('buildId', '=', build.id).orderBy('id').execute();
    expect(lines).toEqual([
      { sku: parts.battery.sku, quantity: 1, serialNumber: null },
      { sku: parts.charger.sku, quantity: 2, serialNumber: null },
    ]);
    const delivered = await check(csv(`Fitted,,2021,pickup,Alder,Hauler,delivered,,2025-05-02,${parts.battery.sku},`));
    expect(delivered.body.rows[0].errors).toEqual({ items: `${parts.battery.sku} needs one entry per unit: ${parts.battery.sku} #SERIAL` });
  });
});

describe('a file that is not UTF-8', () => {
  it('is refused in words, naming the line of the first byte it cannot read', async () => {
    // "René" saved as Latin-1 on line 3: the byte 0xE9 is not UTF-8.
    const before = Buffer.from(`{"locationId":${den},"dryRun":true,"csv":"${HEADER}\\r\\nA B,,2020,van,C,D,delivered,,2025-01-01,${parts.fuse.sku},\\r\\nRen`);
    const after = Buffer.from(` B,,2020,van,C,D,delivered,,2025-01-01,${parts.fuse.sku},"}`);
    const bytes = Buffer.concat([before, Buffer.from([0xe9]), after]);
    // The bytes go as they are, not serialized again as JSON.
    const res = await lead.post('/api/imports/builds').set('Content-Type', 'application/json').serialize(() => bytes as unknown as string).send({});
    expect(res.status).toBe(400);
    expect(res.body.error.fields).toEqual({ csv: notUtf8(3) });
    expect(notUtf8(3)).toBe('This file is not UTF-8 text (the first character that cannot be read is on line 3): save it as CSV UTF-8 from your spreadsheet and try again');
  });
});
