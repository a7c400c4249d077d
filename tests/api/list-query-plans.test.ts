import type { Db } from '@busbar/db';
import { auditQuery, buildQuery, customerQuery, quickPlanQuery, serialQuery } from '@busbar/shared';
import { sql } from 'kysely';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { LocationScope } from '../../apps/api/src/access/locations.ts';
import { listAudit } from '../../apps/api/src/queries/audit.ts';
import { listBuilds } from '../../apps/api/src/queries/builds.ts';
import { listCustomers } from '../../apps/api/src/queries/customers.ts';
import { listQuickPlans } from '../../apps/api/src/queries/plans.ts';
import { findSerials } from '../../apps/api/src/queries/serials.ts';
import { demoIds, startHarness, type Harness } from '../support/api-harness.ts';
import { plansOf } from '../support/query-plans.ts';

/**
 * SQLite's plan for every list query, on the demo network with statistics gathered: builds,
 * build lines and customers are read through an index, never row by row through the table.
 */
let h: Harness;
let den: number;

beforeAll(async () => {
  h = await startHarness({}, true, { history: true });
  den = (await demoIds(h.db)).location('DEN');
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
      const seek = scope === 'all' ? 'status=?' : 'location_id=? AND status=?';
      expect(plans[0]!.some((line) => line.includes(`INDEX`) && line.includes(`(${seek})`)), plans[0]!.join('\n')).toBe(true);
    }
  });

  it('reads the audit log newest first without sorting it, filtered by an index', async () => {
    for (const query of [{}, { entity: 'build' }]) {
      const plans = await plansOf(h.db, (db) => listAudit(db, auditQuery.parse(query)));
      expect(plans.flat().filter((line) => line.includes('TEMP B-TREE'))).toEqual([]);
    }
    expect((await plansOf(h.db, (db) => listAudit(db, auditQuery.parse({ entity: 'build' })))).flat()).toContain('SEARCH a USING COVERING INDEX audit_log_entity_recent (entity=?)');
  });
});
