import { COUNT_CAP } from '@busbar/shared';
import { sql, type Expression, type SqlBool } from 'kysely';

/** SQLite's LIKE has no escape character unless a query names one: `\` here, so % and _ are literal. */
const literal = (text: string) => text.replace(/[\\%_]/g, (c) => `\\${c}`);

/** `column` contains `text`, in any case (LIKE ignores the case of ASCII letters). */
export const contains = (column: string, text: string) => sql<boolean>`${sql.ref(column)} like ${`%${literal(text)}%`} escape '\\'`;

/** `column` starts with `text`, in any case. */
export const startsWith = (column: string, text: string) => sql<boolean>`${sql.ref(column)} like ${`${literal(text)}%`} escape '\\'`;

/** The trigram index finds any run of 3 or more characters; shorter text is looked for row by row. */
export const TRIGRAM_LENGTH = 3;

/** Text looked for row by row is counted only this far (then "more than"): each row costs a match. */
export const SCAN_COUNT_CAP = 1_000;

/** The count cap of a list searched for `text`. */
export const countCapFor = (text: string | undefined) => (text && [...text].length < TRIGRAM_LENGTH ? SCAN_COUNT_CAP : COUNT_CAP);

/**
 * Customers (by `idColumn`) whose `column` (name, email or phone) contains `text`, in any case:
 * through the FTS5 trigram index `customer_search` from 3 characters, with LIKE below that.
 */
export function customerTextMatches(idColumn: string, column: 'name' | 'email' | 'phone', text: string): Expression<SqlBool> {
  if ([...text].length < TRIGRAM_LENGTH) return contains(column, text);
  const query = `${column} : "${text.replaceAll('"', '""')}"`;
  return sql<SqlBool>`${sql.ref(idColumn)} in (select rowid from customer_search where customer_search match ${query})`;
}

/**
 * Builds (by `idColumn`) whose number, customer name, vehicle or a serial number contains `text`,
 * in any case. From 3 characters the FTS5 trigram index `build_search` answers; shorter text is
 * matched with LIKE against the same text (`build_search_source`) as the sort order reaches each build.
 */
export function buildTextMatches(idColumn: string, text: string): Expression<SqlBool> {
  const id = sql.ref(idColumn);
  if ([...text].length >= TRIGRAM_LENGTH) {
    const phrase = `"${text.replaceAll('"', '""')}"`;
    return sql<SqlBool>`${id} in (select rowid from build_search where build_search match ${phrase})`;
  }
  const like = `%${literal(text)}%`;
  return sql<SqlBool>`exists (select 1 from build_search_source s where s.id = ${id} and (s.number like ${like} escape '\\'
    or s.customer like ${like} escape '\\' or s.vehicle like ${like} escape '\\' or s.serials like ${like} escape '\\'))`;
}
