import type { RoyaltyTermsView } from '@busbar/shared';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { demoIds, startHarness, type Harness } from '../support/api-harness.ts';
import { SIGN_INS } from '../support/staff-fixtures.ts';

let h: Harness;
let ids: Awaited<ReturnType<typeof demoIds>>;
let path: string;
beforeAll(async () => {
  h = await startHarness();
  ids = await demoIds(h.db);
  path = `/api/locations/${ids.location('DEN')}/royalty-terms`;
});
afterAll(() => h.close());

const as = async (email: string) => h.signedIn(email);

describe('royalty terms', () => {
  it("lists the demo's terms for the owner and the accountant, newest first", async () => {
    for (const who of [SIGN_INS.owner, SIGN_INS.accountant]) {
      const terms = (await (await as(who)).get(path).expect(200)).body as RoyaltyTermsView[];
      expect(terms.map((t) => [t.appliesFrom, t.royaltyBasisPoints, t.marketingBasisPoints])).toEqual([['2020-01', 600, 150]]);
    }
  });

  it('are set by the owner from a month on; the same month again replaces them, and the log keeps both', async () => {
    const owner = await as(SIGN_INS.owner);
    await owner.post(path).send({ appliesFrom: '2026-07', royaltyBasisPoints: 650, marketingBasisPoints: 150 }).expect(201);
    const replaced = (await owner.post(path).send({ appliesFrom: '2026-07', royaltyBasisPoints: 675, marketingBasisPoints: 125 }).expect(201)).body as RoyaltyTermsView[];
    expect(replaced.map((t) => [t.appliesFrom, t.royaltyBasisPoints, t.marketingBasisPoints, t.createdByName])).toEqual([
      ['2026-07', 675, 125, 'Marguerite Okafor'],
      ['2020-01', 600, 150, null],
    ]);
    const log = await h.db.selectFrom('auditLog').select(['before', 'after']).where('action', '=', 'location.royalty_terms').orderBy('id').execute();
    expect(log.map((l) => [JSON.parse(l.before ?? 'null'), JSON.parse(l.after!)])).toEqual([
      [null, { appliesFrom: '2026-07', royaltyBasisPoints: 650, marketingBasisPoints: 150 }],
      [{ royaltyBasisPoints: 650, marketingBasisPoints: 150 }, { appliesFrom: '2026-07', royaltyBasisPoints: 675, marketingBasisPoints: 125 }],
    ]);
  });

  it('are read by no one else, and set by no one else, in words', async () => {
    for (const who of [SIGN_INS.regional, SIGN_INS.lead, SIGN_INS.tech, SIGN_INS.warranty]) {
      const res = await (await as(who)).get(path);
      expect(res.status, who).toBe(403);
      expect(res.body.error.message).toBe('Only the network owner and the accountant read royalty terms');
    }
    const byAccountant = await (await as(SIGN_INS.accountant)).post(path).send({ appliesFrom: '2026-08', royaltyBasisPoints: 1, marketingBasisPoints: 1 });
    expect(byAccountant.status).toBe(403);
    expect(byAccountant.body.error.message).toBe('Only the network owner sets royalty terms');
    // A lead of another shop does not learn Denver exists.
    expect((await (await as(SIGN_INS.lead2)).get(path)).status).toBe(404);
  });

  it('refuses rates out of range and a month that is not one, naming the field in words', async () => {
    const owner = await as(SIGN_INS.owner);
    const refused = async (body: object) => (await owner.post(path).send(body).expect(400)).body.error.fields as Record<string, string>;
    expect(await refused({ appliesFrom: '2026-13', royaltyBasisPoints: 600, marketingBasisPoints: 0 })).toEqual({ appliesFrom: 'Use a month like 2026-03' });
    expect(await refused({ appliesFrom: '2026-09', royaltyBasisPoints: -1, marketingBasisPoints: 0 })).toEqual({ royaltyBasisPoints: 'The rate cannot be negative' });
    expect(await refused({ appliesFrom: '2026-09', royaltyBasisPoints: 6.5, marketingBasisPoints: 0 })).toEqual({ royaltyBasisPoints: 'Enter the rate in basis points (650 is 6.5 %)' });
    expect(await refused({ appliesFrom: '2026-09', royaltyBasisPoints: 9000, marketingBasisPoints: 1001 })).toEqual({ marketingBasisPoints: 'Royalty and marketing fund together can be at most 100 %' });
  });
});
