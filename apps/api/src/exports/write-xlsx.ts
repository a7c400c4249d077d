import ExcelJS from 'exceljs';
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

/** A column's letters, 1 → A, 27 → AA. */
const letters = (index: number): string => (index > 26 ? letters(Math.floor((index - 1) / 26)) : '') + String.fromCharCode(65 + ((index - 1) % 26));

/**
 * Writes a workbook as it goes, a row at a time (exceljs's streaming writer), so memory stays flat
 * however many rows: each sheet with its header row frozen and filtered, widths and number formats
 * set, and a totals row of SUM formulas whose cached values are the exact sums.
 */
export function xlsxWriter(file: string): ExportWriter {
  const book = new ExcelJS.stream.xlsx.WorkbookWriter({ filename: file, useStyles: true, useSharedStrings: false });
  book.creator = 'Busbar';
  return {
    async sheet<R>(name: string, columns: Column<R>[], batches: AsyncIterable<R[]>, wrote: (rows: number) => Promise<void>) {
      const sheet = book.addWorksheet(name, { views: [{ state: 'frozen', ySplit: 1 }] });
      sheet.columns = columns.map((c) => ({ key: c.key, width: c.width, style: { numFmt: NUMBER_FORMATS[c.kind] } }));
      const at = new Map(columns.map((c, i) => [c.key, letters(i + 1)]));
      const header = sheet.addRow(columns.map((c) => c.header));
      header.font = { bold: true };
      header.commit();
      const totals = new Totals();
      let rowNumber = 1;
      for await (const batch of batches) {
        for (const row of batch) {
          rowNumber += 1;
          const cell = (key: string) => `${at.get(key)}${rowNumber}`;
          sheet
            .addRow(
              columns.map((c) => {
                const value = c.value(row);
                if (c.summed) totals.add(c.key, value);
                const shown = inUnits(c.kind, value);
                return c.formula ? { formula: c.formula(cell), result: shown ?? 0 } : shown;
              }),
            )
            .commit();
        }
        await wrote(batch.length);
      }
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
    finish: () => book.commit(),
  };
}
