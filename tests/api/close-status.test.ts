import type { CloseStatus } from '@busbar/shared';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { demoIds, startHarness, type Harness } from '../support/api-harness.ts';
import { addPerson, SIGN_INS } from '../support/staff-fixtures.ts';

/**
 * The demo's eight shops with months marked final through the API on June 15, 2026: Denver
 * January and February, Boise May; the others none. Each cell below was worked out by hand.
 */
let h: Harness;
let ids: Awaited<ReturnType<typeof demoIds>>;

beforeAll(async () => {
  h = await startHarness();
  ids = await demoIds(h.db);
  const accountant = await h.signedIn(SIGN_INS.accountant);
  for (const [code, month] of [['DEN', '2026-01'], ['DEN', '2026-02'], ['BOI', '2026-05']] as const) {
    await accountant.post(`/api/closes/${ids.location(code)}/${month}/final`).expect(201);
  }
}, 60_000);
afterAll(() => h.close());

const ask = async (email: string, query: string) => (await h.signedIn(email)).get(`/api/closes/status?${query}`);
const cellsOf = (answer: CloseStatus, code: string) => answer.locations.find((l) => l.locationId === ids.location(code))?.cells;

describe('the close status of months', () => {
  it('says where each shop stands with each month, as worked out by hand', async () => {
    const res = await ask(SIGN_INS.accountant, 'from=2025-12&to=2026-07');
    expect(res.status).toBe(200);
    const answer = res.body as CloseStatus;
    expect(answer.months).toEqual(['2025-12', '2026-01', '2026-02', '2026-03', '2026-04', '2026-05', '2026-06', '2026-07']);
    // Shops in the order of their codes.
    expect(answer.locations.map((l) => l.locationId)).toEqual(['AUS', 'AVL', 'BOI', 'BTV', 'DEN', 'DLH', 'PDX', 'PHX'].map(ids.location));
    // December stays open for good: Denver's closes began in January. March follows February.
    expect(cellsOf(answer, 'DEN')).toEqual(['open', 'final', 'final', 'next', 'open', 'open', 'running', 'running']);
    // Boise's next is June, still running; the months before its first final one stay open.
    expect(cellsOf(answer, 'BOI')).toEqual(['open', 'open', 'open', 'open', 'open', 'final', 'running', 'running']);
    // No month final yet: any ended month can be Portland's first.
    expect(cellsOf(answer, 'PDX')).toEqual(['next', 'next', 'next', 'next', 'next', 'next', 'running', 'running']);
  });

  it('cuts a month’s end in each shop’s own time zone', async () => {
    // 05:00 UTC on July 1: 01:00 in Asheville (New York time), still 23:00 on June 30 in Denver.
    h.clock.now = new Date('2026-07-01T05:00:00Z');
    try {
      const answer = (await ask(SIGN_INS.owner, 'from=2026-06&to=2026-06')).body as CloseStatus;
      expect([cellsOf(answer, 'AVL'), cellsOf(answer, 'DEN'), cellsOf(answer, 'BOI')]).toEqual([['next'], ['running'], ['running']]);
      h.clock.now = new Date('2026-07-01T07:00:00Z');
      const later = (await ask(SIGN_INS.owner, 'from=2026-06&to=2026-06')).body as CloseStatus;
      // 01:00 in Denver and Boise: June has ended, and is Boise's next; Denver's next is still March.
      expect([cellsOf(later, 'DEN'), cellsOf(later, 'BOI')]).toEqual([['open'], ['next']]);
    } finally {
      h.clock.now = new Date('2026-06-15T15:00:00Z');
    }
  });

  it('keeps to a shop or region asked for', async () => {
    const west = ids.region('WEST');
    const region = (await ask(SIGN_INS.owner, `from=2026-01&to=2026-02&regionId=${west}`)).body as CloseStatus;
    expect(region.locations.map((l) => l.locationId).sort()).toEqual(ids.locations.filter((l) => l.regionId === west).map((l) => l.id).sort());
    const one = (await ask(SIGN_INS.owner, `from=2026-01&to=2026-02&locationId=${ids.location('DEN')}`)).body as CloseStatus;
    expect(one.locations).toEqual([{ locationId: ids.location('DEN'), cells: ['final', 'final'] }]);
  });
});

describe('who sees the close status', () => {
  it('shows a regional accountant only the shops of its region, and refuses a shop outside it', async () => {
    const east = ids.region('EAST');
    const person = await addPerson(h.db, { role: 'accountant', regionId: east });
    const { passwordHash } = await h.db.selectFrom('users').select('passwordHash').where('email', '=', SIGN_INS.accountant).executeTakeFirstOrThrow();
    await h.db.updateTable('users').set({ passwordHash }).where('id', '=', person.id).execute();
    const answer = (await ask(person.email, 'from=2026-01&to=2026-03')).body as CloseStatus;
    expect(answer.locations.map((l) => l.locationId)).toEqual(['AUS', 'AVL', 'BTV', 'DLH'].map(ids.location));
    for (const query of [`locationId=${ids.location('DEN')}`, `regionId=${ids.region('WEST')}`]) {
      const refused = await ask(person.email, `from=2026-01&to=2026-03&${query}`);
      expect([refused.status, refused.body.error.message]).toEqual([403, 'You cannot close the months of that shop or region']);
    }
  });

  it('refuses the people who do not close months, in words', async () => {
    for (const who of [SIGN_INS.regional, SIGN_INS.lead, SIGN_INS.tech, SIGN_INS.warranty]) {
      const res = await ask(who, 'from=2026-01&to=2026-03');
      expect([res.status, res.body.error.message], who).toEqual([403, 'Only the accountant and the network owner close months']);
    }
    expect((await (await h.agent()).get('/api/closes/status?from=2026-01&to=2026-03')).status).toBe(401);
  });
});

describe('asking for the close status wrongly', () => {
  it('answers each mistake on its field, in words', async () => {
    const fieldsOf = async (query: string) => {
      const res = await ask(SIGN_INS.accountant, query);
      expect(res.status, query).toBe(400);
      return res.body.error.fields as Record<string, string>;
    };
    expect(await fieldsOf('from=2026-03&to=2026-02')).toEqual({ to: 'Pick a last month on or after the first' });
    // January 2024 to January 2026 is 25 months; to December 2025 is 24, the most.
    expect(await fieldsOf('from=2024-01&to=2026-01')).toEqual({ to: 'Pick at most 24 months' });
    expect((await ask(SIGN_INS.accountant, 'from=2024-01&to=2025-12')).body.months).toHaveLength(24);
    expect(await fieldsOf('from=2026-1&to=2026-03')).toEqual({ from: 'Use a month like 2026-03' });
    expect(await fieldsOf('from=2026-01')).toMatchObject({ to: expect.any(String) });
    expect(await fieldsOf('from=2026-01&to=2026-03&month=2026-01')).toEqual({ month: 'Unknown field' });
  });
});
