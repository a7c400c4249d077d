import request from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { demoIds, startHarness, type Harness } from '../support/api-harness.ts';
import { freshEmail, SIGN_INS, type SignIn } from '../support/staff-fixtures.ts';

/** What each sign-in may see: region codes and location codes, in name order. */
const SEES: Record<SignIn, { regions: string[]; locations: string[] }> = {
  owner: { regions: ['EAST', 'WEST'], locations: ['AVL', 'AUS', 'BOI', 'BTV', 'DEN', 'DLH', 'PHX', 'PDX'] },
  regional: { regions: ['WEST'], locations: ['BOI', 'DEN', 'PHX', 'PDX'] },
  lead: { regions: [], locations: ['DEN'] },
  tech: { regions: [], locations: ['DEN'] },
  warranty: { regions: [], locations: ['DEN'] },
  accountant: { regions: ['EAST', 'WEST'], locations: ['AVL', 'AUS', 'BOI', 'BTV', 'DEN', 'DLH', 'PHX', 'PDX'] },
  lead2: { regions: [], locations: ['AVL'] },
};

describe('health, regions, locations and the outbox', () => {
  let h: Harness;
  beforeAll(async () => {
    h = await startHarness();
  });
  afterAll(() => h.close());

  it('reports health without a session', async () => {
    const res = await request(h.app).get('/api/health');
    expect(res.status).toBe(200);
    expect(res.body).toEqual({ status: 'ok', database: 'ok', version: '0.1.0' });
  });

  it.each(Object.keys(SEES) as SignIn[])('lists only the regions and locations %s may see', async (signIn) => {
    const agent = await h.signedIn(SIGN_INS[signIn]);
    const regions = await agent.get('/api/regions');
    const locations = await agent.get('/api/locations');
    expect(regions.status).toBe(200);
    expect(locations.status).toBe(200);
    expect({ regions: regions.body.map((r: { code: string }) => r.code), locations: locations.body.map((l: { code: string }) => l.code) }).toEqual(
      SEES[signIn],
    );
  });

  it('answers 401 to signed-out requests for lists and staff', async () => {
    for (const path of ['/api/regions', '/api/locations', '/api/staff', '/api/audit', '/api/outbox']) {
      const res = await request(h.app).get(path);
      expect([path, res.status, res.body.error.code]).toEqual([path, 401, 'unauthenticated']);
    }
  });

  it('shows the owner every e-mail sent, and nobody else', async () => {
    const email = freshEmail('outbox');
    const lead = await h.signedIn(SIGN_INS.lead);
    const locationId = (await demoIds(h.db)).location('DEN');
    expect((await lead.post('/api/staff/invites').send({ email, name: 'Otto Box', role: 'technician', locationId })).status).toBe(201);

    const outbox = await (await h.signedIn(SIGN_INS.owner)).get('/api/outbox');
    expect(outbox.status).toBe(200);
    expect(outbox.body).toMatchObject({ total: 1, page: 1, pageSize: 50 });
    expect(outbox.body.items[0]).toMatchObject({ to: email, subject: 'Your Busbar invitation', status: 'sent', error: null, sentAt: '2026-06-15T15:00:00.000Z' });
    expect(outbox.body.items[0].text).toContain('Hello Otto Box,');

    for (const signIn of ['regional', 'lead', 'tech', 'warranty', 'accountant', 'lead2'] as const) {
      const res = await (await h.signedIn(SIGN_INS[signIn])).get('/api/outbox');
      expect([signIn, res.status, res.body.error?.code]).toEqual([signIn, 403, 'forbidden']);
    }
  });

  it('answers 404 to an API route that does not exist', async () => {
    const res = await (await h.signedIn(SIGN_INS.owner)).get('/api/nowhere');
    expect(res.status).toBe(404);
    expect(res.body).toEqual({ error: { code: 'not_found', message: 'No such API route' } });
  });
});

describe('list routes without parameters', () => {
  it('refuse a query parameter they do not take, naming it', async () => {
    const h = await startHarness();
    try {
      const owner = await h.signedIn(SIGN_INS.owner);
      for (const path of ['/api/regions?colour=red', '/api/locations?colour=red']) {
        const res = await owner.get(path);
        expect(res.status).toBe(400);
        expect(res.body.error.fields).toEqual({ colour: 'Unknown field' });
      }
    } finally {
      await h.close();
    }
  });
});
