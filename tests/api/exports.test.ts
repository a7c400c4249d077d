import { createHash } from 'node:crypto';
import { writeFileSync } from 'node:fs';
import { join } from 'node:path';
import type { ExportJob, MonthClose, Rollups } from '@busbar/shared';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { Response } from 'supertest';
import XLSX from 'xlsx';
import { demoIds, startHarness, type Agent, type Harness } from '../support/api-harness.ts';
import { addPerson, SIGN_INS } from '../support/staff-fixtures.ts';

/**
 * Exports of the month close, read back with an independent reader (SheetJS `xlsx`, a test-only
 * dependency): the demo network's May 2026 (the harness's clock stands at June 15, 2026).
 */
let h: Harness;
let ids: Awaited<ReturnType<typeof demoIds>>;
const MONTH = '2026-05';

beforeAll(async () => {
  h = await startHarness({}, true, { history: true });
  ids = await demoIds(h.db);
}, 60_000);
afterAll(() => h.close());

/** A person of their own with one role, signed in (with the demo's password). */
async function signedInNew(place: Parameters<typeof addPerson>[1]) {
  const person = await addPerson(h.db, place);
  const { passwordHash } = await h.db.selectFrom('users').select('passwordHash').where('email', '=', SIGN_INS.lead2).executeTakeFirstOrThrow();
  await h.db.updateTable('users').set({ passwordHash }).where('id', '=', person.id).execute();
  return { person, agent: await h.signedIn(person.email) };
}

/** Supertest's parser for a body of bytes: the response it hands over is the incoming stream. */
const binary = (res: Response, done: (error: Error | null, body: Buffer) => void) => {
  const stream = res as unknown as NodeJS.ReadableStream;
  const chunks: Buffer[] = [];
  stream.on('data', (chunk: Buffer) => chunks.push(chunk));
  stream.on('end', () => done(null, Buffer.concat(chunks)));
};

/** Asks for an export and waits for its job to end; answers the export as its history has it. */
async function exported(agent: Agent, body: object): Promise<ExportJob> {
  const asked = await agent.post('/api/exports').send(body);
  expect(asked.status, JSON.stringify(asked.body)).toBe(202);
  for (let tries = 0; tries < 300; tries++) {
    const job = (await agent.get(`/api/exports/${asked.body.id}`).expect(200)).body as ExportJob;
    if (job.status === 'done' || job.status === 'failed') return job;
    await new Promise((resolve) => setTimeout(resolve, 100));
  }
  throw new Error('The export did not finish in 30 s');
}

const download = async (agent: Agent, id: number) => (await agent.get(`/api/exports/${id}/file`).buffer(true).parse(binary).expect(200)).body as Buffer;
const workbookOf = (bytes: Buffer) => XLSX.read(bytes, { type: 'buffer', cellDates: true, cellFormula: true, cellNF: true, cellStyles: true });

/** A sheet's header and data rows as cells (the totals row apart), and its totals row. */
function tableOf(book: XLSX.WorkBook, name: string) {
  const sheet = book.Sheets[name]!;
  const range = XLSX.utils.decode_range(sheet['!ref']!);
  const rows: XLSX.CellObject[][] = [];
  for (let r = range.s.r; r <= range.e.r; r++) {
    const row: XLSX.CellObject[] = [];
    for (let c = range.s.c; c <= range.e.c; c++) row.push(sheet[XLSX.utils.encode_cell({ r, c })] ?? { t: 'z' });
    rows.push(row);
  }
  const header = rows[0]!.map((c) => String(c.v));
  const column = (title: string) => {
    const at = header.indexOf(title);
    expect(at, `column ${title} of ${name}`).toBeGreaterThanOrEqual(0);
    return at;
  };
  return { sheet, header, rows: rows.slice(1, -1), total: rows.at(-1)!, column };
}
const cents = (cell: XLSX.CellObject | undefined) => Math.round(Number(cell?.v ?? 0) * 100);
const sumCents = (rows: XLSX.CellObject[][], at: number) => rows.reduce((sum, r) => sum + cents(r[at]), 0);

describe('a month-close workbook', () => {
  let book: XLSX.WorkBook;
  let job: ExportJob;
  let close: MonthClose;

  beforeAll(async () => {
    const accountant = await h.signedIn(SIGN_INS.accountant);
    job = await exported(accountant, { kind: 'month-close', month: MONTH });
    expect(job).toMatchObject({ status: 'done', scopeLabel: 'Whole network', format: 'xlsx', fileName: 'busbar-month-close-2026-05.xlsx', error: null });
    book = workbookOf(await download(accountant, job.id));
    close = (await accountant.get(`/api/closes?month=${MONTH}`).expect(200)).body as MonthClose;
  }, 60_000);

  it('has its five sheets, with frozen, filtered header rows', () => {
    expect(book.SheetNames).toEqual(['Summary', 'Delivered builds', 'Build lines', 'Warranty claims', 'Royalty statements']);
    for (const name of book.SheetNames) {
      const { sheet, header } = tableOf(book, name);
      expect(sheet['!autofilter']?.ref, name).toMatch(new RegExp(`^A1:${XLSX.utils.encode_col(header.length - 1)}\\d+$`));
      expect(sheet['!cols']?.every((c) => (c.wch ?? c.width ?? 0) > 0), name).toBe(true);
    }
  });

  it("sums to the month close's own figures, each total row a SUM formula that agrees with its rows", () => {
    const summary = tableOf(book, 'Summary');
    expect(summary.rows).toHaveLength(close.locations.length);
    const pairs = [['Builds delivered', 'buildsDelivered'], ['Revenue', 'revenueCents'], ['Parts cost', 'partsCostCents'], ['Gross margin', 'grossMarginCents'], ['Credit outstanding', 'creditOutstandingCents'], ['Royalty due', 'royaltyDueCents']] as const;
    for (const [title, figure] of pairs) {
      const at = summary.column(title);
      const total = summary.total[at]!;
      expect(total.f, title).toBe(`SUM(${XLSX.utils.encode_col(at)}2:${XLSX.utils.encode_col(at)}${summary.rows.length + 1})`);
      const rowsSum = figure === 'buildsDelivered' ? summary.rows.reduce((s, r) => s + Number(r[at]!.v), 0) : sumCents(summary.rows, at);
      const totalValue = figure === 'buildsDelivered' ? Number(total.v) : cents(total);
      expect(totalValue, title).toBe(rowsSum);
      expect(totalValue, title).toBe(close.total[figure]);
    }
  });

  it('agrees with the roll-ups of the same month for the network', async () => {
    const owner = await h.signedIn(SIGN_INS.owner);
    const rollups = (await owner.get('/api/rollups?from=2026-05-01&to=2026-05-31&grain=month').expect(200)).body as Rollups;
    const may = rollups.network.find((p) => p.period.startsWith(MONTH))!;
    const summary = tableOf(book, 'Summary');
    expect(Number(summary.total[summary.column('Builds delivered')]!.v)).toBe(may.buildsDelivered);
    expect(cents(summary.total[summary.column('Revenue')])).toBe(may.revenueCents);
    expect(cents(summary.total[summary.column('Parts cost')])).toBe(may.partsCostCents);
  });

  it('lists every delivered build and line behind the totals', () => {
    const builds = tableOf(book, 'Delivered builds');
    expect(builds.rows).toHaveLength(close.total.buildsDelivered);
    expect(sumCents(builds.rows, builds.column('Revenue'))).toBe(close.total.revenueCents);
    expect(sumCents(builds.rows, builds.column('Parts revenue'))).toBe(close.total.partsRevenueCents);
    expect(cents(builds.total[builds.column('Gross margin')])).toBe(close.total.grossMarginCents);
    const lines = tableOf(book, 'Build lines');
    expect(lines.rows.length).toBeGreaterThan(builds.rows.length);
    expect(sumCents(lines.rows, lines.column('Line price'))).toBe(close.total.partsRevenueCents);
    expect(sumCents(lines.rows, lines.column('Line cost'))).toBe(close.total.partsCostCents);
    const claims = tableOf(book, 'Warranty claims');
    expect(claims.rows).toHaveLength(close.total.claimsLogged);
    expect(sumCents(claims.rows, claims.column('Credit outstanding'))).toBe(close.total.creditOutstandingCents);
    expect(sumCents(claims.rows, claims.column('Credit asked'))).toBe(close.total.creditRequestedCents);
  });

  it('writes numbers as numbers in currency and percent formats, and dates as dates', () => {
    const builds = tableOf(book, 'Delivered builds');
    const first = builds.rows[0]!;
    expect(first[builds.column('Revenue')]).toMatchObject({ t: 'n', z: '"$"#,##0.00;-"$"#,##0.00' });
    expect(first[builds.column('Delivered on')]!.t).toBe('d');
    expect((first[builds.column('Delivered on')]!.v as Date).toISOString().slice(0, 7)).toBe(MONTH);
    expect(first[builds.column('Gross margin')]!.f).toBe(`${XLSX.utils.encode_col(builds.column('Revenue'))}2-${XLSX.utils.encode_col(builds.column('Parts cost'))}2`);
    const royalty = tableOf(book, 'Royalty statements');
    const denver = royalty.rows.find((r) => r[royalty.column('Shop')]!.v === 'DEN')!;
    const rate = denver[royalty.column('Royalty rate')]!;
    expect(rate).toMatchObject({ t: 'n', z: '0.00%' });
    expect(Number(rate.v)).toBeGreaterThan(0);
    expect(Number(rate.v)).toBeLessThan(1);
    expect(denver[royalty.column('Month')]!.t).toBe('d');
  });

  it('states royalty as base × rate to the cent, by formula, as the month close has it', () => {
    const royalty = tableOf(book, 'Royalty statements');
    for (const row of royalty.rows) {
      const [base, rate, due] = [cents(row[royalty.column('Royalty base (parts and labor)')]), Number(row[royalty.column('Royalty rate')]?.v ?? 0), cents(row[royalty.column('Royalty due')])];
      // Half a cent and up rounds up, as Excel's ROUND does for positive amounts.
      expect(due).toBe(Math.round(base * rate));
      expect(row[royalty.column('Royalty due')]!.f).toMatch(/^ROUND\(E\d+\*F\d+,2\)$/);
    }
    expect(cents(royalty.total[royalty.column('Royalty due')])).toBe(close.total.royaltyDueCents);
  });

  it('downloads again byte for byte, matching the checksum kept in the history', async () => {
    const accountant = await h.signedIn(SIGN_INS.accountant);
    const again = await download(accountant, job.id);
    const answer = await accountant.get(`/api/exports/${job.id}/file`).buffer(true).parse(binary);
    expect(answer.headers['cache-control']).toBe('no-store');
    expect(answer.headers['content-disposition']).toBe('attachment; filename=busbar-month-close-2026-05.xlsx');
    expect(createHash('sha256').update(again).digest('hex')).toBe(job.checksum);
    expect(again.length).toBe(job.fileBytes);
    const history = (await accountant.get('/api/exports').expect(200)).body;
    expect(history.items[0]).toMatchObject({ id: job.id, createdByName: expect.any(String), status: 'done', checksum: job.checksum });
  });
});

describe('what an export holds and who may make it', () => {
  it("never holds a customer's e-mail, phone or address for the accountant", async () => {
    const accountant = await h.signedIn(SIGN_INS.accountant);
    const job = await exported(accountant, { kind: 'month-close', month: MONTH });
    const book = workbookOf(await download(accountant, job.id));
    const contacts = await h.db.selectFrom('customers').select(['email', 'phone', 'addressLine1']).execute();
    const secrets = new Set(contacts.flatMap((c) => [c.email, c.phone, c.addressLine1]).filter((v): v is string => Boolean(v && v.length > 4)));
    expect(secrets.size).toBeGreaterThan(10);
    let cells = 0;
    for (const name of book.SheetNames) {
      for (const cell of Object.values(book.Sheets[name]!).filter((c): c is XLSX.CellObject => typeof c === 'object' && c !== null && 't' in c)) {
        cells++;
        if (cell.t === 's') expect(secrets.has(String(cell.v)), `${name}: ${String(cell.v)}`).toBe(false);
      }
    }
    expect(cells).toBeGreaterThan(100);
    expect(tableOf(book, 'Delivered builds').header).not.toContain('E-mail');
  });

  it('holds only the region of a regional accountant, who cannot ask for a shop outside it', async () => {
    const region = await h.db.selectFrom('locations').select(['regionId']).where('id', '=', ids.location('DEN')).executeTakeFirstOrThrow();
    const { agent } = await signedInNew({ role: 'accountant', regionId: region.regionId });
    const inRegion = (await h.db.selectFrom('locations').select('code').where('regionId', '=', region.regionId).execute()).map((l) => l.code);
    const job = await exported(agent, { kind: 'month-close', month: MONTH });
    const book = workbookOf(await download(agent, job.id));
    for (const name of book.SheetNames) {
      const table = tableOf(book, name);
      const shops = new Set(table.rows.map((r) => String(r[table.column('Shop')]!.v)));
      expect([...shops].every((code) => inRegion.includes(code)), name).toBe(true);
    }
    expect(job.locationCount).toBe(inRegion.length);
    const outside = await h.db.selectFrom('locations').select('id').where('regionId', '<>', region.regionId).executeTakeFirstOrThrow();
    const refused = await agent.post('/api/exports').send({ kind: 'month-close', month: MONTH, locationIds: [outside.id] });
    expect(refused.status).toBe(403);
    expect(refused.body.error.message).toBe('You cannot export the month close of that shop or region');
  });

  it("refuses a location lead, who cannot see or download another person's export either", async () => {
    const accountant = await h.signedIn(SIGN_INS.accountant);
    const job = await exported(accountant, { kind: 'month-close', month: MONTH, locationIds: [ids.location('DEN')] });
    expect(job.scopeLabel).toMatch(/^DEN /);
    for (const who of [SIGN_INS.lead, SIGN_INS.tech, SIGN_INS.warranty, SIGN_INS.regional]) {
      const agent = await h.signedIn(who);
      const asked = await agent.post('/api/exports').send({ kind: 'month-close', month: MONTH, locationIds: [ids.location('DEN')] });
      expect(asked.status, who).toBe(403);
      expect(asked.body.error.message).toBe('Only the accountant and the network owner export the month close');
      expect((await agent.get(`/api/exports/${job.id}`)).status, who).toBe(404);
      expect((await agent.get(`/api/exports/${job.id}/file`)).status, who).toBe(404);
      expect((await agent.get('/api/exports')).status, who).toBe(403);
    }
    // The owner sees everyone's exports.
    const owner = await h.signedIn(SIGN_INS.owner);
    expect((await owner.get(`/api/exports/${job.id}`)).status).toBe(200);
  });

  it('keeps a final month as it was closed: a later change to its builds does not reach its export', async () => {
    const accountant = await h.signedIn(SIGN_INS.accountant);
    const den = ids.location('DEN');
    await accountant.post(`/api/closes/${den}/2026-04/final`).expect(201);
    const before = (await accountant.get(`/api/closes?month=2026-04&locationId=${den}`).expect(200)).body as MonthClose;
    const build = await h.db.selectFrom('builds').select(['id', 'totalCents']).where('locationId', '=', den).where('deliveredOn', '>=', '2026-04-01').where('deliveredOn', '<=', '2026-04-30').executeTakeFirstOrThrow();
    await h.db.updateTable('builds').set({ totalCents: build.totalCents + 10_000 }).where('id', '=', build.id).execute();
    const job = await exported(accountant, { kind: 'month-close', month: '2026-04', locationIds: [den] });
    const summary = tableOf(workbookOf(await download(accountant, job.id)), 'Summary');
    expect(summary.rows).toHaveLength(1);
    expect(summary.rows[0]![summary.column('Close')]!.v).toBe('Final');
    expect(cents(summary.rows[0]![summary.column('Revenue')])).toBe(before.locations[0]!.revenueCents);
    await h.db.updateTable('builds').set({ totalCents: build.totalCents }).where('id', '=', build.id).execute();
  });
});

describe('a CSV export', () => {
  it('writes one sheet, with text that a spreadsheet would run as a formula neutralised', async () => {
    const den = ids.location('DEN');
    const build = await h.db.selectFrom('builds').select(['customerId']).where('locationId', '=', den).where('deliveredOn', '>=', '2026-05-01').where('deliveredOn', '<=', '2026-05-31').executeTakeFirstOrThrow();
    const customer = await h.db.selectFrom('customers').select('name').where('id', '=', build.customerId).executeTakeFirstOrThrow();
    await h.db.updateTable('customers').set({ name: '=HYPERLINK("http://example.test","Pay here")' }).where('id', '=', build.customerId).execute();
    const owner = await h.signedIn(SIGN_INS.owner);
    const job = await exported(owner, { kind: 'month-close', month: MONTH, locationIds: [den], format: 'csv', sheet: 'builds' });
    expect(job.fileName).toBe('busbar-month-close-2026-05-builds.csv');
    const text = (await download(owner, job.id)).toString('utf8');
    await h.db.updateTable('customers').set({ name: customer.name }).where('id', '=', build.customerId).execute();
    expect(text.startsWith('\ufeff')).toBe(true);
    const csv = text.slice(1);
    const lines = csv.trimEnd().split('\r\n');
    expect(lines[0]).toBe('Build,Shop,Delivered on,Customer,Labor hours,Labor revenue,Parts revenue,Revenue,Parts cost,Gross margin');
    expect(text).toContain(`"'=HYPERLINK(""http://example.test"",""Pay here"")"`);
    expect(lines.every((l) => !/(^|,)"?[=+@]/.test(l))).toBe(true);
    // Read by an independent reader, each row's margin is its revenue less its cost, and the totals line their sum.
    const rows = XLSX.utils.sheet_to_json<Record<string, string | number>>(XLSX.read(csv, { type: 'string', raw: true }).Sheets.Sheet1!, { raw: false });
    const data = rows.slice(0, -1);
    expect(rows.at(-1)!.Build).toBe('Total');
    expect(data.every((r) => Math.round(Number(r.Revenue) * 100) - Math.round(Number(r['Parts cost']) * 100) === Math.round(Number(r['Gross margin']) * 100))).toBe(true);
    expect(Math.round(Number(rows.at(-1)!.Revenue) * 100)).toBe(data.reduce((s, r) => s + Math.round(Number(r.Revenue) * 100), 0));
  });
});

describe('asking for an export', () => {
  it('refuses bad requests with words a person can act on', async () => {
    const accountant = await h.signedIn(SIGN_INS.accountant);
    const cases: [object, string, string][] = [
      [{ kind: 'month-close', month: '2026-13' }, 'month', 'Use a month like 2026-03'],
      [{ kind: 'month-close', month: '2026-05', throughMonth: '2026-04' }, 'throughMonth', 'Pick a last month on or after the first'],
      [{ kind: 'month-close', month: '2025-01', throughMonth: '2026-01' }, 'throughMonth', 'An export covers at most 12 months'],
      [{ kind: 'month-close', month: '2026-05', sheet: 'builds' }, 'sheet', 'A workbook holds every sheet; pick a sheet only for CSV'],
      [{ kind: 'payroll', month: '2026-05' }, 'kind', 'Busbar exports the month close'],
      [{ kind: 'month-close', month: '2026-05', format: 'pdf' }, 'format', 'Pick a workbook (xlsx) or CSV'],
      [{ kind: 'month-close', month: '2026-05', locationIds: [] }, 'locationIds', 'Pick at least one shop'],
    ];
    for (const [body, field, message] of cases) {
      const res = await accountant.post('/api/exports').send(body);
      expect(res.status, JSON.stringify(body)).toBe(400);
      expect(res.body.error.fields[field]).toBe(message);
    }
  });

  it("makes one export at a time per person, and a stopped app's unfinished exports say why", async () => {
    const { person, agent } = await signedInNew({ role: 'accountant' });
    await h.db.insertInto('exports').values({ kind: 'month-close', month: MONTH, throughMonth: MONTH, locationIds: null, scopeLabel: 'Whole network', locationCount: 8, format: 'xlsx', sheet: null, status: 'running', rowsTotal: 10, error: null, fileName: 'x.xlsx', fileBytes: null, checksum: null, createdBy: person.id, createdAt: '2026-06-15T14:00:00.000Z', finishedAt: null }).execute();
    const second = await agent.post('/api/exports').send({ kind: 'month-close', month: MONTH });
    expect(second.status).toBe(409);
    expect(second.body.error.message).toMatch(/^Your last export is still being made/);
    const { failUnfinishedExports } = await import('../../apps/api/src/queries/exports.ts');
    await failUnfinishedExports(h.db, h.clock.now);
    const [stopped] = ((await agent.get('/api/exports').expect(200)).body.items as ExportJob[]);
    expect(stopped).toMatchObject({ status: 'failed', error: 'Busbar restarted while this export was being made. Run it again.' });
    expect((await agent.get(`/api/exports/${stopped!.id}/file`)).status).toBe(409);
  });

  it('holds at most one unfinished export per person in the database itself, so two app processes cannot both start one', async () => {
    const { person } = await signedInNew({ role: 'accountant' });
    const row = (status: 'queued' | 'running' | 'done') => ({ kind: 'month-close' as const, month: MONTH, throughMonth: MONTH, locationIds: null, scopeLabel: 'Whole network', locationCount: 8, format: 'csv' as const, sheet: 'summary', status, rowsTotal: null, error: null, fileName: 'x.csv', fileBytes: null, checksum: null, createdBy: person.id, createdAt: '2026-06-15T14:00:00.000Z', finishedAt: null });
    await h.db.insertInto('exports').values([row('done'), row('done'), row('queued')]).execute();
    await expect(h.db.insertInto('exports').values(row('running')).execute()).rejects.toMatchObject({ code: 'SQLITE_CONSTRAINT_UNIQUE' });
  });

  it('fails with the reason when the file cannot be written, and keeps no partial file', async () => {
    // A plain file where the exports folder should be.
    const { agent } = await signedInNew({ role: 'accountant' });
    const { rmSync } = await import('node:fs');
    rmSync(join(h.dataDir, 'exports'), { recursive: true, force: true });
    writeFileSync(join(h.dataDir, 'exports'), 'not a folder');
    const job = await exported(agent, { kind: 'month-close', month: MONTH });
    rmSync(join(h.dataDir, 'exports'));
    expect(job).toMatchObject({ status: 'failed', error: 'Busbar could not write to its exports folder on the server.', fileName: 'busbar-month-close-2026-05.xlsx', checksum: null });
  });
});
