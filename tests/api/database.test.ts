import { mkdtempSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { migrateToLatest, openDatabase, seedDemoNetwork, type Db, type MigrationStep } from '@busbar/db';
import { Migrator, NO_MIGRATIONS, sql } from 'kysely';
import { afterEach, describe, expect, it } from 'vitest';
import { migrations } from '../../db/migrations/index.ts';

const dirs: string[] = [];
const fresh = async (): Promise<Db> => {
  const dir = mkdtempSync(join(tmpdir(), 'busbar-db-'));
  dirs.push(dir);
  const db = openDatabase(join(dir, 'busbar.sqlite'));
  await migrateToLatest(db);
  return db;
};
afterEach(() => {
  for (const dir of dirs.splice(0)) rmSync(dir, { recursive: true, force: true });
});

const snapshot = async (db: Db) => ({
  regions: await db.selectFrom('regions').selectAll().orderBy('id').execute(),
  locations: await db.selectFrom('locations').selectAll().orderBy('id').execute(),
  users: await db.selectFrom('users').select(['id', 'email', 'name', 'status']).orderBy('id').execute(),
  roles: await db.selectFrom('roleAssignments').selectAll().orderBy('id').execute(),
});

describe('database', () => {
  it('takes the write lock when a transaction begins, so a write between its read and its write cannot make it fail', async () => {
    const db = await fresh();
    const other = openDatabase(join(dirs.at(-1)!, 'busbar.sqlite'));
    await sql`pragma busy_timeout = 0`.execute(other);
    const elsewhere = () => other.insertInto('regions').values({ code: 'XX', name: 'Elsewhere' }).execute();
    try {
      const written = await db.transaction().execute(async (trx) => {
        const { n } = await trx.selectFrom('regions').select((eb) => eb.fn.countAll<number>().as('n')).executeTakeFirstOrThrow();
        // Another connection (an import's worker thread) cannot write now: this transaction holds the lock.
        await expect(elsewhere()).rejects.toThrow(/locked|busy/i);
        await trx.insertInto('regions').values({ code: `R${n}`, name: 'Counted' }).execute();
        return n;
      });
      expect(await db.selectFrom('regions').select('code').where('code', '=', `R${written}`).execute()).toHaveLength(1);
      await elsewhere();
    } finally {
      await other.destroy();
      await db.destroy();
    }
  });

  it("waits for another connection's write lock without holding up the process's reads and timers", async () => {
    const db = await fresh();
    const other = openDatabase(join(dirs.at(-1)!, 'busbar.sqlite'));
    try {
      // Another connection (an import's worker thread, the other app process) holds the write lock.
      await sql`begin immediate`.execute(other);
      let settled = false;
      const writing = db
        .transaction()
        .execute((trx) => trx.insertInto('regions').values({ code: 'WQ', name: 'Waited' }).execute())
        .finally(() => (settled = true));
      // Meanwhile this process's timers fire and its reads are answered: nothing sleeps on the thread.
      const started = performance.now();
      await new Promise((resolve) => setTimeout(resolve, 50));
      expect(performance.now() - started).toBeLessThan(1000);
      const regions = await db.selectFrom('regions').select('code').execute();
      expect(regions.map((r) => r.code)).not.toContain('WQ');
      expect(settled).toBe(false);
      await sql`commit`.execute(other);
      await writing;
      expect(await db.selectFrom('regions').select('code').where('code', '=', 'WQ').execute()).toHaveLength(1);
    } finally {
      await other.destroy();
      await db.destroy();
    }
  });

  it('gives a transaction up with SQLITE_BUSY once the write lock stays taken past the busy timeout, having written nothing', async () => {
    const db = await fresh();
    const file = join(dirs.at(-1)!, 'busbar.sqlite');
    await db.destroy();
    const impatient = openDatabase(file, { busyTimeoutMs: 100 });
    const other = openDatabase(file);
    try {
      await sql`begin immediate`.execute(other);
      const started = performance.now();
      const write = impatient.transaction().execute((trx) => trx.insertInto('regions').values({ code: 'GU', name: 'Given up' }).execute());
      await expect(write).rejects.toMatchObject({ code: 'SQLITE_BUSY' });
      expect(performance.now() - started).toBeGreaterThanOrEqual(100);
      await sql`commit`.execute(other);
      expect(await impatient.selectFrom('regions').select('code').where('code', '=', 'GU').execute()).toEqual([]);
      // The connection is whole again: its next transaction goes through.
      await impatient.transaction().execute((trx) => trx.insertInto('regions').values({ code: 'OK', name: 'Later' }).execute());
      expect(await impatient.selectFrom('regions').select('code').where('code', '=', 'OK').execute()).toHaveLength(1);
    } finally {
      await other.destroy();
      await impatient.destroy();
    }
  });

  it('opens with WAL, foreign keys and a busy timeout', async () => {
    const db = await fresh();
    const pragma = async (name: string) => Object.values((await sql.raw(`pragma ${name}`).execute(db)).rows[0] as object)[0];
    expect(await pragma('journal_mode')).toBe('wal');
    expect(await pragma('foreign_keys')).toBe(1);
    expect(await pragma('busy_timeout')).toBe(5000);
    await db.destroy();
  });

  it('migrates down to nothing and up again', async () => {
    const db = await fresh();
    const migrator = new Migrator({ db, provider: { getMigrations: async () => migrations } });
    const down = await migrator.migrateTo(NO_MIGRATIONS);
    expect(down.error).toBeUndefined();
    const tables = async () => (await db.introspection.getTables()).map((t) => t.name).filter((n) => !n.startsWith('kysely_'));
    expect(await tables()).toEqual([]);
    await migrateToLatest(db);
    expect(await tables()).toEqual(
      expect.arrayContaining(['users', 'role_assignments', 'sessions', 'audit_log', 'invites', 'mail_log', 'builds', 'build_items']),
    );
    await db.destroy();
  });

  it('tells each pending migration before it runs, in order, and nothing once all have run', async () => {
    const dir = mkdtempSync(join(tmpdir(), 'busbar-db-'));
    dirs.push(dir);
    const db = openDatabase(join(dir, 'busbar.sqlite'));
    const names = Object.keys(migrations);
    const applied = async () => (await sql<{ name: string }>`select name from kysely_migration order by name`.execute(db)).rows.map((r) => r.name);
    expect((await new Migrator({ db, provider: { getMigrations: async () => migrations } }).migrateTo(names[23]!)).error).toBeUndefined();
    // Told before it runs: a step that fails at the telling never reaches the database.
    const stopAt = new Error('stopped at the telling');
    const failAt30 = (step: MigrationStep) => {
      if (step.name === names[30]) throw stopAt;
    };
    await expect(migrateToLatest(db, failAt30)).rejects.toBe(stopAt);
    expect(await applied()).toEqual(names.slice(0, 30));
    const steps: MigrationStep[] = [];
    await migrateToLatest(db, (step) => steps.push(step));
    expect(steps.map((s) => s.name)).toEqual(names.slice(30));
    expect(steps.map((s) => s.done)).toEqual(names.slice(30).map((_, i) => i));
    expect(new Set(steps.map((s) => s.of))).toEqual(new Set([names.length - 30]));
    expect(await applied()).toEqual(names);
    const again: MigrationStep[] = [];
    await migrateToLatest(db, (step) => again.push(step));
    expect(again).toEqual([]);
    await db.destroy();
  });

  it("keeps each location's royalty as its terms from 2000-01 when royalty terms arrive, and gives it back going down", async () => {
    const db = await fresh();
    const migrator = new Migrator({ db, provider: { getMigrations: async () => migrations } });
    expect((await migrator.migrateTo('024-add-weekly-digest')).error).toBeUndefined();
    await sql`insert into regions (code, name) values ('MID', 'Midlands')`.execute(db);
    await sql`insert into locations (region_id, code, name, time_zone, labor_rate_cents, royalty_basis_points) values (1, 'RVR', 'Riverton', 'America/Denver', 12000, 625)`.execute(db);
    await migrateToLatest(db);
    expect(await db.selectFrom('royaltyTerms').select(['appliesFrom', 'royaltyBasisPoints', 'marketingBasisPoints']).execute()).toEqual([{ appliesFrom: '2000-01', royaltyBasisPoints: 625, marketingBasisPoints: 0 }]);
    await db.insertInto('royaltyTerms').values({ locationId: 1, appliesFrom: '2026-01', royaltyBasisPoints: 700, marketingBasisPoints: 100, createdBy: null, createdAt: '2026-01-01T00:00:00Z' }).execute();
    expect((await migrator.migrateTo('024-add-weekly-digest')).error).toBeUndefined();
    // Going down, the location keeps its latest royalty.
    expect((await sql<{ r: number }>`select royalty_basis_points as r from locations`.execute(db)).rows).toEqual([{ r: 700 }]);
    await db.destroy();
  });

  it('keeps one sales tax rate a month per location, within 0 to 100 %, and drops them going down', async () => {
    const db = await fresh();
    const migrator = new Migrator({ db, provider: { getMigrations: async () => migrations } });
    await sql`insert into regions (code, name) values ('MID', 'Midlands')`.execute(db);
    await sql`insert into locations (region_id, code, name, time_zone, labor_rate_cents) values (1, 'RVR', 'Riverton', 'America/Denver', 12000)`.execute(db);
    const rate = (appliesFrom: string, basisPoints: number, laborTaxed: number) =>
      db.insertInto('salesTaxRates').values({ locationId: 1, appliesFrom, basisPoints, laborTaxed, createdBy: null, createdAt: '2026-01-01T00:00:00Z' }).execute();
    await rate('2026-01', 825, 0);
    await rate('2026-02', 10_000, 1);
    await expect(rate('2026-01', 900, 1)).rejects.toThrow(/UNIQUE/);
    await expect(rate('2026-03', 10_001, 0)).rejects.toThrow(/CHECK/);
    await expect(rate('2026-03', 825, 2)).rejects.toThrow(/CHECK/);
    await expect(rate('2026-3', 825, 0)).rejects.toThrow(/CHECK/);
    expect(await db.selectFrom('salesTaxRates').select(['appliesFrom', 'basisPoints', 'laborTaxed']).orderBy('appliesFrom').execute()).toEqual([
      { appliesFrom: '2026-01', basisPoints: 825, laborTaxed: 0 },
      { appliesFrom: '2026-02', basisPoints: 10_000, laborTaxed: 1 },
    ]);
    expect((await migrator.migrateTo('028-create-exports')).error).toBeUndefined();
    expect((await db.introspection.getTables()).map((t) => t.name)).not.toContain('sales_tax_rates');
    await db.destroy();
  });

  it('generates the same demo network for the same seed and clock', async () => {
    const options = { passwordHash: 'scrypt$10$8$1$x$y', now: new Date('2026-01-01T00:00:00Z'), seed: 42 };
    const [a, b] = [await fresh(), await fresh()];
    await seedDemoNetwork(a, options);
    await seedDemoNetwork(b, options);
    expect(await snapshot(a)).toEqual(await snapshot(b));
    await Promise.all([a.destroy(), b.destroy()]);
  });

  it('gives the demo network two regions, shops in several time zones and every role', async () => {
    const db = await fresh();
    await seedDemoNetwork(db, { passwordHash: 'scrypt$10$8$1$x$y', now: new Date('2026-01-01T00:00:00Z') });
    const { regions, locations, roles } = await snapshot(db);
    expect(regions.length).toBeGreaterThanOrEqual(2);
    expect(locations.length).toBeGreaterThanOrEqual(6);
    expect(new Set(locations.map((l) => l.timeZone)).size).toBeGreaterThanOrEqual(3);
    expect(new Set(roles.map((r) => r.role))).toEqual(
      new Set(['owner', 'regional_manager', 'location_lead', 'technician', 'warranty_clerk', 'accountant']),
    );
    for (const location of locations) {
      const here = roles.filter((r) => r.locationId === location.id).map((r) => r.role);
      expect(here).toEqual(expect.arrayContaining(['location_lead', 'technician', 'warranty_clerk']));
    }
    await db.destroy();
  });

  it('refuses a role assignment whose scope does not match its ids', async () => {
    const db = await fresh();
    await seedDemoNetwork(db, { passwordHash: 'scrypt$10$8$1$x$y', now: new Date('2026-01-01T00:00:00Z') });
    const insert = db
      .insertInto('roleAssignments')
      .values({ userId: 1, role: 'technician', scope: 'location', regionId: null, locationId: null, createdAt: 'now', createdBy: null })
      .execute();
    await expect(insert).rejects.toThrow(/CHECK constraint failed/);
    await db.destroy();
  });
});
