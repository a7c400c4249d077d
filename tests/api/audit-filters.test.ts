import { COUNT_CAP, type AuditEntry, type Page } from '@busbar/shared';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { demoIds, startHarness, type Agent, type Harness } from '../support/api-harness.ts';
import { auditDemoStatuses } from '../support/audit-fixtures.ts';
import { SIGN_INS } from '../support/staff-fixtures.ts';

/** The audit log's filters on the demo's two years of history, against a plain scan of the table. */
let h: Harness;
let owner: Agent;
let rows: { id: number; at: string; actorId: number | null; entity: string; entityId: number | null }[];
let lead: number;
let build: { id: number; number: string };

beforeAll(async () => {
  h = await startHarness({}, true, { history: true });
  owner = await h.signedIn(SIGN_INS.owner);
  lead = (await demoIds(h.db)).user(SIGN_INS.lead);
  expect(await auditDemoStatuses(h.db)).toBeGreaterThan(10_000);
  rows = await h.db.selectFrom('auditLog').select(['id', 'at', 'actorId', 'entity', 'entityId']).execute();
  // A build with a long trail: the one with the most rows.
  const counts = new Map<number, number>();
  for (const r of rows) if (r.entity === 'build') counts.set(r.entityId!, (counts.get(r.entityId!) ?? 0) + 1);
  const [busiest] = [...counts].sort((a, b) => b[1] - a[1])[0]!;
  build = await h.db.selectFrom('builds').select(['id', 'number']).where('id', '=', busiest).executeTakeFirstOrThrow();
}, 120_000);
afterAll(() => h.close());

/** Every page of a filter, read by cursor, up to `pages`. */
async function read(query: Record<string, string | number>, pages = 3) {
  const first = await owner.get('/api/audit').query({ ...query, pageSize: 200 });
  expect(first.status, JSON.stringify(first.body)).toBe(200);
  const answers: Page<AuditEntry>[] = [first.body];
  while (answers.length < pages && answers.at(-1)!.nextCursor) {
    answers.push((await owner.get('/api/audit').query({ ...query, pageSize: 200, cursor: answers.at(-1)!.nextCursor! })).body);
  }
  return { ids: answers.flatMap((a) => a.items.map((e) => e.id)), total: first.body.total, capped: first.body.totalCapped, items: answers.flatMap((a) => a.items) };
}

const newestFirst = (a: { at: string; id: number }, b: { at: string; id: number }) => b.at.localeCompare(a.at) || b.id - a.id;

describe('audit log filters on the demo history', () => {
  const from = '2025-09-01T00:00:00-06:00';
  const to = '2025-12-01T00:00:00-07:00';
  const inRange = (at: string) => at >= new Date(from).toISOString() && at < new Date(to).toISOString();
  const cases: [string, () => Record<string, string | number>, (r: (typeof rows)[number]) => boolean][] = [
    ['everything', () => ({}), () => true],
    ['one person', () => ({ actorId: lead }), (r) => r.actorId === lead],
    ['one kind of record', () => ({ entity: 'build' }), (r) => r.entity === 'build'],
    ['one build by its number', () => ({ buildNumber: build.number.toLowerCase() }), (r) => r.entity === 'build' && r.entityId === build.id],
    ['a time range', () => ({ from, to }), (r) => inRange(r.at)],
    ['a person in a time range', () => ({ actorId: lead, from, to }), (r) => r.actorId === lead && inRange(r.at)],
    ['a kind of record in a time range', () => ({ entity: 'build', from, to }), (r) => r.entity === 'build' && inRange(r.at)],
    ['a person and a kind of record', () => ({ actorId: lead, entity: 'build' }), (r) => r.actorId === lead && r.entity === 'build'],
  ];

  it.each(cases)('finds the same rows as a scan of the table, newest first: %s', async (_name, query, keep) => {
    const expected = rows.filter(keep).sort(newestFirst);
    expect(expected.length).toBeGreaterThan(0);
    const answer = await read(query());
    expect(answer.ids).toEqual(expected.slice(0, 600).map((r) => r.id));
    expect([answer.total, answer.capped]).toEqual([Math.min(expected.length, COUNT_CAP), expected.length > COUNT_CAP]);
  });

  it("says a build's rows in words with its number", async () => {
    const { items } = await read({ buildNumber: build.number }, 1);
    expect(new Set(items.map((e) => e.record))).toEqual(new Set([`Build ${build.number}`]));
    expect(items.some((e) => e.summary.startsWith(`Build ${build.number}: `))).toBe(true);
  });

  it('refuses an unknown build number and a malformed time in words', async () => {
    const unknown = await owner.get('/api/audit').query({ buildNumber: 'DEN-99999' });
    expect([unknown.status, unknown.body.error.fields]).toEqual([400, { buildNumber: 'No build numbered DEN-99999 at the shops you see' }]);
    const bad = await owner.get('/api/audit').query({ from: 'last tuesday' });
    expect(bad.status).toBe(400);
    expect(bad.body.error.fields.from).toBe('Use a date like 2026-06-15 or a time like 2026-06-15T06:00:00Z');
  });
});
