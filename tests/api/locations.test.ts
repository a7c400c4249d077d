import type { LocationSettings, Page } from '@busbar/shared';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { demoIds, startHarness, type Agent, type Harness } from '../support/api-harness.ts';
import { auditOf } from '../support/catalog-fixtures.ts';
import { SIGN_INS, signInEveryone, type SignIn } from '../support/staff-fixtures.ts';

let h: Harness;
let ids: Awaited<ReturnType<typeof demoIds>>;
let agents: Record<SignIn, Agent>;

beforeAll(async () => {
  h = await startHarness();
  ids = await demoIds(h.db);
  agents = await signInEveryone(h);
});
afterAll(() => h.close());

const limitOf = async (code: string) =>
  (await h.db.selectFrom('locations').select('claimApprovalLimitCents').where('id', '=', ids.location(code)).executeTakeFirstOrThrow()).claimApprovalLimitCents;

/** The location codes each person reads on the locations page, in code order. */
const READS: Record<SignIn, string[]> = {
  owner: ['AUS', 'AVL', 'BOI', 'BTV', 'DEN', 'DLH', 'PDX', 'PHX'],
  accountant: ['AUS', 'AVL', 'BOI', 'BTV', 'DEN', 'DLH', 'PDX', 'PHX'],
  regional: ['BOI', 'DEN', 'PDX', 'PHX'],
  lead: ['DEN'],
  tech: ['DEN'],
  warranty: ['DEN'],
  lead2: ['AVL'],
};

describe('reading locations with their approval limit', () => {
  it.each(Object.entries(READS))('%s reads a page of only the locations they may see', async (who, codes) => {
    const res = await agents[who as SignIn].get('/api/locations/settings');
    expect(res.status).toBe(200);
    const page = res.body as Page<LocationSettings>;
    expect(page).toMatchObject({ total: codes.length, totalCapped: false, page: 1, pageSize: 50 });
    expect(page.items.map((l) => l.code)).toEqual(codes);
  });

  it('names the region and the limit of each location', async () => {
    const den = (await agents.lead.get('/api/locations/settings')).body.items[0];
    expect(den).toEqual({ id: ids.location('DEN'), code: 'DEN', name: 'Denver', regionId: ids.region('WEST'), regionName: expect.any(String), timeZone: 'America/Denver', claimApprovalLimitCents: 50_000 });
  });

  it('pages on the server, narrowed by code or name and by region', async () => {
    const first = (await agents.owner.get('/api/locations/settings').query({ pageSize: 3 })).body as Page<LocationSettings>;
    const third = (await agents.owner.get('/api/locations/settings').query({ pageSize: 3, page: 3 })).body as Page<LocationSettings>;
    expect([first.total, first.items.map((l) => l.code), third.items.map((l) => l.code)]).toEqual([8, ['AUS', 'AVL', 'BOI'], ['PDX', 'PHX']]);
    const byName = (await agents.owner.get('/api/locations/settings').query({ q: 'port' })).body as Page<LocationSettings>;
    expect(byName.items.map((l) => l.code)).toEqual(['PDX']);
    const byCode = (await agents.owner.get('/api/locations/settings').query({ q: 'b' })).body as Page<LocationSettings>;
    expect(byCode.items.map((l) => l.code)).toEqual(['BOI', 'BTV']);
    const east = (await agents.owner.get('/api/locations/settings').query({ regionId: ids.region('EAST') })).body as Page<LocationSettings>;
    expect(east.items.map((l) => l.code)).toEqual(['AUS', 'AVL', 'BTV', 'DLH']);
    // A lead asking for another region finds nothing of it.
    expect((await agents.lead.get('/api/locations/settings').query({ regionId: ids.region('EAST') })).body.items).toEqual([]);
  });

  it('refuses a page above 200 rows and a parameter it does not take', async () => {
    const big = await agents.owner.get('/api/locations/settings').query({ pageSize: 201 });
    expect([big.status, big.body.error.fields]).toEqual([400, { pageSize: 'At most 200 rows per page' }]);
    const odd = await agents.owner.get('/api/locations/settings').query({ colour: 'red' });
    expect([odd.status, odd.body.error.fields]).toEqual([400, { colour: 'Unknown field' }]);
  });

  it('reads one location for those who see it and answers 404 to everyone else', async () => {
    const den = ids.location('DEN');
    const avl = ids.location('AVL');
    expect((await agents.regional.get(`/api/locations/${den}`)).body).toMatchObject({ code: 'DEN', claimApprovalLimitCents: 50_000 });
    expect((await agents.lead.get(`/api/locations/${den}`)).status).toBe(200);
    expect((await agents.regional.get(`/api/locations/${avl}`)).status).toBe(404);
    expect((await agents.lead.get(`/api/locations/${ids.location('BOI')}`)).status).toBe(404);
    expect((await agents.lead2.get(`/api/locations/${den}`)).status).toBe(404);
    expect((await agents.owner.get('/api/locations/99999')).status).toBe(404);
  });
});

describe('setting a location approval limit', () => {
  it('lets the owner set it, recorded in the audit log with the value before', async () => {
    const den = ids.location('DEN');
    const res = await agents.owner.patch(`/api/locations/${den}`).send({ claimApprovalLimitCents: 120_000 });
    expect(res.status).toBe(200);
    expect(res.body).toMatchObject({ id: den, code: 'DEN', claimApprovalLimitCents: 120_000 });
    expect(await limitOf('DEN')).toBe(120_000);
    expect((await agents.lead.get(`/api/locations/${den}`)).body.claimApprovalLimitCents).toBe(120_000);
    const audit = await auditOf(h.db, 'location', den);
    expect(audit.at(-1)).toMatchObject({ action: 'location.update', actorId: ids.user(SIGN_INS.owner), before: { claimApprovalLimitCents: 50_000 }, after: { claimApprovalLimitCents: 120_000 } });
  });

  it.each(['lead', 'regional', 'warranty', 'tech', 'accountant'] as const)('refuses %s with 403 at a location they see, changing nothing', async (who) => {
    const before = await limitOf('DEN');
    const res = await agents[who].patch(`/api/locations/${ids.location('DEN')}`).send({ claimApprovalLimitCents: 1 });
    expect([res.status, res.body.error.code]).toEqual([403, 'forbidden']);
    expect(await limitOf('DEN')).toBe(before);
  });

  it('answers 404 at a location the person does not see, changing nothing', async () => {
    const avl = ids.location('AVL');
    for (const who of ['regional', 'lead', 'warranty', 'tech'] as const) {
      expect([who, (await agents[who].patch(`/api/locations/${avl}`).send({ claimApprovalLimitCents: 1 })).status]).toEqual([who, 404]);
    }
    expect((await agents.lead2.patch(`/api/locations/${ids.location('DEN')}`).send({ claimApprovalLimitCents: 1 })).status).toBe(404);
    expect(await limitOf('AVL')).toBe(50_000);
    expect((await agents.owner.patch('/api/locations/99999').send({ claimApprovalLimitCents: 1 })).status).toBe(404);
  });

  it.each([
    [{ claimApprovalLimitCents: -1 }, { claimApprovalLimitCents: 'The limit cannot be negative' }],
    [{ claimApprovalLimitCents: 12.5 }, { claimApprovalLimitCents: 'Enter the limit in whole cents' }],
    [{ claimApprovalLimitCents: '50000' }, { claimApprovalLimitCents: 'Enter the limit in whole cents' }],
    [{ claimApprovalLimitCents: 100_000_001 }, { claimApprovalLimitCents: 'The limit can be at most $1,000,000' }],
    [{}, { claimApprovalLimitCents: 'Enter the limit in whole cents' }],
    [{ claimApprovalLimitCents: 100, name: 'Elsewhere' }, { name: 'Unknown field' }],
  ])('refuses %j with 400 naming the field, changing nothing', async (body, fields) => {
    const res = await agents.owner.patch(`/api/locations/${ids.location('BOI')}`).send(body);
    expect([res.status, res.body.error.fields]).toEqual([400, fields]);
    expect(await limitOf('BOI')).toBe(50_000);
  });

  it('accepts a limit of nothing and of exactly a million dollars', async () => {
    for (const cents of [0, 100_000_000]) {
      expect((await agents.owner.patch(`/api/locations/${ids.location('PHX')}`).send({ claimApprovalLimitCents: cents })).body.claimApprovalLimitCents).toBe(cents);
    }
  });
});
