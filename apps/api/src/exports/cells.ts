import type { CellKind, CellValue } from './columns.ts';

/** A YYYY-MM-DD day or a YYYY-MM month as the UTC midnight a workbook stores as that date, whatever the server's zone. */
export const asDate = (isoDay: string) => new Date(Date.UTC(Number(isoDay.slice(0, 4)), Number(isoDay.slice(5, 7)) - 1, isoDay.length > 7 ? Number(isoDay.slice(8, 10)) : 1));

/** A cell's value in the units a person reads: dollars, a fraction for a rate. */
export function inUnits(kind: CellKind, value: CellValue): string | number | Date | null {
  if (value === null || value === '') return null;
  switch (kind) {
    case 'money':
      return (value as number) / 100;
    case 'rate':
      return (value as number) / 10_000;
    case 'hours':
      return toHundredths(value as number);
    case 'day':
    case 'month':
      return asDate(value as string);
    default:
      return value;
  }
}

/** Hours to two decimals: a sum of quarter hours in floating point carries dust (10.299999…). */
export const toHundredths = (n: number) => Math.round(n * 100) / 100;

/** Sums of the summed columns, kept in the rows' own units (money in whole cents, so the sum is exact). */
export class Totals {
  private readonly sums = new Map<string, number>();
  add(key: string, value: CellValue) {
    if (typeof value === 'number') this.sums.set(key, (this.sums.get(key) ?? 0) + value);
  }
  of(key: string): number {
    return this.sums.get(key) ?? 0;
  }
}
