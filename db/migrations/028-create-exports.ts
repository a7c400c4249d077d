import { sql, type Kysely } from 'kysely';

/**
 * The export history: each export asked for (who, when, which months and shops, which format),
 * how far its job got, and the file it made with its SHA-256, so it can be downloaded again and
 * checked. The file itself lives in the data folder (exports/<id>.<format>).
 */
export async function up(db: Kysely<any>): Promise<void> {
  await sql`create table exports (
    id integer primary key,
    kind text not null,
    month text not null,
    through_month text not null,
    location_ids text,
    scope_label text not null,
    location_count integer not null,
    format text not null check (format in ('xlsx', 'csv')),
    sheet text,
    status text not null check (status in ('queued', 'running', 'done', 'failed')),
    rows_done integer not null default 0,
    rows_total integer,
    error text,
    file_name text,
    file_bytes integer,
    checksum text,
    created_by integer not null references users (id),
    created_at text not null,
    finished_at text
  )`.execute(db);
  await sql`create index exports_created_by on exports (created_by, id)`.execute(db);
}

export async function down(db: Kysely<any>): Promise<void> {
  await sql`drop table exports`.execute(db);
}
