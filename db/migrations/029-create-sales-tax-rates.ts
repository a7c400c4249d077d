import { sql, type Kysely } from 'kysely';

/**
 * Sales tax rates with the month they apply from, which the owner sets for each location: the
 * rate (basis points) on the parts sold, and whether the location's jurisdiction taxes labor too.
 * A month's close takes the rate in force that month; a location with none charges no sales tax.
 */
export async function up(db: Kysely<any>): Promise<void> {
  await sql`create table sales_tax_rates (
    id integer primary key,
    location_id integer not null references locations (id),
    applies_from text not null check (applies_from glob '[0-9][0-9][0-9][0-9]-[0-1][0-9]'),
    basis_points integer not null check (basis_points between 0 and 10000),
    labor_taxed integer not null check (labor_taxed in (0, 1)),
    created_by integer references users (id),
    created_at text not null,
    unique (location_id, applies_from)
  )`.execute(db);
}

export async function down(db: Kysely<any>): Promise<void> {
  await sql`drop table sales_tax_rates`.execute(db);
}
