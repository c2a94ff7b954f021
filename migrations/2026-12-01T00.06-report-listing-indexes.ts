import { type Kysely, sql } from "kysely";

// Frozen: never edit after it has landed; add a new migration instead.
// The newest accepted reports of one job or one model, read by their pages at any table size.
export async function up(db: Kysely<any>): Promise<void> {
  await sql`create index reports_job_recent_idx on reports (job_type_id, accepted_at desc, id desc) where status = 'accepted'`.execute(
    db,
  );
  await sql`create index reports_model_recent_idx on reports (tool_model_id, accepted_at desc, id desc) where status = 'accepted'`.execute(
    db,
  );
}

export async function down(db: Kysely<any>): Promise<void> {
  await sql`drop index reports_model_recent_idx`.execute(db);
  await sql`drop index reports_job_recent_idx`.execute(db);
}
