import { type Kysely, sql } from "kysely";

// Frozen: never edit after it has landed; add a new migration instead.
// The open data's daily snapshots: one row per snapshot, naming its two gzipped files in object
// storage with their sizes and SHA-256, so pages and downloads know the latest without listing
// the bucket.
export async function up(db: Kysely<any>): Promise<void> {
  await sql`create table feed_snapshots (
    id integer generated always as identity primary key,
    created_at timestamptz not null default now(),
    report_count integer not null check (report_count >= 0),
    ndjson_key text not null unique check (ndjson_key like 'snapshots/%.ndjson.gz'),
    ndjson_bytes bigint not null check (ndjson_bytes > 0),
    ndjson_sha256 text not null check (ndjson_sha256 ~ '^[0-9a-f]{64}$'),
    csv_key text not null unique check (csv_key like 'snapshots/%.csv.gz'),
    csv_bytes bigint not null check (csv_bytes > 0),
    csv_sha256 text not null check (csv_sha256 ~ '^[0-9a-f]{64}$')
  )`.execute(db);
  await sql`create index feed_snapshots_created_at_idx on feed_snapshots (created_at desc)`.execute(db);
}

export async function down(db: Kysely<any>): Promise<void> {
  await sql`drop table feed_snapshots`.execute(db);
}
