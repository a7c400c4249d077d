import { mkdtempSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { migrateToLatest, openDatabase } from '@busbar/db';
import { sql } from 'kysely';
import { afterAll, expect, it } from 'vitest';

const dir = mkdtempSync(join(tmpdir(), 'busbar-read-'));
afterAll(() => rmSync(dir, { recursive: true, force: true }));

it("the read thread's connection reads what others wrote and refuses to write", async () => {
  const file = join(dir, 'busbar.sqlite');
  const writer = openDatabase(file);
  await migrateToLatest(writer);
  await writer.insertInto('regions').values({ code: 'NOR', name: 'Northern' }).execute();
  const reader = openDatabase(file, { queryOnly: true });
  expect(await reader.selectFrom('regions').select('name').execute()).toEqual([{ name: 'Northern' }]);
  await expect(reader.insertInto('regions').values({ code: 'SOU', name: 'Southern' }).execute()).rejects.toThrow(/readonly/);
  await expect(sql`delete from regions`.execute(reader)).rejects.toThrow(/readonly/);
  expect(await writer.selectFrom('regions').select('name').execute()).toEqual([{ name: 'Northern' }]);
  await Promise.all([reader.destroy(), writer.destroy()]);
});
