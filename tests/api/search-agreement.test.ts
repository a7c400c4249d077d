import type { BuildView, SerialMatch } from '@busbar/shared';
import { sql } from 'kysely';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { readsShopRanges } from '../../apps/api/src/queries/search.ts';
import { demoIds, startHarness, type Agent, type Harness } from '../support/api-harness.ts';
import { SIGN_INS } from '../support/staff-fixtures.ts';

/**
 * The indexes behind search (FTS5 trigram over builds, the NOCASE serial index) must find exactly
 * what a plain scan with LIKE finds, on the demo network with its two years of history.
 */
let h: Harness;
let owner: Agent;
let lead: Agent;
let den: number;

beforeAll(async () => {
  h = await startHarness({}, true, { history: true });
  den = (await demoIds(h.db)).location('DEN');
  owner = await h.signedIn(SIGN_INS.owner);
  lead = await h.signedIn(SIGN_INS.lead);
}, 60_000);
afterAll(() => h.close());

/** Every page of a list, read by cursor. */
async function everyId<T>(agent: Agent, path: string, query: Record<string, string | string[]>, key: (row: T) => string): Promise<string[]> {
  const found: string[] = [];
  let cursor: string | undefined;
  for (;;) {
    const res = await agent.get(path).query({ ...query, pageSize: 200, ...(cursor ? { cursor } : {}) });
    expect(res.status).toBe(200);
    found.push(...(res.body.items as T[]).map(key));
    if (!res.body.nextCursor) return found.sort();
    cursor = res.body.nextCursor;
  }
}

const like = (text: string) => `%${text.replace(/[\\%_]/g, (c) => `\\${c}`)}%`;

/** Builds whose number, customer name, vehicle, its VIN or plate, or a serial number contains `text`, by LIKE alone (newest first). */
async function scanBuilds(text: string, locationId?: number | number[], status?: string[]): Promise<string[]> {
  const pattern = like(text);
  const shops = locationId === undefined ? null : [locationId].flat();
  const rows = await sql<{ id: number }>`select b.id from builds b join customers c on c.id = b.customer_id join vehicles v on v.id = b.vehicle_id
    where (${shops ? null : 1} is not null or b.location_id in (${sql.join(shops ?? [0])}))
      and (${status ? null : 1} is not null or b.status in (${sql.join(status ?? [''])}))
      and (b.number like ${pattern} escape '\\' or c.name like ${pattern} escape '\\'
        or (v.year || ' ' || v.make || ' ' || v.model) like ${pattern} escape '\\'
        or v.vin like ${pattern} escape '\\' or v.plate like ${pattern} escape '\\'
        or exists (select 1 from build_items i where i.build_id = b.id and i.serial_number like ${pattern} escape '\\'))
    order by b.id desc`.execute(h.db);
  return rows.rows.map((r) => String(r.id));
}

/** Texts to look for, taken from the demo data: pieces of numbers, names, vehicles, VINs, plates and serials, in other cases too. */
async function sampleTexts(): Promise<string[]> {
  const build = await h.db.selectFrom('builds').select('number').where('id', '=', 37).executeTakeFirstOrThrow();
  const customer = await h.db.selectFrom('customers').select('name').orderBy('id').limit(1).offset(11).executeTakeFirstOrThrow();
  const vehicle = await h.db.selectFrom('vehicles').select(['make', 'model']).orderBy('id').limit(1).offset(5).executeTakeFirstOrThrow();
  const identity = await h.db.selectFrom('vehicles').select(['vin', 'plate']).where('vin', 'is not', null).where('plate', 'is not', null).orderBy('id').limit(1).offset(9).executeTakeFirstOrThrow();
  const serial = await h.db.selectFrom('buildItems').select('serialNumber').where('serialNumber', 'is not', null).orderBy('id').limit(1).offset(40).executeTakeFirstOrThrow();
  return [
    build.number.slice(-4),
    build.number.toLowerCase(),
    customer.name.split(' ')[1]!.slice(0, 5).toUpperCase(),
    customer.name.slice(1, 6),
    vehicle.make.toLowerCase(),
    vehicle.model.slice(0, 4),
    identity.vin!.slice(9).toLowerCase(),
    identity.plate!,
    serial.serialNumber!.slice(2, 8).toLowerCase(),
    'DEN-',
    'an',
    '7',
    'e r',
    'no such text at all',
  ];
}

describe('build search', () => {
  it('finds for the owner what a plain scan finds, through the trigram index and the short-text fallback', async () => {
    for (const q of await sampleTexts()) {
      const expected = await scanBuilds(q);
      if (q !== 'no such text at all') expect(expected.length, q).toBeGreaterThan(0);
      expect(await everyId<BuildView>(owner, '/api/builds', { q }, (b) => String(b.id)), q).toEqual(expected.sort());
    }
  }, 60_000);

  it("finds for a lead what a plain scan finds at the lead's shop", async () => {
    for (const q of (await sampleTexts()).slice(0, 10)) {
      expect(await everyId<BuildView>(lead, '/api/builds', { q }, (b) => String(b.id)), q).toEqual((await scanBuilds(q, den)).sort());
    }
  }, 60_000);

  it("finds for a regional manager what a plain scan finds in the region's shops, each shop's matches read apart", async () => {
    const regional = await h.signedIn(SIGN_INS.regional);
    const shops = (await h.db.selectFrom('roleAssignments as r').innerJoin('users as u', 'u.id', 'r.userId').innerJoin('locations as l', 'l.regionId', 'r.regionId').select('l.id').where('u.email', '=', SIGN_INS.regional).execute()).map((l) => l.id);
    expect(shops.length).toBeGreaterThan(1);
    expect(readsShopRanges(shops)).toBe(true);
    for (const q of (await sampleTexts()).slice(0, 10)) {
      expect(await everyId<BuildView>(regional, '/api/builds', { q }, (b) => String(b.id)), q).toEqual((await scanBuilds(q, shops)).sort());
    }
  }, 60_000);

  it('finds in the statuses asked for what a plain scan finds, for the owner and a lead', async () => {
    for (const q of (await sampleTexts()).slice(0, 10)) {
      for (const status of [['delivered'], ['booked', 'in_bay']]) {
        const query = { q, status };
        expect(await everyId<BuildView>(owner, '/api/builds', query, (b) => String(b.id)), q).toEqual((await scanBuilds(q, undefined, status)).sort());
        expect(await everyId<BuildView>(lead, '/api/builds', query, (b) => String(b.id)), q).toEqual((await scanBuilds(q, den, status)).sort());
      }
    }
  }, 60_000);

  it('lists the newest 1,000 builds of a text that matches more, and says there are more', async () => {
    const vehicle = await h.db.selectFrom('vehicles').select('year').groupBy('year').orderBy((eb) => eb.fn.countAll(), 'desc').limit(1).executeTakeFirstOrThrow();
    const q = String(vehicle.year).slice(0, 3);
    const expected = await scanBuilds(q);
    expect(expected.length).toBeGreaterThan(1000);
    const first = await owner.get('/api/builds').query({ q });
    expect(first.body).toMatchObject({ total: 1000, totalCapped: true });
    expect(await everyId<BuildView>(owner, '/api/builds', { q }, (b) => String(b.id))).toEqual(expected.slice(0, 1000).sort());
  }, 60_000);

  it('keeps the index current as customers, vehicles and serial numbers change', async () => {
    const build = await h.db.selectFrom('builds').select(['id', 'customerId', 'vehicleId']).where('locationId', '=', den).orderBy('id').limit(1).executeTakeFirstOrThrow();
    const customer = (await owner.get(`/api/customers/${build.customerId}`)).body;
    const renamed = await owner.put(`/api/customers/${customer.id}`).send({ name: 'Quillon Verbeck', version: customer.version });
    expect(renamed.status).toBe(200);
    const before = await h.db.selectFrom('vehicles').select(['vin', 'plate']).where('id', '=', build.vehicleId).executeTakeFirstOrThrow();
    await h.db.updateTable('vehicles').set({ model: 'Thornback XR' }).where('id', '=', build.vehicleId).execute();
    // Apart, as the vehicle form may change them alone.
    await h.db.updateTable('vehicles').set({ vin: '7QZWX41J0NV803317', plate: 'QX4 7ZP' }).where('id', '=', build.vehicleId).execute();
    await h.db.updateTable('buildItems').set({ serialNumber: null }).where('buildId', '=', build.id).execute();
    const formerIdentity = [before.vin, before.plate].filter((text): text is string => text !== null);
    for (const q of ['quillon verb', 'thornback', customer.name.slice(0, 6), 'KSTR', 'r ve', 'nv8033', 'qx4 7', ...formerIdentity]) {
      expect(await everyId<BuildView>(owner, '/api/builds', { q }, (b) => String(b.id)), q).toEqual((await scanBuilds(q)).sort());
    }
    for (const q of ['quillon verb', 'nv8033', 'qx4 7']) {
      expect(await everyId<BuildView>(owner, '/api/builds', { q }, (b) => String(b.id)), q).toContain(String(build.id));
      // The lead's search reads the shop's own index: it follows the same changes.
      expect(await everyId<BuildView>(lead, '/api/builds', { q }, (b) => String(b.id)), q).toEqual((await scanBuilds(q, den)).sort());
    }
    const { status } = await h.db.selectFrom('builds').select('status').where('id', '=', build.id).executeTakeFirstOrThrow();
    const other = status === 'cancelled' ? 'booked' : 'cancelled';
    await h.db.updateTable('builds').set({ status: other }).where('id', '=', build.id).execute();
    for (const asked of [status, other]) {
      const found = await everyId<BuildView>(owner, '/api/builds', { q: 'quillon verb', status: asked }, (b) => String(b.id));
      expect(found, asked).toEqual((await scanBuilds('quillon verb', undefined, [asked])).sort());
      expect(found.includes(String(build.id)), asked).toBe(asked === other);
    }
    // Moved to another shop, the build leaves this shop's part of the per-shop index for the other's.
    const elsewhere = (await demoIds(h.db)).location('AVL');
    await h.db.updateTable('builds').set({ locationId: elsewhere, sequence: 99_999 }).where('id', '=', build.id).execute();
    expect(await everyId<BuildView>(lead, '/api/builds', { q: 'quillon verb' }, (b) => String(b.id))).not.toContain(String(build.id));
    const lead2 = await h.signedIn(SIGN_INS.lead2);
    expect(await everyId<BuildView>(lead2, '/api/builds', { q: 'quillon verb' }, (b) => String(b.id))).toEqual((await scanBuilds('quillon verb', elsewhere)).sort());
    expect(await everyId<BuildView>(lead2, '/api/builds', { q: 'quillon verb' }, (b) => String(b.id))).toContain(String(build.id));
    await sql`insert into build_search (build_search, rank) values ('integrity-check', 1)`.execute(h.db);
    await sql`insert into shop_build_search (shop_build_search, rank) values ('integrity-check', 1)`.execute(h.db);
  }, 60_000);
});

describe('customer search', () => {
  /** Customers whose name, e-mail or phone contains `text`, by LIKE alone, at one location or all. */
  async function scanCustomers(text: string, locationId?: number): Promise<string[]> {
    const pattern = like(text);
    const rows = await sql<{ id: number }>`select id from customers
      where (name like ${pattern} escape '\\' or email like ${pattern} escape '\\' or phone like ${pattern} escape '\\')
        and (${locationId ?? null} is null or location_id = ${locationId ?? null})`.execute(h.db);
    return rows.rows.map((r) => String(r.id)).sort();
  }

  /** Every customer a search lists, page by page. */
  async function everyCustomer(agent: Agent, q: string): Promise<string[]> {
    const found: string[] = [];
    for (let page = 1; ; page++) {
      const res = await agent.get('/api/customers').query({ q, page, pageSize: 200 });
      expect(res.status).toBe(200);
      found.push(...res.body.items.map((c: { id: number }) => String(c.id)));
      if (res.body.items.length < 200) return found.sort();
    }
  }

  it("finds for the owner what a plain scan of names, e-mail and phone finds, and for a lead in the lead's shop", async () => {
    const customer = await h.db.selectFrom('customers').select(['name', 'email', 'phone']).where('phone', '!=', '').where('locationId', '=', den).orderBy('id').limit(1).offset(7).executeTakeFirstOrThrow();
    for (const q of [customer.name.slice(2, 7).toUpperCase(), customer.email.split('@')[0]!, customer.phone.slice(-4), 'an', 'no such customer']) {
      const expected = await scanCustomers(q);
      if (q !== 'no such customer') expect(expected.length, q).toBeGreaterThan(0);
      expect(await everyCustomer(owner, q), q).toEqual(expected);
      expect(await everyCustomer(lead, q), q).toEqual(await scanCustomers(q, den));
    }
    // Renamed, a customer is found by the new name in the shop's own index too.
    const { id, version } = await h.db.selectFrom('customers').select(['id', 'version']).where('locationId', '=', den).orderBy('id').limit(1).offset(3).executeTakeFirstOrThrow();
    expect((await owner.put(`/api/customers/${id}`).send({ name: 'Ysolde Marchbank', version })).status).toBe(200);
    expect(await everyCustomer(lead, 'ysolde march')).toEqual([String(id)]);
    await sql`insert into shop_customer_search (shop_customer_search, rank) values ('integrity-check', 1)`.execute(h.db);
  }, 60_000);
});

describe('serial number search', () => {
  /** Installed units whose serial number contains `text` in any case, by a plain scan, newest build first. */
  async function scanSerials(text: string, locationId?: number): Promise<{ key: string; buildId: number }[]> {
    const rows = await sql<{ key: string; buildId: number }>`select i.serial_number || ' ' || i.sku || ' ' || b.id as key, b.id as "buildId"
      from build_items i join builds b on b.id = i.build_id
      where i.serial_number like ${like(text)} escape '\\' and (${locationId ?? null} is null or b.location_id = ${locationId ?? null})
      order by b.id desc`.execute(h.db);
    return rows.rows;
  }
  const keysOf = (units: { key: string }[]) => units.map((u) => u.key).sort();

  /** Every page of a serial search; the count says how many there are, up to "more than 1,000", and the pages end there too. */
  async function everySerial(agent: Agent, q: string): Promise<string[]> {
    const found: string[] = [];
    for (let page = 1; ; page++) {
      const res = await agent.get('/api/serials').query({ q, page, pageSize: 100 });
      expect(res.status).toBe(200);
      found.push(...(res.body.items as SerialMatch[]).map((m) => `${m.serialNumber} ${m.sku} ${m.buildId}`));
      if (res.body.totalCapped) expect(res.body.total).toBe(1000);
      if (res.body.items.length < 100) {
        expect(found.length).toBe(res.body.totalCapped ? 1000 : res.body.total);
        return found.sort();
      }
    }
  }

  it('finds any part of a number, in any case, what a plain scan finds', async () => {
    const serials = await h.db.selectFrom('buildItems').select('serialNumber').where('serialNumber', 'is not', null).orderBy('id').limit(3).offset(40).execute();
    const pieces = serials.flatMap(({ serialNumber: s }) => [s!.slice(0, 5).toLowerCase(), s!.slice(3, 9), s!.slice(-4), s!]);
    for (const q of [...pieces, 'zzz']) {
      const expected = await scanSerials(q);
      expect(expected.length, q).toBeLessThanOrEqual(1000);
      if (q !== 'zzz') expect(expected.length, q).toBeGreaterThan(0);
      expect(await everySerial(owner, q), q).toEqual(keysOf(expected));
      expect(await everySerial(lead, q), q).toEqual(keysOf(await scanSerials(q, den)));
    }
  }, 60_000);

  it("lists the units by their numbers in any case, as SQLite's NOCASE collation orders them, then by unit", async () => {
    const units = await h.db
      .selectFrom('buildItems as i')
      .innerJoin('builds as b', 'b.id', 'i.buildId')
      .select('i.id')
      .where('b.locationId', '=', den)
      .where('i.serialNumber', 'is not', null)
      .orderBy('i.id', 'desc')
      .limit(5)
      .execute();
    // Upper and lower case alike, and signs that sort between the cases' letters ("_" after "Z", before "a").
    const numbers = ['QZV-b200', 'qzv_A100', 'QZVA100', 'qzv.c300', 'QZV-B200'];
    for (const [i, unit] of units.entries()) await h.db.updateTable('buildItems').set({ serialNumber: numbers[i]! }).where('id', '=', unit.id).execute();
    const { rows } = await sql<{ serialNumber: string }>`select serial_number as "serialNumber" from build_items where serial_number like '%qzv%' order by serial_number collate nocase, id`.execute(h.db);
    const sqliteOrder = rows.map((r) => r.serialNumber);
    // The two of the same number in any case by unit: the last of the five, the older unit, first.
    expect(sqliteOrder).toEqual(['QZV-B200', 'QZV-b200', 'qzv.c300', 'qzv_A100', 'QZVA100']);
    for (const agent of [owner, lead]) {
      const pages = await Promise.all([1, 2, 3].map((page) => agent.get('/api/serials').query({ q: 'qzv', page, pageSize: 2 })));
      expect(pages.map((res) => res.body.total)).toEqual([5, 5, 5]);
      expect(pages.flatMap((res) => (res.body.items as SerialMatch[]).map((m) => m.serialNumber))).toEqual(sqliteOrder);
    }
  });

  it('lists the units of the newest builds of a piece that matches more than 1,000, and says there are more', async () => {
    const { serialNumber } = await h.db.selectFrom('buildItems').select('serialNumber').where('serialNumber', 'is not', null).orderBy('id').limit(1).executeTakeFirstOrThrow();
    const q = serialNumber!.slice(0, 3);
    const expected = await scanSerials(q);
    expect(expected.length).toBeGreaterThan(1000);
    const first = await owner.get('/api/serials').query({ q });
    expect(first.body).toMatchObject({ total: 1000, totalCapped: true });
    const found = await everySerial(owner, q);
    expect(found).toHaveLength(1000);
    // Every unit of a build newer than the oldest one listed is listed, and nothing the scan does not find.
    const oldest = Math.min(...found.map((key) => Number(key.split(' ').at(-1))));
    expect(found).toEqual(expect.arrayContaining(keysOf(expected.filter((u) => u.buildId > oldest))));
    expect(keysOf(expected)).toEqual(expect.arrayContaining(found));
  }, 60_000);
});
