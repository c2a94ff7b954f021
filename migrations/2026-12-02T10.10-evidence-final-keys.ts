import { type Kysely, sql } from "kysely";

// Frozen: never edit after it has landed; add a new migration instead.
// Checked evidence lives under a key no presigned upload URL is ever signed for: uploads go to
// uploads/…, and completion copies the checked file elsewhere (evidence/…) before recording it.
// The database refuses a checked row that still points into uploads/.
export async function up(db: Kysely<any>): Promise<void> {
  await sql`alter table evidence add constraint evidence_checked_not_in_uploads
    check (status = 'pending' or object_key not like 'uploads/%')`.execute(db);
}

export async function down(db: Kysely<any>): Promise<void> {
  await sql`alter table evidence drop constraint evidence_checked_not_in_uploads`.execute(db);
}
