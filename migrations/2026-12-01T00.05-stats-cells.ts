import { type Kysely, sql } from "kysely";

// Frozen: never edit after it has landed; add a new migration instead.
// One row per (tool model, job type) with accepted reports: the figures the pages read, refreshed
// by the background worker when a report in the cell is accepted.
export async function up(db: Kysely<any>): Promise<void> {
  await sql`
    create table stats_cells (
      tool_model_id integer not null references tool_models (id) on delete cascade,
      job_type_id integer not null references job_types (id) on delete cascade,
      n integer not null check (n >= 1),
      successes integer not null check (successes between 0 and n),
      estimate double precision not null check (estimate between 0 and 1),
      lower double precision not null check (lower between 0 and 1),
      upper double precision not null check (upper between 0 and 1),
      shrunk_estimate double precision check (shrunk_estimate between 0 and 1),
      shrunk_lower double precision check (shrunk_lower between 0 and 1),
      shrunk_upper double precision check (shrunk_upper between 0 and 1),
      time_n integer not null default 0 check (time_n >= 0),
      time_median_s double precision check (time_median_s > 0),
      time_lower_s double precision check (time_lower_s > 0),
      time_upper_s double precision check (time_upper_s > 0),
      adj_estimate double precision check (adj_estimate between 0 and 1),
      adj_lower double precision check (adj_lower between 0 and 1),
      adj_upper double precision check (adj_upper between 0 and 1),
      adj_reason text,
      fit jsonb check (fit is null or jsonb_typeof(fit) = 'object'),
      measured_share double precision not null check (measured_share between 0 and 1),
      estimated_share double precision not null check (estimated_share between 0 and 1),
      confidence double precision not null default 0.95 check (confidence > 0 and confidence < 1),
      computed_at timestamptz not null default now(),
      primary key (tool_model_id, job_type_id),
      check (lower <= estimate and estimate <= upper),
      check ((adj_estimate is null) <> (adj_reason is null))
    )
  `.execute(db);
  await sql`create index stats_cells_job_idx on stats_cells (job_type_id, lower desc)`.execute(db);
}

export async function down(db: Kysely<any>): Promise<void> {
  await sql`drop table stats_cells`.execute(db);
}
