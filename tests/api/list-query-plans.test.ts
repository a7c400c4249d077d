import type { Db } from '@busbar/db';
import { auditQuery, buildQuery, customerQuery, quickPlanQuery, serialQuery } from '@busbar/shared';
import { sql } from 'kysely';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { LocationScope } from '../../apps/api/src/access/locations.ts';
import { listAudit } from '../../apps/api/src/queries/audit.ts';
import { checkImport } from '../../apps/api/src/imports/check-rows.ts';
import { buildHistory, serialHolder } from '../../apps/api/src/queries/build-changes.ts';
import { listBuilds } from '../../apps/api/src/queries/builds.ts';
import { listCustomers } from '../../apps/api/src/queries/customers.ts';
import { listQuickPlans } from '../../apps/api/src/queries/plans.ts';
import { findSerials } from '../../apps/api/src/queries/serials.ts';
import { demoIds, startHarness, type Harness } from '../support/api-harness.ts';
import { auditDemoStatuses } from '../support/audit-fixtures.ts';
import { plansOf } from '../support/query-plans.ts';
import { SIGN_INS } from '../support/staff-fixtures.ts';

/**
 * SQLite's plan for every list query, on the demo network with statistics gathered: builds,
 * build lines and customers are read through an index, never row by row through the table.
 */
let h: Harness;
let den: number;
let lead: number;

beforeAll(async () => {
  h = await startHarness({}, true, { history: true });
  den = (await demoIds(h.db)).location('DEN');
  lead = (await demoIds(h.db)).user(SIGN_INS.lead);
  await auditDemoStatuses(h.db);
  await sql`pragma optimize = 0x10002`.execute(h.db);
}, 60_000);
afterAll(() => h.close());

/**
 * Statements that read a big table whole: row by row through the table, or through an index
 * that is then sorted (a walk in the index's own order stops at the page's LIMIT).
 */
const tableScans = (plans: string[][]) =>
  plans.flatMap((lines) => {
    const scans = lines.filter((line) => /^SCAN (b|i|c|customers)\b/.test(line));
    const sorted = lines.some((line) => line.startsWith('USE TEMP B-TREE FOR ORDER BY'));
    return scans.filter((line) => sorted || !/USING (COVERING )?INDEX/.test(line));
  });

const BUILD_LISTS: Record<string, Record<string, unknown>> = {
  'first page': {},
  'one status': { status: 'delivered' },
  'two statuses': { status: ['booked', 'in_bay'] },
  'by number': { sort: 'number', order: 'asc' },
  'by booked date': { sort: 'bookedFor' },
  'by total': { sort: 'totalCents' },
  'booked in a month': { from: '2025-03-01', to: '2025-03-31', sort: 'bookedFor' },
  'delivered in a month': { status: 'delivered', deliveredFrom: '2025-03-01', deliveredTo: '2025-03-31' },
  'delivered in a month, by day': { status: 'delivered', deliveredFrom: '2025-03-01', deliveredTo: '2025-03-31', sort: 'deliveredOn' },
  'a deep page': { page: '40' },
  'text search': { q: 'Marrow' },
};

describe('list query plans', () => {
  for (const [who, scope] of [['the owner', 'all'], ['a lead', 'den']] as const) {
    it.each(Object.entries(BUILD_LISTS))(`reads builds for ${who} through indexes: %s`, async (_name, query) => {
      const plans = await plansOf(h.db, (db) => listBuilds(db, scope === 'all' ? 'all' : [den], buildQuery.parse(query)));
      expect(plans.flat().some((line) => /USING (COVERING )?INDEX|USING INTEGER PRIMARY KEY|VIRTUAL TABLE/.test(line))).toBe(true);
      expect(tableScans(plans)).toEqual([]);
      // Each row's build lines (the serial numbers still to record) are read by the build, never
      // through the serial-number index, where "no serial yet" holds for most lines of the network.
      const lineReads = plans.flat().filter((line) => /^(SEARCH|SCAN) i\b/.test(line));
      if (_name === 'first page') expect(lineReads.length).toBeGreaterThan(0);
      for (const line of lineReads) expect(line).toMatch(/USING (COVERING )?INDEX build_items_build \(build_id=\?\)/);
    });

    it(`reads serial numbers, customers and quick plans for ${who} through indexes`, async () => {
      const at: LocationScope = scope === 'all' ? 'all' : [den];
      for (const run of [
        (db: Db) => findSerials(db, at, serialQuery.parse({ q: 'KST' })),
        (db: Db) => listCustomers(db, { ...customerQuery.parse({}), scope: at, emailScope: at, phoneScope: at }),
        (db: Db) => listCustomers(db, { ...customerQuery.parse({ q: 'Marrow' }), scope: at, emailScope: at, phoneScope: at }),
        (db: Db) => listQuickPlans(db, at, quickPlanQuery.parse({})),
      ]) {
        expect(tableScans(await plansOf(h.db, run))).toEqual([]);
      }
    });
  }

  it.each(['totalCents', 'bookedFor', 'number', 'updatedAt'])('reads one status sorted by %s straight from an index that seeks to the status, with no sort of every row', async (sort) => {
    for (const scope of ['all', [den]] as const) {
      const plans = await plansOf(h.db, (db) => listBuilds(db, scope === 'all' ? 'all' : [...scope], buildQuery.parse({ status: 'delivered', sort })));
      expect(plans.flat().filter((line) => line.includes('TEMP B-TREE'))).toEqual([]);
      // The count comes from the kept counts (migration 061), the page's ids from the index.
      expect(plans[0]!.join('\n')).toMatch(/^(SEARCH|SCAN) build_counts\b/);
      const seek = scope === 'all' ? 'status=?' : 'location_id=? AND status=?';
      expect(plans[1]!.some((line) => line.includes(`INDEX`) && line.includes(`(${seek})`)), plans[1]!.join('\n')).toBe(true);
    }
  });

  it("reads a span of deliveries by delivery day from the days' index alone and in its order, a lead's and (with a network's statistics) the owner's", async () => {
    const byDay = buildQuery.parse(BUILD_LISTS['delivered in a month, by day']);
    // Sorts, and reads of builds' rows but the page's own (by id): none, the count and the page's ids come from the index.
    const extraReads = async (scope: LocationScope) =>
      (await plansOf(h.db, (db) => listBuilds(db, scope, byDay))).flat().filter((line) => line.includes('TEMP B-TREE') || (/^SEARCH b /.test(line) && !/COVERING INDEX|INTEGER PRIMARY KEY/.test(line)));
    expect(await extraReads([den])).toEqual([]);
    // The demo's 8 shops make a skip over each shop's days look cheap to SQLite, and a month of the
    // demo is sorted in no time. A network's statistics, as ANALYZE gathered them on 200 shops over
    // five years, make it read the days' index in its order, as it does there.
    await sql`savepoint network`.execute(h.db);
    try {
      await sql`update sqlite_stat1 set stat = '902226 4512 4 1 1' where idx = 'builds_location_delivered'`.execute(h.db);
      await sql`update sqlite_stat1 set stat = '902226 579 1 1' where idx = 'builds_delivered_on'`.execute(h.db);
      await sql`analyze sqlite_schema`.execute(h.db);
      expect(await extraReads('all')).toEqual([]);
    } finally {
      await sql`rollback to network`.execute(h.db);
      await sql`release network`.execute(h.db);
      await sql`analyze sqlite_schema`.execute(h.db);
    }
  });

  it("reads builds delivered in a span of days through the delivery days' indexes (a shop's, for a lead), even with sampled statistics that make a status look rare", async () => {
    const delivered = buildQuery.parse(BUILD_LISTS['delivered in a month']);
    const statusSeeks = async () =>
      [...(await plansOf(h.db, (db) => listBuilds(db, 'all', delivered))), ...(await plansOf(h.db, (db) => listBuilds(db, [den], delivered)))].flat().filter((line) => /INDEX builds_(location_)?status_\w+ \(/.test(line));
    // PRAGMA optimize's ANALYZE reads a few rows of each index (analysis_limit): a status then looks
    // as rare as the rows read, though "delivered" is most builds. Gathered so here, then taken back.
    await sql`savepoint sampled`.execute(h.db);
    try {
      await sql`pragma analysis_limit = 20`.execute(h.db);
      await sql`analyze builds`.execute(h.db);
      const { stat } = await h.db.selectFrom(sql<{ idx: string; stat: string }>`sqlite_stat1`.as('s')).select('stat').where('idx', '=', 'builds_status_total').executeTakeFirstOrThrow();
      expect(Number(stat.split(' ')[1])).toBeLessThan(100);
      expect(await statusSeeks()).toEqual([]);
      // The page, its count and its ids all through the span of days (a lead's: the shop's days); then the page's rows by id.
      for (const [scope, seek] of [['all', 'builds_delivered_on (delivered_on>? AND delivered_on<?)'], [[den], 'builds_location_delivered (location_id=? AND delivered_on>? AND delivered_on<?)']] as const) {
        const plans = (await plansOf(h.db, (db) => listBuilds(db, scope === 'all' ? scope : [...scope], delivered))).flat();
        const walks = plans.filter((line) => /^(SEARCH|SCAN) b\b/.test(line) && !line.includes('INTEGER PRIMARY KEY'));
        expect(walks.length).toBeGreaterThan(0);
        expect(walks.every((line) => line === `SEARCH b USING INDEX ${seek}` || line === `SEARCH b USING COVERING INDEX ${seek}`), plans.join('\n')).toBe(true);
      }
    } finally {
      await sql`rollback to sampled`.execute(h.db);
      await sql`release sampled`.execute(h.db);
      await sql`pragma analysis_limit = 0`.execute(h.db);
      await sql`analyze sqlite_schema`.execute(h.db);
    }
  });

  it('reads the full-text index once for a searched list of builds or customers: the page and its count', async () => {
    for (const scope of ['all', [den]] as LocationScope[]) {
      for (const [list, run] of [
        ['builds', (db: Db) => listBuilds(db, scope, buildQuery.parse({ q: 'Marrow' }))],
        ['customers', (db: Db) => listCustomers(db, { ...customerQuery.parse({ q: 'Marrow' }), scope, emailScope: scope, phoneScope: scope })],
      ] as const) {
        const lines = (await plansOf(h.db, run)).flat();
        const reads = lines.filter((line) => /^SCAN s VIRTUAL TABLE/.test(line));
        expect(reads, lines.join('\n')).toHaveLength(1);
        // A shop's builds and customers: only its range of rowids of the per-shop index.
        if (scope !== 'all') expect(reads[0], list).toMatch(/:M\d+></);
      }
    }
  });

  it('finds any part of a serial number through the full-text index once, newest build first, with the numbers from the index of lines by build', async () => {
    const padded = [den, ...Array.from({ length: 20 }, (_, i) => 100_000 + i)];
    for (const scope of ['all', [den], padded] as LocationScope[]) {
      const plans = await plansOf(h.db, (db) => findSerials(db, scope, serialQuery.parse({ q: 'K24' })));
      const lines = plans.flat();
      // Build lines and builds are looked up by key, never walked (the serial-number index would be a walk of every line).
      expect(lines.filter((line) => /^SCAN (i|b|c)\b/.test(line)), lines.join('\n')).toEqual([]);
      // One read of the index gives both the list and its count.
      expect(lines.filter((line) => line.startsWith('SCAN s VIRTUAL TABLE'))).toHaveLength(1);
      // Nothing sorted in SQL: the matches are walked newest first and stop at the cap (the page's sort of those units is JavaScript's).
      expect(lines.filter((line) => line.includes('TEMP B-TREE'))).toEqual([]);
      // Each found build's serial numbers come from the index of lines by build, not from the lines' rows.
      expect(lines.filter((line) => line.includes('build_items_build'))).toEqual([expect.stringMatching(/^SEARCH i USING COVERING INDEX build_items_build \(build_id=\?\)$/)]);
      // A shop's search reads only its range of rowids of the per-shop index (the `>` and `<` bounds).
      if (scope !== 'all' && scope !== padded) expect(lines.find((line) => line.startsWith('SCAN s VIRTUAL TABLE'))).toMatch(/:M\d+></);
    }
  });

  it('checks a serial number for a second use through the unique (SKU, serial) index, with or without the SKU', async () => {
    const unit = await h.db.selectFrom('buildItems').select(['sku', 'serialNumber']).where('serialNumber', 'is not', null).limit(1).executeTakeFirstOrThrow();
    const one = await plansOf(h.db, (db) => serialHolder(db, unit.sku, unit.serialNumber!));
    expect(one.flat().filter((line) => /\bi\b/.test(line))).toEqual([expect.stringMatching(/^SEARCH i USING (COVERING )?INDEX build_items_serial \(sku=\? AND serial_number=\?\)$/)]);
    // An import's serial numbers, each looked for under any SKU.
    const csv = `customer_name,vehicle_year,vehicle_body_style,vehicle_make,vehicle_model,delivered_on,items\nPlan Check,2020,van,Alder,Trekker,2025-01-02,"${unit.sku} #${unit.serialNumber}"`;
    const imported = await plansOf(h.db, (db) => checkImport(db, { id: den, timeZone: 'America/Denver' }, csv, '2026-01-01T00:00:00.000Z'));
    expect(imported.flat().filter((line) => line.includes('build_items'))).toEqual(['SEARCH build_items USING COVERING INDEX build_items_serial (ANY(sku) AND serial_number=?)']);
  });

  it.each([
    ['the whole log', {}, 'SCAN a USING COVERING INDEX audit_log_at'],
    ['one kind of record', { entity: 'build' }, 'SEARCH a USING COVERING INDEX audit_log_entity_at (entity=?)'],
    ['one person', { actorId: 'lead' }, 'SEARCH a USING COVERING INDEX audit_log_actor_at (actor_id=?)'],
    ['one build by its number', { buildNumber: 'DEN-00001' }, 'SEARCH a USING COVERING INDEX audit_log_record_at (entity=? AND entity_id=?)'],
    ['a time range', { from: '2025-03-01', to: '2025-04-01' }, 'SEARCH a USING COVERING INDEX audit_log_at (at>? AND at<?)'],
    ['a person in a time range', { actorId: 'lead', from: '2025-03-01', to: '2025-04-01' }, 'SEARCH a USING COVERING INDEX audit_log_actor_at (actor_id=? AND at>? AND at<?)'],
    ['a kind of record in a time range', { entity: 'build', from: '2025-03-01', to: '2025-04-01' }, 'SEARCH a USING COVERING INDEX audit_log_entity_at (entity=? AND at>? AND at<?)'],
  ] as [string, Record<string, string>, string][])('reads the audit log newest first without sorting it, through an index: %s', async (_name, query, index) => {
    const actorId = query.actorId && String(lead);
    const parsed = auditQuery.parse({ ...query, ...(actorId && { actorId }) });
    const plans = await plansOf(h.db, (db) => listAudit(db, { scope: 'all', money: true }, parsed));
    // Only the page's own rows, fetched by id, are put in order; nothing that walks the log sorts.
    const walks = plans.filter((lines) => lines.some((line) => line.includes('INDEX audit_log_')));
    expect(walks.flat().filter((line) => line.includes('TEMP B-TREE'))).toEqual([]);
    expect(plans.flat().filter((line) => /^SCAN a\b(?! USING)/.test(line))).toEqual([]);
    expect(plans.flat(), plans.flat().join('\n')).toContain(index);
  });

  it("reads a build's history by the audit index of one record, in time order", async () => {
    const build = await h.db.selectFrom('builds').select(['id', 'number']).where('locationId', '=', den).executeTakeFirstOrThrow();
    const plans = (await plansOf(h.db, (db) => buildHistory(db, 'all', build))).flat();
    expect(plans.filter((line) => line.includes('TEMP B-TREE') || /^SCAN (a|e)$/.test(line))).toEqual([]);
    expect(plans).toContain('SEARCH a USING INDEX audit_log_record_at (entity=? AND entity_id=?)');
  });
});
