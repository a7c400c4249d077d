import { sql, type Kysely } from 'kysely';

/**
 * What tells one vehicle from another and how far it has gone: the VIN (17 characters, checked
 * by the API), the licence plate, and the odometer in miles with the local day it was read.
 * All optional: vehicles on file before this have none until someone records them.
 */
export async function up(db: Kysely<any>): Promise<void> {
  await sql`alter table vehicles add column vin text check (vin is null or length(vin) = 17)`.execute(db);
  await sql`alter table vehicles add column plate text check (plate is null or length(plate) between 1 and 12)`.execute(db);
  await sql`alter table vehicles add column mileage integer check (mileage is null or mileage between 0 and 2000000)`.execute(db);
  await sql`alter table vehicles add column mileage_read_on text check (mileage_read_on is null or mileage_read_on glob '[0-9][0-9][0-9][0-9]-[0-1][0-9]-[0-3][0-9]')`.execute(db);
}

export async function down(db: Kysely<any>): Promise<void> {
  for (const column of ['mileage_read_on', 'mileage', 'plate', 'vin']) {
    await sql`alter table vehicles drop column ${sql.ref(column)}`.execute(db);
  }
}
