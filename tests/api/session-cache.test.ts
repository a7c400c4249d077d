import { join } from 'node:path';
import { openDatabase, type Db } from '@busbar/db';
import { afterEach, beforeEach, describe, expect, it } from 'vitest';
import { createBuild } from '../support/build-fixtures.ts';
import { demoIds, startHarness, type Agent, type Harness } from '../support/api-harness.ts';
import { SIGN_INS } from '../support/staff-fixtures.ts';

let h: Harness;
beforeEach(async () => {
  h = await startHarness();
});
afterEach(() => h.close());

const hours = (n: number) => new Date(Date.parse('2026-06-15T15:00:00Z') + n * 3_600_000);
const storedExpiry = async (email: string) => {
  const row = await h.db.selectFrom('sessions as s').innerJoin('users as u', 'u.id', 's.userId').select('s.expiresAt').where('u.email', '=', email).executeTakeFirstOrThrow();
  return row.expiresAt;
};
const generation = async () => (await h.db.selectFrom('accessChanges').select('generation').executeTakeFirstOrThrow()).generation;
/** A write on a second connection to the same file, as another app process or a script makes it. */
async function withOtherConnection(write: (db: Db) => Promise<unknown>): Promise<void> {
  const db = openDatabase(join(h.dataDir, 'busbar.sqlite'));
  await write(db);
  await db.destroy();
}
const assignmentOf = async (agent: Agent) => (await agent.get('/api/session')).body.assignments as { id: number; role: string; locationCode: string }[];

describe('abilities kept per signed-in person', () => {
  it('keeps the person while no one’s access changes, and shows a change written by any connection at the next request', async () => {
    const ids = await demoIds(h.db);
    const lead = await h.signedIn(SIGN_INS.lead2);
    expect((await lead.get('/api/session')).body.person.name).toBe('Rosalind Achebe');
    // Everyday work and a password made again change no one's access: kept abilities stay valid.
    const before = await generation();
    expect((await lead.post('/api/customers').send({ locationId: ids.location('AVL'), name: 'Kept Cache', email: 'kept.cache@example.test' })).status).toBe(201);
    await h.db.updateTable('users').set({ passwordHash: 'made-again' }).where('email', '=', SIGN_INS.tech).execute();
    expect(await generation()).toBe(before);

    // Written around the app, on a connection of its own, as another app process would.
    await withOtherConnection((db) => db.updateTable('users').set({ name: 'Rosalind A. Achebe' }).where('email', '=', SIGN_INS.lead2).execute());
    expect((await lead.get('/api/session')).body.person.name).toBe('Rosalind A. Achebe');

    const owner = await h.signedIn(SIGN_INS.owner);
    const granted = await owner.post(`/api/staff/${ids.user(SIGN_INS.lead2)}/roles`).send({ role: 'technician', locationId: ids.location('DEN') });
    expect(granted.status).toBe(201);
    const session = (await lead.get('/api/session')).body;
    expect(session.assignments.map((a: { role: string; locationCode: string }) => `${a.role}@${a.locationCode}`).sort()).toEqual(['location_lead@AVL', 'technician@DEN']);
  });

  it('takes away a role removed on another connection, and gives a regional manager a location added there, at the next request', async () => {
    const ids = await demoIds(h.db);
    const lead = await h.signedIn(SIGN_INS.lead2);
    expect((await lead.get(`/api/locations/${ids.location('AVL')}`)).status).toBe(200);
    await withOtherConnection((db) => db.deleteFrom('roleAssignments').where('userId', '=', ids.user(SIGN_INS.lead2)).execute());
    expect(await assignmentOf(lead)).toEqual([]);
    expect((await lead.get(`/api/locations/${ids.location('AVL')}`)).status).toBe(404);

    const regional = await h.signedIn(SIGN_INS.regional);
    const seen = async () => ((await regional.get('/api/locations')).body as { code: string }[]).map((l) => l.code);
    const { regionId } = await h.db.selectFrom('locations').select('regionId').where('id', '=', ids.location('DEN')).executeTakeFirstOrThrow();
    expect(await seen()).not.toContain('NEW');
    await withOtherConnection((db) =>
      db.insertInto('locations').values({ regionId, code: 'NEW', name: 'Newtown', timeZone: 'America/Denver', laborRateCents: 12000 }).execute(),
    );
    expect(await seen()).toContain('NEW');
  });

  it('takes a removed role away from the person on their very next request', async () => {
    const ids = await demoIds(h.db);
    const lead = await h.signedIn(SIGN_INS.lead2);
    const build = await createBuild(h.db, lead, ids.location('AVL'));
    expect((await lead.get(`/api/builds/${build.id}`)).status).toBe(200);
    const listed = async () => ((await lead.get('/api/builds')).body.items as { id: number }[]).map((b) => b.id);
    expect(await listed()).toContain(build.id);

    const owner = await h.signedIn(SIGN_INS.owner);
    const [role] = await assignmentOf(lead);
    const removed = await owner.delete(`/api/staff/${ids.user(SIGN_INS.lead2)}/roles/${role!.id}`);
    expect(removed.status).toBe(200);

    expect(await assignmentOf(lead)).toEqual([]);
    expect((await lead.get(`/api/builds/${build.id}`)).status).toBe(404);
    expect(await listed()).toEqual([]);
  });

  it('ends the session of a deactivated person on their next request, and a reactivated one signs in again', async () => {
    const ids = await demoIds(h.db);
    const tech = await h.signedIn(SIGN_INS.tech);
    expect((await tech.get('/api/session')).status).toBe(200);
    const owner = await h.signedIn(SIGN_INS.owner);
    expect((await owner.post(`/api/staff/${ids.user(SIGN_INS.tech)}/deactivate`)).status).toBe(200);
    expect((await tech.get('/api/session')).status).toBe(401);
    expect((await owner.post(`/api/staff/${ids.user(SIGN_INS.tech)}/reactivate`)).status).toBe(200);
    const again = await h.signedIn(SIGN_INS.tech);
    expect((await again.get('/api/session')).body.person.email).toBe(SIGN_INS.tech);
  });
});

describe('session expiry', () => {
  it('rewrites the stored expiry only once less than half of the 12 hours is left', async () => {
    const tech = await h.signedIn(SIGN_INS.tech);
    const atSignIn = await storedExpiry(SIGN_INS.tech);
    expect(atSignIn).toBe(hours(12).toISOString());
    h.clock.now = hours(1);
    expect((await tech.get('/api/session')).status).toBe(200);
    h.clock.now = hours(5.5);
    expect((await tech.get('/api/builds')).status).toBe(200);
    expect(await storedExpiry(SIGN_INS.tech)).toBe(atSignIn);
    h.clock.now = hours(7);
    expect((await tech.get('/api/session')).status).toBe(200);
    expect(await storedExpiry(SIGN_INS.tech)).toBe(hours(19).toISOString());
  });

  it('keeps a session alive for days while it is used every few hours, and ends it after 12 idle hours', async () => {
    const tech = await h.signedIn(SIGN_INS.tech);
    for (let at = 4; at <= 72; at += 4) {
      h.clock.now = hours(at);
      expect((await tech.get('/api/session')).status).toBe(200);
    }
    h.clock.now = hours(72 + 12.01);
    expect((await tech.get('/api/session')).status).toBe(401);
  });
});
