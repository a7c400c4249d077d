import { z } from 'zod';
// Loading messages.ts sets zod's error map, so every schema's failures read in plain words.
export { plainMessage } from './messages.ts';

/** A positive integer id taken from a path or query string. */
const ID_WORDS = 'Use an id: a whole number above 0';
/** Decimal digits only: a plain number coercion would also take `0x10`, `0o7`, `+2713` and `2.713e3` to a record. */
const ID_DIGITS = /^[1-9][0-9]{0,14}$/;
export const idSchema = z
  .union([z.number(), z.string()], { error: ID_WORDS })
  .refine((v) => (typeof v === 'number' ? Number.isSafeInteger(v) && v > 0 : ID_DIGITS.test(v)), { error: ID_WORDS })
  .transform(Number);
export const idParams = z.strictObject({ id: idSchema });

/** For routes that take no query: any parameter is an unknown field. */
export const noQuery = z.strictObject({});

export const emailSchema = z
  .string()
  .trim()
  .toLowerCase()
  .pipe(z.email({ error: 'Enter a valid e-mail address' }).max(254));

/** A one-line field (a name, an address line, a SKU) holds no line break or tab. */
const ONE_LINE = /^[^\r\n]*$/u;
/**
 * No C0 or C1 control character (NUL and the rest, and DEL) except a tab or line break, and no
 * lone half of a surrogate pair: none can be typed, and some cut text short in other programs.
 */
const NO_CONTROL = /^[^\u0000-\u0008\u000b\u000c\u000e-\u001f\u007f-\u009f\u{d800}-\u{dfff}]*$/u;
const NO_TAB = /^[^\t]*$/u;
const CONTROL_WORDS = 'Take out the invisible control characters (such as NUL) pasted into this text';
const atMost = (max: number) => `Use at most ${max} characters`;

/** One line of text that may be left empty: trimmed, at most `max` characters, no control characters. */
export const optionalText = (max: number) =>
  z.string().trim().max(max, atMost(max)).regex(ONE_LINE, 'Keep this to one line').regex(NO_TAB, 'Take out the tab characters').regex(NO_CONTROL, CONTROL_WORDS);

/** One line of text that must be filled in: as `optionalText`, and blank after trimming is refused with `blank`. */
export const text = (max: number, blank = 'Fill this in') => optionalText(max).min(1, blank);

/**
 * Text of several lines (notes, symptoms, reasons): line breaks and tabs kept, other control
 * characters refused; required (refused when blank) only when `blank` says what to ask for.
 */
export function multilineText(max: number, blank?: string) {
  const schema = z.string().trim().max(max, atMost(max)).regex(NO_CONTROL, CONTROL_WORDS);
  return blank ? schema.min(1, blank) : schema;
}

export const personNameSchema = text(120, 'Enter a name');

/** Passwords: long rather than clever (NIST SP 800-63B asks for at least 8; we ask 12). */
export const newPasswordSchema = z
  .string()
  .min(12, 'Use at least 12 characters')
  .max(200, 'Use at most 200 characters');

/** The most rows one page of any list answers with. */
export const MAX_PAGE_SIZE = 200;

/**
 * Lists count matching rows up to this many and then say "more than" (`totalCapped`), and page
 * numbers reach this far; past it a list is read with `cursor`, each page naming the next.
 */
export const COUNT_CAP = 10_000;

/**
 * A text search lists at most this many matches, newest first, and then says "more than": a
 * common name matches thousands of builds in a large network, and no one pages through them
 * (the screen asks for more of the name instead).
 */
export const SEARCH_CAP = 1_000;

/** `page` and `pageSize` of a list, with its own largest page where smaller than MAX_PAGE_SIZE; a page of a report may hold shops instead of rows. */
export const pagingOf = (maxPageSize = MAX_PAGE_SIZE, defaultPageSize = 50, [one, many] = ['row', 'rows']) => ({
  page: z.coerce.number().int().min(1).default(1),
  pageSize: z.coerce
    .number()
    .int()
    .min(1, `At least 1 ${one} per page`)
    .max(maxPageSize, `At most ${maxPageSize} ${many} per page`)
    .default(Math.min(defaultPageSize, maxPageSize)),
});

export const pageQuery = pagingOf();

/** Where the previous page ended (its `nextCursor`); the page number is then ignored. */
export const cursorQuery = { cursor: z.string().max(400).optional() };

export interface Page<T> {
  items: T[];
  /** How many rows match, counted up to COUNT_CAP. */
  total: number;
  /** True when more than `total` rows match: the count stopped at COUNT_CAP. */
  totalCapped: boolean;
  page: number;
  pageSize: number;
  /** On lists read by cursor: what to pass as `cursor` for the rows after this page, or null at the end. */
  nextCursor?: string | null;
}

/** The one error shape every failed request answers with. */
export interface ApiError {
  error: { code: string; message: string; fields?: Record<string, string> };
}
