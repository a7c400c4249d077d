import { mkdtempSync, readFileSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { afterAll, describe, expect, it } from 'vitest';
import XLSX from 'xlsx';
import type { Column } from '../../apps/api/src/exports/columns.ts';
import { csvWriter } from '../../apps/api/src/exports/write-csv.ts';
import { xlsxWriter } from '../../apps/api/src/exports/write-xlsx.ts';

/** The writers on rows of their own, read back with SheetJS (an independent reader, test-only). */
const dir = mkdtempSync(join(tmpdir(), 'busbar-writers-'));
afterAll(() => rmSync(dir, { recursive: true, force: true }));

interface Row {
  name: string;
  cents: number;
  hours: number;
}
const COLUMNS: Column<Row>[] = [
  { key: 'name', header: 'Name', kind: 'text', width: 12, value: (r) => r.name },
  { key: 'hours', header: 'Hours', kind: 'hours', width: 8, value: (r) => r.hours, summed: true },
  { key: 'cents', header: 'Amount', kind: 'money', width: 12, value: (r) => r.cents, summed: true },
];
const rows: Row[] = Array.from({ length: 9 }, (_, i) => ({ name: i === 4 ? '@SUM(A1)' : `Row ${i + 1}`, cents: 1001 * (i + 1), hours: 0.1 * (i + 1) }));
async function* inBatches() {
  yield rows.slice(0, 4);
  yield rows.slice(4);
}
const noProgress = async () => undefined;

describe('the workbook writer', () => {
  it('goes on in a second and third sheet past its row limit, each with its own totals row', async () => {
    const file = join(dir, 'parts.xlsx');
    // Five rows a sheet: a header, three rows and the totals row.
    const writer = await xlsxWriter(file, 5);
    await writer.sheet('Lines', COLUMNS, inBatches(), noProgress);
    await writer.finish();
    const book = XLSX.read(readFileSync(file), { type: 'buffer', cellFormula: true });
    expect(book.SheetNames).toEqual(['Lines', 'Lines (2)', 'Lines (3)']);
    const seen: string[] = [];
    for (const name of book.SheetNames) {
      const table = XLSX.utils.sheet_to_json<(string | number)[]>(book.Sheets[name]!, { header: 1 });
      expect(table[0]).toEqual(['Name', 'Hours', 'Amount']);
      const data = table.slice(1, -1);
      const total = table.at(-1)!;
      expect(total[0]).toBe('Total');
      expect(Math.round(Number(total[2]) * 100)).toBe(data.reduce((s, r) => s + Math.round(Number(r[2]) * 100), 0));
      expect(book.Sheets[name]![`C${table.length}`]!.f).toMatch(/^SUM\(C2:C\d\)$/);
      seen.push(...data.map((r) => String(r[0])));
    }
    expect(seen).toEqual(rows.map((r) => r.name));
  });
});

describe('the CSV writer', () => {
  it('neutralises text a spreadsheet would run, and sums hours without floating-point dust', async () => {
    const file = join(dir, 'rows.csv');
    const writer = csvWriter(file);
    await writer.sheet('Lines', COLUMNS, inBatches(), noProgress);
    await writer.finish();
    const lines = readFileSync(file, 'utf8').slice(1).trimEnd().split('\r\n');
    expect(lines[0]).toBe('Name,Hours,Amount');
    expect(lines[5]).toBe("'@SUM(A1),0.5,50.05");
    // 0.1 + 0.2 + … + 0.9 in floating point is 4.499999999999999; the hundredths are 4.5. 1001 × 45 cents = $450.45.
    expect(lines.at(-1)).toBe('Total,4.5,450.45');
  });
});
