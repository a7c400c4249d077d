import type { ExportSheet, Subject } from '@busbar/shared';

/**
 * What a cell holds, which decides how each format writes it: a workbook writes money as a number
 * in dollars with a currency format, a rate as a fraction with a percent format, a day or a month
 * as a date; CSV writes plain numbers and ISO days.
 */
export type CellKind = 'text' | 'count' | 'hours' | 'money' | 'rate' | 'day' | 'month';

/** A cell's value as the rows give it: money in cents, a rate in basis points, a day as YYYY-MM-DD, a month as YYYY-MM. */
export type CellValue = string | number | null;

export interface Column<R> {
  key: string;
  header: string;
  kind: CellKind;
  /** Width in characters. */
  width: number;
  value: (row: R) => CellValue;
  /** Added up in the totals row (as a SUM formula in a workbook). */
  summed?: boolean;
  /** A workbook writes the cell as this formula of the row's other cells (`cell(key)` names one), its value the cached result. */
  formula?: (cell: (key: string) => string) => string;
  /** The field behind the column: left out for a person who may not read it. */
  reads?: [Exclude<Subject, 'all'>, string];
}

/** A sheet: its columns, how many rows it will have, and its rows a batch at a time. */
export interface Sheet<R> {
  key: ExportSheet;
  columns: Column<R>[];
  count: () => Promise<number>;
  batches: () => AsyncIterable<R[]>;
}

/** The label of the totals row, in the first column. */
export const TOTAL_LABEL = 'Total';

/** The columns a person may read, of those `hidden` names (worked out on the request thread: see exportColumnsHidden). */
export const shown = <R>(columns: Column<R>[], hidden: readonly string[]) => columns.filter((c) => !c.reads || !hidden.includes(c.reads.join('.')));
