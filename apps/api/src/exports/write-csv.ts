import { createWriteStream } from 'node:fs';
import { once } from 'node:events';
import type { CellKind, CellValue, Column } from './columns.ts';
import { TOTAL_LABEL } from './columns.ts';
import { toHundredths, Totals } from './cells.ts';
import type { ExportWriter } from './writer.ts';

/**
 * Text a spreadsheet would take for a formula (= + - @, and tab or carriage return, which some
 * read past) gets a leading apostrophe, so an opened CSV never runs what a record holds
 * (OWASP, "CSV Injection"). Numbers Busbar writes itself are left as they are.
 */
export const neutralised = (text: string) => (/^[=+\-@\t\r]/.test(text) ? `'${text}` : text);

/** RFC 4180 quoting: a field with a comma, quote or line break is quoted, its quotes doubled. */
const quoted = (field: string) => (/[",\r\n]/.test(field) ? `"${field.replaceAll('"', '""')}"` : field);

/** A cell as CSV text: money in dollars to the cent, a rate as a percentage, days and months as ISO text. */
export function csvField(kind: CellKind, value: CellValue): string {
  if (value === null) return '';
  switch (kind) {
    case 'money':
      return ((value as number) / 100).toFixed(2);
    case 'rate':
      return `${Number(((value as number) / 100).toFixed(2))}%`;
    case 'hours':
      return String(toHundredths(value as number));
    case 'text':
      return quoted(neutralised(String(value)));
    default:
      return String(value);
  }
}

/**
 * Writes one sheet as a CSV file, streamed to disk: a header line, the rows, and a totals line of
 * the summed columns. UTF-8 with a byte-order mark, so spreadsheet programs read names as written;
 * lines end in CRLF (RFC 4180).
 */
export function csvWriter(file: string): ExportWriter {
  const out = createWriteStream(file, { flags: 'wx' });
  const write = async (text: string) => {
    if (!out.write(text)) await once(out, 'drain');
  };
  const line = (fields: string[]) => `${fields.join(',')}\r\n`;
  return {
    async sheet<R>(_name: string, columns: Column<R>[], batches: AsyncIterable<R[]>, wrote: (rows: number) => Promise<void>) {
      await write(`\ufeff${line(columns.map((c) => quoted(neutralised(c.header))))}`);
      const totals = new Totals();
      for await (const batch of batches) {
        let text = '';
        for (const row of batch) {
          text += line(
            columns.map((c) => {
              const value = c.value(row);
              if (c.summed) totals.add(c.key, value);
              return csvField(c.kind, value);
            }),
          );
        }
        await write(text);
        await wrote(batch.length);
      }
      await write(line(columns.map((c, i) => (i === 0 ? TOTAL_LABEL : c.summed ? csvField(c.kind, totals.of(c.key)) : ''))));
    },
    async finish() {
      out.end();
      await once(out, 'finish');
    },
  };
}
