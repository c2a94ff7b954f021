import { type Kysely, sql } from "kysely";

// Frozen: never edit after it has landed; add a new migration instead.
// Public pages show the catalogue and the stored bench figures, and every app process keeps
// anonymous renders until a NOTIFY on bayproof_pages (app/http-cache). Reports and stats cells
// notify from the code that changes them; the catalogue changes from scripts, seeds and by hand in
// psql, and the bench figures from a background refresh, so here the database itself tells the
// processes: one NOTIFY per statement that changes one of these tables, sent when (and only if)
// the transaction commits, whoever made the change.
const CATALOGUE = ["makers", "tool_categories", "tool_models", "job_types"];
const BENCH = [
  "bench_pooled_figures",
  "bench_job_force",
  "bench_pressure_slopes",
  "bench_rig_agreement",
  "bench_rig_bias",
];

export async function up(db: Kysely<any>): Promise<void> {
  await sql`
    create function notify_pages_changed() returns trigger language plpgsql as $$
    begin
      perform pg_notify('bayproof_pages', tg_argv[0]);
      return null;
    end
    $$`.execute(db);
  for (const [tables, what] of [
    [CATALOGUE, "catalogue"],
    [BENCH, "bench"],
  ] as const) {
    for (const table of tables) {
      await sql`
        create trigger ${sql.id(`${table}_pages_changed`)}
        after insert or update or delete or truncate on ${sql.table(table)}
        for each statement execute function notify_pages_changed(${sql.lit(what)})`.execute(db);
    }
  }
}

export async function down(db: Kysely<any>): Promise<void> {
  for (const table of [...CATALOGUE, ...BENCH])
    await sql`drop trigger if exists ${sql.id(`${table}_pages_changed`)} on ${sql.table(table)}`.execute(db);
  await sql`drop function if exists notify_pages_changed()`.execute(db);
}
