import { type Kysely, sql } from "kysely";

// Frozen: never edit after it has landed; add a new migration instead.
// Each submission of a report keeps a snapshot, so moderators see what changed between versions.
export async function up(db: Kysely<any>): Promise<void> {
  await sql`
    create table report_versions (
      report_id integer not null references reports (id) on delete cascade,
      version integer not null check (version >= 1),
      snapshot jsonb not null check (jsonb_typeof(snapshot) = 'object'),
      created_at timestamptz not null default now(),
      primary key (report_id, version)
    )
  `.execute(db);
  await sql`
    create trigger report_versions_no_rewrite before update or truncate on report_versions
    for each statement execute function append_only()
  `.execute(db);
  // Uploads waiting for their completion check, for the clean-up job.
  await sql`create index evidence_pending_idx on evidence (created_at) where status <> 'verified'`.execute(db);
}

export async function down(db: Kysely<any>): Promise<void> {
  await sql`drop index evidence_pending_idx`.execute(db);
  await sql`drop table report_versions`.execute(db);
}
