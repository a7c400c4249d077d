import { once } from 'node:events';
import type { Writable } from 'node:stream';
import { setTimeout as sleep } from 'node:timers/promises';
import type ExcelJS from 'exceljs';
import type { CellKind, Column } from './columns.ts';
import { TOTAL_LABEL } from './columns.ts';
import { inUnits, Totals } from './cells.ts';
import type { ExportWriter } from './writer.ts';

const NUMBER_FORMATS: Partial<Record<CellKind, string>> = {
  money: '"$"#,##0.00;-"$"#,##0.00',
  rate: '0.00%',
  day: 'yyyy-mm-dd',
  month: 'mmm yyyy',
  hours: '0.00',
  count: '0',
};

/** A sheet holds at most 1,048,576 rows (the workbook format's limit); past it a sheet goes on in the next, "(2)" and so on. */
export const SHEET_ROWS = 1_048_576;

/** How far the compression may fall behind the rows written before the writer waits for it. */
const BEHIND_BYTES = 1 << 20;

/** A column's letters, 1 → A, 27 → AA. */
const letters = (index: number): string => (index > 26 ? letters(Math.floor((index - 1) / 26)) : '') + String.fromCharCode(65 + ((index - 1) % 26));

/**
 * exceljs hands a sheet's XML on to the zip without ever waiting (its stream takes every write), so
 * rows written faster than they are compressed pile up in memory: a year of the network's build
 * lines ran the thread out of its 256 MB. This waits until the zip has caught up. It reads exceljs's
 * sheet stream, which exceljs 4.4 does not document: `pipes` (the stream the zip reads the sheet
 * through, whose backlog it measures) and, before anything reads it, its own `buffers`.
 */
/** The bytes waiting in a writable stream; exceljs bundles an older stream class that has no `writableLength`. */
const backlogOf = (stream: Writable) => stream.writableLength ?? (stream as unknown as { _writableState: { length: number } })._writableState.length;

async function caughtUp(sheet: ExcelJS.Worksheet): Promise<void> {
  const stream = (sheet as unknown as { stream: { pipes: Writable[]; buffers: unknown[] } }).stream;
  for (;;) {
    const [compressor] = stream.pipes;
    if (!compressor) {
      if (stream.buffers.length * 65_536 < BEHIND_BYTES) return;
      await sleep(5);
    } else if (backlogOf(compressor) < BEHIND_BYTES) {
      return;
    } else {
      await once(compressor, 'drain');
    }
  }
}

/**
 * exceljs keeps every formula cell it writes (`_formulae`, by address), for formulas shared between
 * cells, which Busbar does not write: a year of build lines, each with two formulas, kept millions.
 * Forgetting them after each batch keeps the sheet's memory flat (undocumented, as above).
 */
const forgetFormulas = (sheet: ExcelJS.Worksheet) => {
  (sheet as unknown as { _formulae: object })._formulae = {};
};

/**
 * Writes a workbook as it goes, a row at a time (exceljs's streaming writer), so memory stays flat
 * however many rows: each sheet with its header row frozen and filtered, widths and number formats
 * set, and a totals row of SUM formulas whose cached values are the exact sums. The workbook library
 * is loaded on the first workbook: it is about 18 MB in each process that never writes one.
 */
export async function xlsxWriter(file: string, sheetRows = SHEET_ROWS): Promise<ExportWriter> {
  const { default: excel } = await import('exceljs');
  const book = new excel.stream.xlsx.WorkbookWriter({ filename: file, useStyles: true, useSharedStrings: false });
  book.creator = 'Busbar';

  /** A sheet begun: its header written; rows go on until `end` writes its totals. */
  function begin<R>(name: string, columns: Column<R>[]) {
    const sheet = book.addWorksheet(name, { views: [{ state: 'frozen', ySplit: 1 }] });
    sheet.columns = columns.map((c) => ({ key: c.key, width: c.width, style: { numFmt: NUMBER_FORMATS[c.kind] } }));
    const at = new Map(columns.map((c, i) => [c.key, letters(i + 1)]));
    const header = sheet.addRow(columns.map((c) => c.header));
    header.font = { bold: true };
    header.commit();
    const totals = new Totals();
    let rowNumber = 1;
    return {
      sheet,
      /** Room for a row and the totals row after it. */
      full: () => rowNumber >= sheetRows - 1,
      add(row: R) {
        rowNumber += 1;
        const cell = (key: string) => `${at.get(key)}${rowNumber}`;
        const values = columns.map((c) => {
          const value = c.value(row);
          if (c.summed) totals.add(c.key, value);
          const shown = inUnits(c.kind, value);
          return c.formula ? { formula: c.formula(cell), result: shown ?? 0 } : shown;
        });
        sheet.addRow(values).commit();
      },
      end() {
        const total = sheet.addRow(
          columns.map((c, i) => {
            if (i === 0) return TOTAL_LABEL;
            if (!c.summed) return null;
            const sum = inUnits(c.kind, totals.of(c.key));
            return rowNumber > 1 ? { formula: `SUM(${at.get(c.key)}2:${at.get(c.key)}${rowNumber})`, result: sum } : sum;
          }),
        );
        total.font = { bold: true };
        total.commit();
        sheet.autoFilter = { from: { row: 1, column: 1 }, to: { row: rowNumber, column: columns.length } };
        sheet.commit();
      },
    };
  }

  return {
    async sheet<R>(name: string, columns: Column<R>[], batches: AsyncIterable<R[]>, wrote: (rows: number) => Promise<void>) {
      let part = 1;
      let current = begin(name, columns);
      for await (const batch of batches) {
        for (const row of batch) {
          if (current.full()) {
            current.end();
            part += 1;
            current = begin(`${name} (${part})`, columns);
          }
          current.add(row);
        }
        forgetFormulas(current.sheet);
        await caughtUp(current.sheet);
        await wrote(batch.length);
      }
      current.end();
    },
    finish: () => book.commit(),
  };
}
