import { COUNT_CAP, MAX_PAGE_SIZE, type AuditEntry } from '@busbar/shared';
import { sql } from 'kysely';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { startHarness, type Agent, type Harness } from '../support/api-harness.ts';
import { SIGN_INS } from '../support/staff-fixtures.ts';

let h: Harness;
let owner: Agent;

beforeAll(async () => {
  h = await startHarness();
  owner = await h.signedIn(SIGN_INS.owner);
});
afterAll(() => h.close());

/** Every list route, with what it needs besides paging and its largest page. */
const LISTS: [path: string, max: number][] = [
  ['/api/builds', MAX_PAGE_SIZE],
  ['/api/customers', MAX_PAGE_SIZE],
  ['/api/catalog', MAX_PAGE_SIZE],
  ['/api/vendors', MAX_PAGE_SIZE],
  ['/api/staff', MAX_PAGE_SIZE],
  ['/api/audit', MAX_PAGE_SIZE],
  ['/api/outbox', MAX_PAGE_SIZE],
  ['/api/plans', MAX_PAGE_SIZE],
  ['/api/serials?q=KST', 100],
  ['/api/claims', 100],
  ['/api/locations/settings', MAX_PAGE_SIZE],
  ['/api/locations/technicians', MAX_PAGE_SIZE],
];
const withPageSize = (path: string, size: number) => `${path}${path.includes('?') ? '&' : '?'}pageSize=${size}`;

describe('every list is paged', () => {
  it.each(LISTS)('%s refuses a page larger than %i rows, naming the limit', async (path, max) => {
    const res = await owner.get(withPageSize(path, max + 1));
    expect(res.status).toBe(400);
    expect(res.body.error).toEqual({ code: 'invalid', message: 'Some fields need attention', fields: { pageSize: `At most ${max} rows per page` } });
  });

  it.each(LISTS)('%s answers its largest page, and says how many rows match', async (path, max) => {
    const res = await owner.get(withPageSize(path, max));
    expect(res.status).toBe(200);
    expect(res.body).toMatchObject({ page: 1, pageSize: max, totalCapped: false });
    expect(res.body.items.length).toBeLessThanOrEqual(max);
    expect(res.body.total).toBeGreaterThanOrEqual(res.body.items.length);
  });

  it('answers regions and locations whole: they take no paging', async () => {
    for (const path of ['/api/regions', '/api/locations']) {
      const res = await owner.get(`${path}?pageSize=10`);
      expect([res.status, res.body.error.fields]).toEqual([400, { pageSize: 'Unknown field' }]);
    }
  });
});

describe('a list past its count cap', () => {
  const extra = COUNT_CAP + 25;
  let newest: AuditEntry[];

  beforeAll(async () => {
    await sql`with recursive n(i) as (select 1 union all select i + 1 from n where i < ${extra})
      insert into audit_log (at, actor_id, action, entity, entity_id) select '2026-06-01T00:00:00.000Z', null, 'test.fill', 'filler', i from n`.execute(h.db);
    newest = (await owner.get('/api/audit?entity=filler&pageSize=200')).body.items;
  });

  it('counts up to the cap and says there are more', async () => {
    const res = await owner.get('/api/audit?entity=filler&pageSize=10');
    expect(res.body).toMatchObject({ total: COUNT_CAP, totalCapped: true, page: 1, pageSize: 10 });
    expect(res.body.items.map((e: AuditEntry) => e.entityId)).toEqual(Array.from({ length: 10 }, (_, i) => extra - i));
  });

  it('refuses page numbers past the cap, and reads on by cursor instead', async () => {
    const deep = await owner.get(`/api/audit?entity=filler&pageSize=100&page=${COUNT_CAP / 100 + 1}`);
    expect(deep.status).toBe(400);
    expect(deep.body.error.fields.page).toMatch(/nextCursor/);
    let cursor: string | null = null;
    const seen: number[] = [];
    for (let page = 0; page < COUNT_CAP / 200 + 1; page++) {
      const res = await owner.get('/api/audit').query({ entity: 'filler', pageSize: 200, ...(cursor ? { cursor } : {}) });
      expect(res.status).toBe(200);
      seen.push(...res.body.items.map((e: AuditEntry) => e.entityId));
      cursor = res.body.nextCursor;
    }
    expect(seen).toEqual(Array.from({ length: extra }, (_, i) => extra - i));
    expect(cursor).toBeNull();
  });

  it('gives the same rows by cursor as by page number', async () => {
    const first = await owner.get('/api/audit?entity=filler&pageSize=100');
    const second = await owner.get('/api/audit').query({ entity: 'filler', pageSize: 100, cursor: first.body.nextCursor });
    expect([...first.body.items, ...second.body.items]).toEqual(newest);
  });

  it('refuses a cursor it did not give out', async () => {
    const res = await owner.get('/api/audit?entity=filler&cursor=not-a-cursor');
    expect([res.status, res.body.error.fields]).toEqual([400, { cursor: 'This cursor is not one a list gave out' }]);
  });
});
