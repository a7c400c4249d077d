import { sql } from 'kysely';

/** SQLite's LIKE has no escape character unless a query names one: `\` here, so % and _ are literal. */
const literal = (text: string) => text.replace(/[\\%_]/g, (c) => `\\${c}`);

/** `column` contains `text`, in any case (LIKE ignores the case of ASCII letters). */
export const contains = (column: string, text: string) => sql<boolean>`${sql.ref(column)} like ${`%${literal(text)}%`} escape '\\'`;

/** `column` starts with `text`, in any case. */
export const startsWith = (column: string, text: string) => sql<boolean>`${sql.ref(column)} like ${`${literal(text)}%`} escape '\\'`;
