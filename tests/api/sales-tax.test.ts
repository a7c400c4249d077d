import type { SalesTaxView } from '@busbar/shared';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { demoIds, startHarness, type Harness } from '../support/api-harness.ts';
import { SIGN_INS } from '../support/staff-fixtures.ts';

let h: Harness;
let ids: Awaited<ReturnType<typeof demoIds>>;
let path: string;
beforeAll(async () => {
  h = await startHarness();
  ids = await demoIds(h.db);
  path = `/api/locations/${ids.location('DEN')}/sales-tax`;
});
afterAll(() => h.close());

const as = async (email: string) => h.signedIn(email);
const rates = async () => ((await (await as(SIGN_INS.owner)).get(path).expect(200)).body as SalesTaxView[]).map((r) => [r.appliesFrom, r.basisPoints, r.laborTaxed]);
const logged = () => h.db.selectFrom('auditLog').select(['actorId', 'entityId', 'before', 'after']).where('action', '=', 'location.sales_tax').orderBy('id').execute();

describe('sales tax rates', () => {
  it('are none at first: the demo shops charge no sales tax', async () => {
    expect(await rates()).toEqual([]);
  });

  it('are set by the owner from a month on, newest first, each in the audit log', async () => {
    const owner = await as(SIGN_INS.owner);
    await owner.post(path).send({ appliesFrom: '2026-07', basisPoints: 825, laborTaxed: false }).expect(201);
    const answer = (await owner.post(path).send({ appliesFrom: '2026-09', basisPoints: 900, laborTaxed: true }).expect(201)).body as SalesTaxView[];
    expect(answer.map((r) => [r.appliesFrom, r.basisPoints, r.laborTaxed, r.createdByName])).toEqual([
      ['2026-09', 900, true, 'Marguerite Okafor'],
      ['2026-07', 825, false, 'Marguerite Okafor'],
    ]);
    expect((await logged()).map((l) => [l.actorId, l.entityId, l.before, JSON.parse(l.after!)])).toEqual([
      [ids.user(SIGN_INS.owner), ids.location('DEN'), null, { appliesFrom: '2026-07', basisPoints: 825, laborTaxed: false }],
      [ids.user(SIGN_INS.owner), ids.location('DEN'), null, { appliesFrom: '2026-09', basisPoints: 900, laborTaxed: true }],
    ]);
  });

  it("are read by the accountant, the region's manager and the shop's lead; not by the shop's technician or warranty clerk", async () => {
    for (const who of [SIGN_INS.accountant, SIGN_INS.regional, SIGN_INS.lead]) {
      const read = (await (await as(who)).get(path).expect(200)).body as SalesTaxView[];
      expect(read.map((r) => r.appliesFrom), who).toEqual(['2026-09', '2026-07']);
    }
    for (const who of [SIGN_INS.tech, SIGN_INS.warranty]) {
      const res = await (await as(who)).get(path);
      expect(res.status, who).toBe(403);
      expect(res.body.error.message).toBe('Only people who read the shop’s revenue read its sales tax');
    }
    // A lead of another shop does not learn Denver exists.
    expect((await (await as(SIGN_INS.lead2)).get(path)).status).toBe(404);
    expect((await (await as(SIGN_INS.owner)).get('/api/locations/99999/sales-tax')).status).toBe(404);
  });

  it('are set by no one but the owner, and a refused change writes nothing', async () => {
    for (const who of [SIGN_INS.accountant, SIGN_INS.regional, SIGN_INS.lead, SIGN_INS.tech]) {
      const res = await (await as(who)).post(path).send({ appliesFrom: '2026-10', basisPoints: 1, laborTaxed: false });
      expect(res.status, who).toBe(403);
      expect(res.body.error.message).toBe('Only the network owner sets sales tax');
    }
    expect((await (await as(SIGN_INS.lead2)).post(path).send({ appliesFrom: '2026-10', basisPoints: 1, laborTaxed: false })).status).toBe(404);
    expect((await (await as(SIGN_INS.owner)).post('/api/locations/99999/sales-tax').send({ appliesFrom: '2026-10', basisPoints: 1, laborTaxed: false })).status).toBe(404);
    expect(await rates()).toEqual([['2026-09', 900, true], ['2026-07', 825, false]]);
    expect(await logged()).toHaveLength(2);
  });

  it('refuses a rate out of range, a month that is not one and a missing answer on labor, naming the field in words', async () => {
    const owner = await as(SIGN_INS.owner);
    const refused = async (body: object) => (await owner.post(path).send(body).expect(400)).body.error.fields as Record<string, string>;
    expect(await refused({ appliesFrom: '2026-11', basisPoints: 10_001, laborTaxed: false })).toEqual({ basisPoints: 'The rate can be at most 100 %' });
    expect(await refused({ appliesFrom: '2026-11', basisPoints: -1, laborTaxed: false })).toEqual({ basisPoints: 'The rate cannot be negative' });
    expect(await refused({ appliesFrom: '2026-11', basisPoints: 8.25, laborTaxed: false })).toEqual({ basisPoints: 'Enter the rate in basis points (825 is 8.25 %)' });
    expect(await refused({ appliesFrom: '2026-13', basisPoints: 825, laborTaxed: false })).toEqual({ appliesFrom: 'Use a month like 2026-03' });
    expect(await refused({ appliesFrom: '2026-11', basisPoints: 825 })).toEqual({ laborTaxed: 'Say whether labor is taxed' });
    expect(await refused({ appliesFrom: '2026-11', basisPoints: 825, laborTaxed: false, royaltyBasisPoints: 600 })).toEqual({ royaltyBasisPoints: 'Unknown field' });
    expect(await rates()).toHaveLength(2);
  });

  it('refuses a second rate for a month that has one, in words, keeping the first', async () => {
    const res = await (await as(SIGN_INS.owner)).post(path).send({ appliesFrom: '2026-07', basisPoints: 850, laborTaxed: true });
    expect(res.status).toBe(409);
    const message = 'Denver already has a sales tax rate from July 2026: set the new rate from a later month';
    expect(res.body.error).toMatchObject({ message, fields: { appliesFrom: message } });
    expect(await rates()).toEqual([['2026-09', 900, true], ['2026-07', 825, false]]);
    expect(await logged()).toHaveLength(2);
  });
});
