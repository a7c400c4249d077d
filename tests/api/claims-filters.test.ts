import type { ClaimView, Page } from '@busbar/shared';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { demoIds, startHarness, type Agent, type Harness } from '../support/api-harness.ts';
import { addVendor } from '../support/catalog-fixtures.ts';
import { addDeliveredUnit } from '../support/claim-fixtures.ts';
import { SIGN_INS } from '../support/staff-fixtures.ts';

/**
 * The claims list's filters against a plain scan: every claim of the test network read whole,
 * filtered and ordered here, with each logging day taken in its location's zone by Intl.
 */
let h: Harness;
let ids: Awaited<ReturnType<typeof demoIds>>;
let agents: { owner: Agent; regional: Agent; lead: Agent };
let vendors: number[];

const CATEGORIES = ['house_battery', 'inverter', 'solar_panel', 'dc_dc_charger'] as const;
const MODES = ['will_not_charge', 'overheating', 'water_ingress'] as const;
const COVERAGES = ['vendor_defect', 'workmanship', 'goodwill'] as const;
const CLAIMS = 28;

beforeAll(async () => {
  h = await startHarness();
  ids = await demoIds(h.db);
  agents = { owner: await h.signedIn(SIGN_INS.owner), regional: await h.signedIn(SIGN_INS.regional), lead: await h.signedIn(SIGN_INS.lead) };
  vendors = [(await addVendor(h.db)).id, (await addVendor(h.db)).id, (await addVendor(h.db)).id];
  const shops = ['DEN', 'BOI', 'AVL', 'PHX'].map((code) => ids.location(code));
  for (let i = 0; i < CLAIMS; i++) {
    const unit = await addDeliveredUnit(h.db, shops[i % shops.length]!);
    await h.db.updateTable('catalogItems').set({ vendorId: vendors[i % 3]!, category: CATEGORIES[Math.floor(i / 2) % 4]! }).where('id', '=', unit.item.id).execute();
    const res = await agents.owner
      .post('/api/claims')
      .send({ buildItemId: unit.buildItemId, failedOn: '2026-06-01', failureMode: MODES[i % 3], coverage: COVERAGES[(i >> 1) % 3], symptoms: 'Stops under load' });
    if (res.status !== 201) throw new Error(`claim answered ${res.status}: ${JSON.stringify(res.body)}`);
    // Failure days across three months; logging moments every 7 h 10 min from 1 March, so many fall near a midnight somewhere.
    const failedOn = new Date(Date.UTC(2026, 1, 20 + i * 3)).toISOString().slice(0, 10);
    const createdAt = new Date(Date.UTC(2026, 2, 1, 2) + i * 430 * 60_000).toISOString();
    // As if logged then: the day at the claim's shop is kept with it, as the API keeps it when a claim is logged.
    const loggedOn = localDayOf(await zoneOf(shops[i % shops.length]!), createdAt);
    await h.db.updateTable('warrantyClaims').set({ failedOn, createdAt, loggedOn, ...(i % 5 === 0 && { status: 'closed', dueOn: null }) }).where('id', '=', res.body.id).execute();
  }
});
afterAll(() => h.close());

const zoneOf = async (locationId: number) => (await h.db.selectFrom('locations').select('timeZone').where('id', '=', locationId).executeTakeFirstOrThrow()).timeZone;
const localDayOf = (timeZone: string, at: string) => new Intl.DateTimeFormat('en-CA', { timeZone, year: 'numeric', month: '2-digit', day: '2-digit' }).format(new Date(at));

interface Scanned {
  id: number;
  locationId: number;
  status: string;
  coverage: string;
  failureMode: string;
  failedOn: string;
  dueOn: string | null;
  vendorId: number;
  category: string;
  loggedOn: string;
}

/** Every claim, read whole, with its logging day in its location's zone. */
async function scan(): Promise<Scanned[]> {
  const rows = await h.db
    .selectFrom('warrantyClaims as w')
    .innerJoin('buildItems as i', 'i.id', 'w.buildItemId')
    .innerJoin('catalogItems as c', 'c.id', 'i.catalogItemId')
    .innerJoin('locations as l', 'l.id', 'w.locationId')
    .select(['w.id', 'w.locationId', 'w.status', 'w.coverage', 'w.failureMode', 'w.failedOn', 'w.dueOn', 'w.createdAt', 'c.vendorId', 'c.category', 'l.timeZone'])
    .execute();
  return rows.map(({ createdAt, timeZone, ...row }) => ({
    ...row,
    loggedOn: localDayOf(timeZone, createdAt),
  }));
}

type Filter = Partial<Record<'status' | 'coverage' | 'failureMode' | 'vendorId' | 'category' | 'locationId' | 'failedFrom' | 'failedTo' | 'loggedFrom' | 'loggedTo', string | number>>;

function expected(all: Scanned[], scope: readonly number[] | 'all', f: Filter): number[] {
  const hit = (c: Scanned) =>
    (scope === 'all' || scope.includes(c.locationId)) &&
    (f.status === undefined || c.status === f.status) &&
    (f.coverage === undefined || c.coverage === f.coverage) &&
    (f.failureMode === undefined || c.failureMode === f.failureMode) &&
    (f.vendorId === undefined || c.vendorId === f.vendorId) &&
    (f.category === undefined || c.category === f.category) &&
    (f.locationId === undefined || c.locationId === f.locationId) &&
    (f.failedFrom === undefined || c.failedOn >= String(f.failedFrom)) &&
    (f.failedTo === undefined || c.failedOn <= String(f.failedTo)) &&
    (f.loggedFrom === undefined || c.loggedOn >= String(f.loggedFrom)) &&
    (f.loggedTo === undefined || c.loggedOn <= String(f.loggedTo));
  // The queue's order: the next step due soonest first, claims with no due day (closed) last.
  const order = (a: Scanned, b: Scanned) => Number(a.dueOn === null) - Number(b.dueOn === null) || (a.dueOn ?? '').localeCompare(b.dueOn ?? '') || a.id - b.id;
  return all.filter(hit).sort(order).map((c) => c.id);
}

/** Every page of the list, 4 claims a page, as the person reads it. */
async function listed(agent: Agent, f: Filter): Promise<{ ids: number[]; total: number }> {
  const found: number[] = [];
  let total = -1;
  for (let page = 1; page < 40; page++) {
    const res = await agent.get('/api/claims').query({ ...f, page, pageSize: 4 });
    expect(res.status).toBe(200);
    const body = res.body as Page<ClaimView>;
    total = body.total;
    found.push(...body.items.map((c) => c.id));
    if (body.items.length < 4) break;
  }
  return { ids: found, total };
}

describe('claims list filters', () => {
  const cases = (): [string, Filter][] => [
    ['a vendor', { vendorId: vendors[0]! }],
    ['a vendor and a category', { vendorId: vendors[1]!, category: 'inverter' }],
    ['a category', { category: 'solar_panel' }],
    ['a category nobody claimed', { category: 'fuse_block' }],
    ['failed in March', { failedFrom: '2026-03-01', failedTo: '2026-03-31' }],
    ['failed from mid-April', { failedFrom: '2026-04-15' }],
    ['failed up to February', { failedTo: '2026-02-28' }],
    ['logged on one day', { loggedFrom: '2026-03-03', loggedTo: '2026-03-03' }],
    ['logged from a day', { loggedFrom: '2026-03-05' }],
    ['logged up to a day, of a vendor', { loggedTo: '2026-03-04', vendorId: vendors[2]! }],
    ['closed, workmanship', { status: 'closed', coverage: 'workmanship' }],
    ['a failure at one shop, failed in a span', { failureMode: 'overheating', locationId: ids.location('AVL'), failedFrom: '2026-02-01', failedTo: '2026-05-01' }],
  ];

  it('has test data that every filter splits', async () => {
    const all = await scan();
    expect(all.length).toBeGreaterThanOrEqual(CLAIMS);
    for (const [name, f] of cases().filter(([name]) => name !== 'a category nobody claimed')) {
      const hits = expected(all, 'all', f).length;
      expect([name, hits > 0 && hits < all.length]).toEqual([name, true]);
    }
  });

  it('agrees with a plain scan for the owner, the regional manager and a lead, page by page', async () => {
    const all = await scan();
    const west = ['DEN', 'BOI', 'PHX', 'PDX'].map((code) => ids.location(code));
    for (const [who, scope] of [['owner', 'all'], ['regional', west], ['lead', [ids.location('DEN')]]] as const) {
      for (const [name, f] of cases()) {
        const want = expected(all, scope, f);
        const got = await listed(agents[who], f);
        expect({ who, name, ids: got.ids, total: got.total }).toEqual({ who, name, ids: want, total: want.length });
      }
    }
  });

  it("cuts logging days in each location's own zone, the day kept with each claim", async () => {
    const all = await scan();
    const scanned = (id: number) => all.find((c) => c.id === id)!;
    // At least one claim's local day differs from its UTC day, and the filter follows the local day.
    const rows = await h.db.selectFrom('warrantyClaims').select(['id', 'createdAt']).execute();
    const shifted = rows.filter((r) => r.createdAt.slice(0, 10) !== scanned(r.id).loggedOn);
    expect(shifted.length).toBeGreaterThan(0);
    const one = scanned(shifted[0]!.id);
    const onLocalDay = await listed(agents.owner, { loggedFrom: one.loggedOn, loggedTo: one.loggedOn });
    expect(onLocalDay.ids).toContain(one.id);
    const utc = shifted[0]!.createdAt.slice(0, 10);
    expect((await listed(agents.owner, { loggedFrom: utc, loggedTo: utc })).ids).not.toContain(one.id);
  });

  it.each([
    [{ vendorId: 'abc' }, 'vendorId'],
    [{ category: 'toaster' }, 'category'],
    [{ failedFrom: '2026-13-01' }, 'failedFrom'],
    [{ loggedTo: 'yesterday' }, 'loggedTo'],
    [{ failedFrom: '2026-04-02', failedTo: '2026-04-01' }, 'failedTo'],
    [{ loggedFrom: '2026-04-02', loggedTo: '2026-04-01' }, 'loggedTo'],
  ])('refuses %j naming %s', async (query, field) => {
    const res = await agents.owner.get('/api/claims').query(query);
    expect(res.status).toBe(400);
    expect(Object.keys(res.body.error.fields)).toEqual([field]);
  });
});
