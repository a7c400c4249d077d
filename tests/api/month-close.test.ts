import type { Db } from '@busbar/db';
import type { MonthClose } from '@busbar/shared';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import * as flagChangedFinalMonths from '../../db/migrations/055-flag-changed-final-months.ts';
import { refillRollups } from '../../apps/api/src/queries/rollups-refill.ts';
import { demoIds, startHarness, type Harness } from '../support/api-harness.ts';
import { addCustomerWithVehicle } from '../support/build-fixtures.ts';
import { addDeliveredUnit } from '../support/claim-fixtures.ts';
import { SIGN_INS } from '../support/staff-fixtures.ts';

/**
 * January 2019, made by hand (the demo has nothing then, nor royalty terms, nor sales tax): builds
 * delivered at Denver (UTC−7 in winter; royalty 6 % and marketing fund 1.5 % from December 2018,
 * 7 % from February; sales tax on parts only, 7.5 % from December and 8.25 % from January, then
 * 8.5 % on parts and labor from February), Portland (UTC−8; 6.5 % and 1 % from January; no sales
 * tax) either side of local midnight, and Phoenix (UTC−7; no royalty terms; 8.25 % sales tax on
 * parts and labor from January), and claims at Denver credited, still open and denied. Every
 * figure below was worked out by hand.
 */
let h: Harness;
let ids: Awaited<ReturnType<typeof demoIds>>;
let sequence = 80_000;

/** A build delivered at `deliveredAt` (UTC), on the shop's local day `deliveredOn` as the app stores it on delivery. */
async function delivered(db: Db, code: string, deliveredAt: string, deliveredOn: string, money: { parts: number; labor: number; cost: number }) {
  const locationId = ids.location(code);
  const { customer, vehicle } = await addCustomerWithVehicle(db, locationId);
  const n = ++sequence;
  await db
    .insertInto('builds')
    .values({
      locationId, sequence: n, number: `${code}-${n}`, customerId: customer.id, vehicleId: vehicle.id, status: 'delivered', leadTechnicianId: null,
      laborHours: 0, laborRateCents: 14500, laborCents: money.labor, partsPriceCents: money.parts, partsCostCents: money.cost, totalCents: money.parts + money.labor,
      notes: '', createdBy: null, bookedFor: deliveredAt.slice(0, 10), startedAt: deliveredAt, deliveredAt, deliveredOn, createdAt: deliveredAt, updatedAt: deliveredAt,
    })
    .execute();
}

async function claim(at: string, creditRequestedCents: number, after: { status: 'credited' | 'denied'; received?: number } | null) {
  const unit = await addDeliveredUnit(h.db, ids.location('DEN'), { deliveredAt: '2018-06-01T18:00:00.000Z' });
  h.clock.now = new Date(at);
  const lead = await h.signedIn(SIGN_INS.lead);
  const res = await lead.post('/api/claims').send({ buildItemId: unit.buildItemId, failedOn: at.slice(0, 10), failureMode: 'overheating', coverage: 'vendor_defect', symptoms: 'Lug too hot to touch', creditRequestedCents });
  expect(res.status).toBe(201);
  if (after) await h.db.updateTable('warrantyClaims').set({ status: after.status, creditReceivedCents: after.received ?? null }).where('id', '=', res.body.id).execute();
}

beforeAll(async () => {
  h = await startHarness();
  ids = await demoIds(h.db);
  // Denver: $1,234.56 of parts and $507.50 of labor; then 23:30 on January 31 local (06:30 UTC on February 1).
  await delivered(h.db, 'DEN', '2019-01-10T18:00:00.000Z', '2019-01-10', { parts: 123_456, labor: 50_750, cost: 61_728 });
  await delivered(h.db, 'DEN', '2019-02-01T06:30:00.000Z', '2019-01-31', { parts: 10_000, labor: 14_500, cost: 5_000 });
  // 23:30 on December 31, 2018 local: not January's.
  await delivered(h.db, 'DEN', '2019-01-01T06:30:00.000Z', '2018-12-31', { parts: 99_999, labor: 0, cost: 1 });
  await delivered(h.db, 'PDX', '2019-01-15T20:00:00.000Z', '2019-01-15', { parts: 100_010, labor: 0, cost: 40_000 });
  await delivered(h.db, 'PHX', '2019-01-20T19:00:00.000Z', '2019-01-20', { parts: 40_000, labor: 20_200, cost: 25_000 });
  await claim('2019-01-05T18:00:00.000Z', 20_000, { status: 'credited', received: 20_000 });
  await claim('2019-01-20T18:00:00.000Z', 15_000, null);
  await claim('2019-01-25T18:00:00.000Z', 9_000, { status: 'denied' });
  h.clock.now = new Date('2026-06-15T15:00:00Z');
  const owner = await h.signedIn(SIGN_INS.owner);
  const terms = [['DEN', '2018-12', 600, 150], ['DEN', '2019-02', 700, 150], ['PDX', '2019-01', 650, 100]] as const;
  for (const [code, appliesFrom, royaltyBasisPoints, marketingBasisPoints] of terms) {
    await owner.post(`/api/locations/${ids.location(code)}/royalty-terms`).send({ appliesFrom, royaltyBasisPoints, marketingBasisPoints }).expect(201);
  }
  const salesTax = [['DEN', '2018-12', 750, false], ['DEN', '2019-01', 825, false], ['DEN', '2019-02', 850, true], ['PHX', '2019-01', 825, true]] as const;
  for (const [code, appliesFrom, basisPoints, laborTaxed] of salesTax) {
    await owner.post(`/api/locations/${ids.location(code)}/sales-tax`).send({ appliesFrom, basisPoints, laborTaxed }).expect(201);
  }
}, 60_000);
afterAll(() => h.close());

const ask = async (email: string, query: string) => (await h.signedIn(email)).get(`/api/closes?${query}`);

describe('the month close', () => {
  it("sums a shop's delivered builds, claims and royalty for its own month, as worked out by hand", async () => {
    const close = (await ask(SIGN_INS.accountant, 'month=2019-01')).body as MonthClose;
    const den = close.locations.find((l) => l.locationId === ids.location('DEN'))!;
    expect(den).toEqual({
      locationId: ids.location('DEN'),
      royaltyBasisPoints: 600,
      marketingBasisPoints: 150,
      salesTaxBasisPoints: 825,
      laborTaxed: false,
      buildsDelivered: 2,
      partsRevenueCents: 133_456, // 1,234.56 + 100.00
      laborRevenueCents: 65_250, // 507.50 + 145.00
      revenueCents: 198_706,
      partsCostCents: 66_728,
      grossMarginCents: 131_978, // 1,987.06 − 667.28
      claimsLogged: 3,
      creditRequestedCents: 44_000,
      creditReceivedCents: 20_000,
      creditOutstandingCents: 15_000, // the denied claim's credit is not owed
      royaltyBaseCents: 198_706,
      royaltyDueCents: 11_922, // 6 % of 1,987.06 = 119.2236
      marketingDueCents: 2_981, // 1.5 % of 1,987.06 = 29.8059
      salesTaxCents: 11_010, // 8.25 % of the parts' 1,334.56 = 110.1012; the labor is not taxed there
      status: 'open',
      finalizedAt: null,
      finalizedByName: null,
      next: true,
      nextToClose: null,
      adjustments: null,
    });
    const pdx = close.locations.find((l) => l.locationId === ids.location('PDX'))!;
    // 6.5 % of 1,000.10 = 65.0065: half a cent and more goes up.
    expect(pdx).toMatchObject({ royaltyBasisPoints: 650, revenueCents: 100_010, royaltyDueCents: 6_501, marketingDueCents: 1_000, grossMarginCents: 60_010 });
    // Portland has no sales tax rate: it charges none on its 1,000.10.
    expect(pdx).toMatchObject({ salesTaxBasisPoints: null, laborTaxed: null, salesTaxCents: 0 });
    // Phoenix taxes parts and labor: 8.25 % of 400.00 + 202.00 = 49.665, half a cent up; no royalty terms, no royalty.
    const phx = close.locations.find((l) => l.locationId === ids.location('PHX'))!;
    expect(phx).toMatchObject({ salesTaxBasisPoints: 825, laborTaxed: true, revenueCents: 60_200, salesTaxCents: 4_967, royaltyBaseCents: 60_200, royaltyDueCents: 0 });
    expect(close.total).toMatchObject({ buildsDelivered: 4, revenueCents: 358_916, royaltyDueCents: 18_423, marketingDueCents: 3_981, creditOutstandingCents: 15_000, salesTaxCents: 15_977 });
    // Boise has no terms that month: nothing is due, and the answer says there are none.
    expect(close.locations.find((l) => l.locationId === ids.location('BOI'))).toMatchObject({ royaltyBasisPoints: null, marketingBasisPoints: null, royaltyDueCents: 0 });
    expect(close.locations).toHaveLength(8);
    expect(close.ended).toBe(true);
  });

  it('says a month still running is not ended, and counts December apart from January', async () => {
    const running = (await ask(SIGN_INS.owner, 'month=2026-06')).body as MonthClose;
    expect(running.ended).toBe(false);
    const december = (await ask(SIGN_INS.owner, 'month=2018-12')).body as MonthClose;
    // 6 % of 999.99 = 59.9994; December's sales tax rate, 7.5 % of 999.99 = 74.99925.
    expect(december.locations.find((l) => l.locationId === ids.location('DEN'))).toMatchObject({ buildsDelivered: 1, revenueCents: 99_999, royaltyDueCents: 6_000, salesTaxBasisPoints: 750, salesTaxCents: 7_500 });
    const february = (await ask(SIGN_INS.owner, 'month=2019-02')).body as MonthClose;
    expect(february.locations.find((l) => l.locationId === ids.location('DEN'))).toMatchObject({ royaltyBasisPoints: 700, buildsDelivered: 0, royaltyDueCents: 0, salesTaxBasisPoints: 850, laborTaxed: true, salesTaxCents: 0 });
  });

  it('keeps to a region or a shop asked for', async () => {
    const den = ids.location('DEN');
    const region = ids.locations.find((l) => l.id === den)!.regionId;
    const west = (await ask(SIGN_INS.accountant, `month=2019-01&regionId=${region}`)).body as MonthClose;
    expect(west.locations.map((l) => l.locationId).sort()).toEqual(ids.locations.filter((l) => l.regionId === region).map((l) => l.id).sort());
    const one = (await ask(SIGN_INS.accountant, `month=2019-01&locationId=${den}`)).body as MonthClose;
    expect(one.locations.map((l) => l.locationId)).toEqual([den]);
    expect(one.total.revenueCents).toBe(198_706);
  });

  it('is the accountant’s and the owner’s only, and refuses the others in words', async () => {
    for (const who of [SIGN_INS.regional, SIGN_INS.lead, SIGN_INS.tech, SIGN_INS.warranty]) {
      const res = await ask(who, 'month=2019-01');
      expect(res.status, who).toBe(403);
      expect(res.body.error.message).toBe('Only the accountant and the network owner close months');
    }
    expect((await (await h.agent()).get('/api/closes?month=2019-01')).status).toBe(401);
  });

  it('answers a wrong month in words', async () => {
    const res = await ask(SIGN_INS.accountant, 'month=2019-13');
    expect(res.status).toBe(400);
    expect(res.body.error.fields.month).toBe('Use a month like 2026-03');
    expect((await ask(SIGN_INS.accountant, 'month=2019-01&extra=1')).status).toBe(400);
  });
});

describe('marking a month final', () => {
  const final = async (email: string, code: string, month: string) => (await h.signedIn(email)).post(`/api/closes/${ids.location(code)}/${month}/final`);
  const denIn = async (month: string) => ((await ask(SIGN_INS.accountant, `month=${month}`)).body as MonthClose).locations.find((l) => l.locationId === ids.location('DEN'))!;

  it('keeps the month as closed, and shows a later change to it once, in the next month closed', async () => {
    const closed = await final(SIGN_INS.accountant, 'DEN', '2019-01');
    expect(closed.status).toBe(201);
    expect(closed.body).toMatchObject({ status: 'final', revenueCents: 198_706, royaltyDueCents: 11_922, salesTaxCents: 11_010, adjustments: null, finalizedByName: 'Felix Moreau' });
    expect(await denIn('2019-02')).toMatchObject({ next: true, nextToClose: '2019-02' });
    expect(closed.body.nextToClose).toBe('2019-02');

    // A correction after the close: the January 10 build gains $100.00 of parts.
    await h.db.updateTable('builds').set((eb) => ({ partsPriceCents: eb('partsPriceCents', '+', 10_000), totalCents: eb('totalCents', '+', 10_000) })).where('deliveredOn', '=', '2019-01-10').where('locationId', '=', ids.location('DEN')).execute();
    expect(await denIn('2019-01')).toMatchObject({ status: 'final', revenueCents: 198_706, royaltyDueCents: 11_922, salesTaxCents: 11_010 });
    const february = await denIn('2019-02');
    expect(february).toMatchObject({ status: 'open', next: true, revenueCents: 0 });
    // 6 % of 2,087.06 = 125.2236 against 119.22 closed; 1.5 % = 31.3059 against 29.81.
    expect(february.adjustments).toEqual({ months: ['2019-01'], buildsDelivered: 0, revenueCents: 10_000, partsCostCents: 0, grossMarginCents: 10_000, royaltyDueCents: 600, marketingDueCents: 150, creditReceivedCents: 0 });

    const closedFebruary = await final(SIGN_INS.owner, 'DEN', '2019-02');
    expect(closedFebruary.status).toBe(201);
    expect(closedFebruary.body.adjustments).toEqual(february.adjustments);
    // Taken up once: March has nothing more to adjust.
    expect(await denIn('2019-03')).toMatchObject({ next: true, adjustments: null });
    const log = await h.db.selectFrom('auditLog').select('after').where('action', '=', 'close.final').execute();
    expect(log.map((l) => JSON.parse(l.after!).month)).toEqual(['2019-01', '2019-02']);
  });

  it('refuses a month twice, out of order, or not yet ended, in words', async () => {
    const refused = async (code: string, month: string, status: number) => {
      const res = await final(SIGN_INS.accountant, code, month);
      expect(res.status, `${code} ${month}`).toBe(status);
      return res.body.error.message as string;
    };
    expect(await refused('DEN', '2019-02', 409)).toBe('February 2019 is already final at Denver');
    expect(await refused('DEN', '2019-05', 400)).toBe('Close March 2019 at Denver first: months close in order');
    expect(await refused('DEN', '2018-12', 400)).toBe('Months close in order: February 2019 is final at Denver, so December 2018 stays open');
    // The harness's clock stands at June 15, 2026.
    expect(await refused('PDX', '2026-06', 400)).toBe('June 2026 has not ended at Portland yet');
    expect(await refused('PDX', '2019-13', 400)).toBe('Some fields need attention');
  });

  it('is the accountant’s and the owner’s only; a shop that does not exist is not found', async () => {
    for (const who of [SIGN_INS.regional, SIGN_INS.lead, SIGN_INS.warranty]) {
      const res = await final(who, 'DEN', '2019-03');
      expect(res.status, who).toBe(403);
      expect(res.body.error.message).toBe('Only the accountant and the network owner close months');
    }
    expect((await (await h.signedIn(SIGN_INS.accountant)).post('/api/closes/99999/2019-03/final')).status).toBe(404);
    expect((await denIn('2019-03')).status).toBe('open');
  });
});

describe('final months changed since', () => {
  const final = async (code: string, month: string) => (await h.signedIn(SIGN_INS.accountant)).post(`/api/closes/${ids.location(code)}/${month}/final`).expect(201);
  const flagged = async () =>
    (await h.db.selectFrom('monthCloses').select(['locationId', 'month']).where('changed', '=', 1).orderBy('locationId').orderBy('month').execute()).map((f) => `${f.locationId} ${f.month}`);
  const denJanuary = (cents: number) =>
    h.db.updateTable('builds').set((eb) => ({ partsPriceCents: eb('partsPriceCents', '+', cents), totalCents: eb('totalCents', '+', cents) })).where('deliveredOn', '=', '2019-01-10').where('locationId', '=', ids.location('DEN')).execute();
  const denIn = async (month: string) => ((await ask(SIGN_INS.accountant, `month=${month}`)).body as MonthClose).locations.find((l) => l.locationId === ids.location('DEN'))!;

  it("flags only the months a change touched, adjusts nothing for a change put back, and clears the shop's flags at its next close", async () => {
    // Denver's January and February are final (above), February having taken up January's change.
    expect(await flagged()).toEqual([]);
    await final('PDX', '2019-01');
    await denJanuary(5_000);
    expect(await flagged()).toEqual([`${ids.location('DEN')} 2019-01`]);
    await denJanuary(-5_000);
    expect(await denIn('2019-03')).toMatchObject({ next: true, adjustments: null });
    expect((await final('DEN', '2019-03')).body.adjustments).toBeNull();
    expect(await flagged()).toEqual([]);

    // A credit received after the close, on a claim logged in January, is adjusted for once.
    await h.db.updateTable('warrantyClaims').set({ status: 'credited', creditReceivedCents: 15_000 }).where('locationId', '=', ids.location('DEN')).where('loggedOn', '=', '2019-01-20').execute();
    expect(await flagged()).toEqual([`${ids.location('DEN')} 2019-01`]);
    expect((await denIn('2019-04')).adjustments).toMatchObject({ months: ['2019-01'], revenueCents: 0, creditReceivedCents: 15_000 });
    expect((await final('DEN', '2019-04')).body.adjustments).toMatchObject({ creditReceivedCents: 15_000 });
    expect(await flagged()).toEqual([]);
    expect((await denIn('2019-05')).adjustments).toBeNull();
  });

  it('flags, on the upgrade that keeps flags (055), final months changed before it', async () => {
    await flagChangedFinalMonths.down(h.db);
    await denJanuary(2_000);
    await flagChangedFinalMonths.up(h.db);
    expect(await flagged()).toEqual([`${ids.location('DEN')} 2019-01`]);
    expect((await denIn('2019-05')).adjustments).toMatchObject({ months: ['2019-01'], revenueCents: 2_000 });
  });

  it('keeps flagged, after the roll-ups are refilled (which rewrites every month), only the final months that differ', async () => {
    await refillRollups(h.db);
    expect(await flagged()).toEqual([`${ids.location('DEN')} 2019-01`]);
    expect((await denIn('2019-05')).adjustments).toMatchObject({ months: ['2019-01'], revenueCents: 2_000 });
  });
});

describe('a month closed before sales tax was kept', () => {
  it('reads as closed with no sales tax, even where a rate is in force now', async () => {
    const aus = ids.location('AUS');
    await delivered(h.db, 'AUS', '2018-03-14T18:00:00.000Z', '2018-03-14', { parts: 10_000, labor: 5_000, cost: 4_000 });
    const owner = await h.signedIn(SIGN_INS.owner);
    await owner.post(`/api/locations/${aus}/sales-tax`).send({ appliesFrom: '2018-01', basisPoints: 825, laborTaxed: true }).expect(201);
    // As a close marked final then kept it: no sales tax figure, rate or labor answer at all.
    const figures = {
      locationId: aus, royaltyBasisPoints: null, marketingBasisPoints: null, buildsDelivered: 1, partsRevenueCents: 10_000, laborRevenueCents: 5_000, revenueCents: 15_000,
      partsCostCents: 4_000, grossMarginCents: 11_000, claimsLogged: 0, creditRequestedCents: 0, creditReceivedCents: 0, creditOutstandingCents: 0,
      royaltyBaseCents: 15_000, royaltyDueCents: 0, marketingDueCents: 0, adjustments: null,
    };
    const carried = { buildsDelivered: 1, revenueCents: 15_000, partsCostCents: 4_000, creditReceivedCents: 0 };
    await h.db.insertInto('monthCloses').values({ locationId: aus, month: '2018-03', finalizedAt: '2018-04-02T15:00:00.000Z', finalizedBy: null, figures: JSON.stringify(figures), carried: JSON.stringify(carried) }).execute();

    const close = (await ask(SIGN_INS.accountant, 'month=2018-03')).body as MonthClose;
    // Open, the month would owe 8.25 % of 150.00 = 12.375; closed, it owes what it was closed with.
    expect(close.locations.find((l) => l.locationId === aus)).toMatchObject({ status: 'final', revenueCents: 15_000, salesTaxCents: 0, salesTaxBasisPoints: null, laborTaxed: null });
    expect(close.total).toMatchObject({ buildsDelivered: 1, revenueCents: 15_000, salesTaxCents: 0 });
  });
});
