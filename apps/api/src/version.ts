import { readFileSync } from 'node:fs';

/** The version in apps/api/package.json, read once. */
export const version: string = JSON.parse(readFileSync(new URL('../package.json', import.meta.url), 'utf8')).version;
