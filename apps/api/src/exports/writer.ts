import type { Column } from './columns.ts';

/** Where an export's sheets go: a workbook (write-xlsx.ts) or a CSV file of one sheet (write-csv.ts). */
export interface ExportWriter {
  /** Writes a sheet's header, its rows a batch at a time (`wrote` after each), and its totals row. */
  sheet<R>(name: string, columns: Column<R>[], batches: AsyncIterable<R[]>, wrote: (rows: number) => Promise<void>): Promise<void>;
  finish(): Promise<void>;
}
