import { type Kysely, sql } from "kysely";

// Frozen: never edit after it has landed; add a new migration instead.
// A draft may be withdrawn as it stands, so a withdrawn report that was never submitted may be
// incomplete too. Anything that was ever submitted (submitted_at set) still carries the whole job.
const COMPLETE = sql`vehicle_class is not null and corrosion_level is not null and regulator_kpa is not null
  and inlet_kpa is not null and inlet_source is not null and hose_id_mm is not null
  and hose_length_m is not null and coupler_count is not null and outcome is not null
  and time_to_result_s is not null and attempts is not null and submitted_at is not null`;

export async function up(db: Kysely<any>): Promise<void> {
  await sql`alter table reports drop constraint reports_complete_unless_draft`.execute(db);
  await sql`alter table reports add constraint reports_complete_unless_draft check (
    status = 'draft' or (status = 'withdrawn' and submitted_at is null) or (${COMPLETE}))`.execute(db);
}

export async function down(db: Kysely<any>): Promise<void> {
  await sql`alter table reports drop constraint reports_complete_unless_draft`.execute(db);
  await sql`alter table reports add constraint reports_complete_unless_draft check (status = 'draft' or (${COMPLETE}))`.execute(
    db,
  );
}
