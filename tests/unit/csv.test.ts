import { parseItemsCell, unreadableLine } from '@busbar/shared';
import { describe, expect, it } from 'vitest';
import { parseCsv } from '../../apps/api/src/imports/csv.ts';

const fields = (text: string) => parseCsv(text).map((r) => r.fields);

// The cases of RFC 4180 §2: line breaks, quoting, escaped quotes, fields with commas and newlines.
describe('parseCsv', () => {
  it('reads CRLF and LF records, with or without a final line break', () => {
    expect(fields('aaa,bbb,ccc\r\nzzz,yyy,xxx\r\n')).toEqual([['aaa', 'bbb', 'ccc'], ['zzz', 'yyy', 'xxx']]);
    expect(fields('aaa,bbb,ccc\nzzz,yyy,xxx')).toEqual([['aaa', 'bbb', 'ccc'], ['zzz', 'yyy', 'xxx']]);
  });

  it('reads quoted fields holding commas, line breaks and doubled quotes', () => {
    expect(fields('"aaa","b,bb","c""cc"\n')).toEqual([['aaa', 'b,bb', 'c"cc']]);
    expect(fields('"aaa","b\r\nbb","ccc"\r\nzzz,yyy,xxx')).toEqual([['aaa', 'b\r\nbb', 'ccc'], ['zzz', 'yyy', 'xxx']]);
  });

  it('keeps empty fields, skips blank lines and a byte-order mark, and numbers records by their first line', () => {
    const records = parseCsv('\ufeffa,,c\n\n"multi\nline",x\nlast,\n');
    expect(records).toEqual([
      { line: 1, fields: ['a', '', 'c'] },
      { line: 3, fields: ['multi\nline', 'x'] },
      { line: 5, fields: ['last', ''] },
    ]);
  });

  it('refuses a quoted field that is never closed, naming its line', () => {
    expect(() => parseCsv('a,b\n"open,c\n')).toThrow('A quoted field that starts on line 2 is never closed');
  });
});

describe('parseItemsCell', () => {
  it('reads SKUs, quantities and serial numbers', () => {
    expect(parseItemsCell('LB-100; FB-12 x2 ;DC-40 #SN-0042')).toEqual([
      { sku: 'LB-100', quantity: 1, serialNumber: null },
      { sku: 'FB-12', quantity: 2, serialNumber: null },
      { sku: 'DC-40', quantity: 1, serialNumber: 'SN-0042' },
    ]);
    expect(parseItemsCell('')).toEqual([]);
  });

  it('names an entry it cannot read', () => {
    expect(parseItemsCell('LB-100 two')).toBe('"LB-100 two" is not SKU, SKU x2 or SKU #SERIAL');
    expect(parseItemsCell('FB-12 x0')).toBe('"FB-12 x0" needs a quantity of at least 1');
  });

  it('checks SKUs and serial numbers by the catalog’s and the build’s own rules', () => {
    expect(parseItemsCell('LB/100')).toBe('The SKU in "LB/100": Letters, digits, dot, dash or underscore');
    expect(parseItemsCell(`DC-40 #${'9'.repeat(61)}`)).toBe(`The serial number in "DC-40 #${'9'.repeat(61)}": Use at most 60 characters`);
    expect(parseItemsCell('DC-40 #SN/0042.b')).toEqual([{ sku: 'DC-40', quantity: 1, serialNumber: 'SN/0042.b' }]);
  });
});

describe('unreadableLine', () => {
  it('names the line of the first character a UTF-8 reader could not read', () => {
    expect(unreadableLine('a,b\r\nc,d\r\nRen\uFFFD,e\n\uFFFD')).toBe(3);
    expect(unreadableLine('\uFFFDa')).toBe(1);
    expect(unreadableLine('René,Zoë,🚐\n')).toBeNull();
  });
});
