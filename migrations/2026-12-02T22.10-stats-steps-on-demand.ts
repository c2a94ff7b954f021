import { type Kysely, sql } from "kysely";

// Frozen: never edit after it has landed; add a new migration instead.
// A cell's Kaplan–Meier steps were stored with its figures, though only /compare draws them, for
// two to four tools at a time. They were half of what a full refresh wrote (issue 16's refresh
// cost); /compare now works them out from the compared cells' reports when it is asked.
export async function up(db: Kysely<any>): Promise<void> {
  await sql`alter table stats_cells drop column km_steps`.execute(db);
}

export async function down(db: Kysely<any>): Promise<void> {
  await sql`alter table stats_cells add column km_steps jsonb check (km_steps is null or jsonb_typeof(km_steps) = 'array')`.execute(
    db,
  );
}
