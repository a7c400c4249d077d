import type { Kysely } from 'kysely';
import { BUILDS, create, drop, type SearchIndex } from './015-add-search-places.ts';

/** `text` with `from` replaced by `to`, which must be there: the index below is 015's with two columns more. */
export function edited(text: string, from: string, to: string): string {
  if (!text.includes(from)) throw new Error(`"${from}" is not in the build search index it edits`);
  return text.replace(from, to);
}

/**
 * Builds are also found by their vehicle's VIN and licence plate (migration 034), the numbers a
 * customer or a claim quotes. Each is a column of its own, so a search does not match across the
 * model's end and the VIN's start. The index is made again from its view: 46 s, once, on the
 * 200-shop network (1 million builds).
 */
export const WITH_VIN_AND_PLATE: SearchIndex = {
  ...BUILDS,
  columns: edited(BUILDS.columns, 'vehicle,', 'vehicle, vin, plate,'),
  source: edited(BUILDS.source, 'as vehicle,', `as vehicle, coalesce(v.vin, '') as vin, coalesce(v.plate, '') as plate,`),
  triggers: BUILDS.triggers.map(([name, when, change]) => [
    name,
    name.startsWith('build_search_vehicle_') ? edited(when, 'year, make, model on vehicles', 'year, make, model, vin, plate on vehicles') : when,
    change,
  ]),
};

export async function up(db: Kysely<any>): Promise<void> {
  await drop(db, BUILDS.table, BUILDS.view);
  await create(db, WITH_VIN_AND_PLATE);
}

export async function down(db: Kysely<any>): Promise<void> {
  await drop(db, BUILDS.table, BUILDS.view);
  await create(db, BUILDS);
}
