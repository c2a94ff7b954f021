import { type Kysely, sql } from "kysely";

// Frozen: never edit after it has landed; add a new migration instead.
// Issue 16: the stored figures of the second edition. Rates are clustered by reporter (design
// effect), reports run above the tool's rated inlet are set aside and counted, times carry the
// order-statistic interval with its achieved coverage and the Kaplan–Meier median counting give-ups,
// and one pooled pressure fit per job type (stats_jobs) gives each model's figure at 90 psi.
export async function up(db: Kysely<any>): Promise<void> {
  // The stored figures are worked out anew (prepare-db refreshes an empty table on the next start).
  await sql`delete from stats_cells`.execute(db);
  await sql`
    alter table stats_cells
      add column reporters integer not null default 1 check (reporters >= 1),
      add column design_effect double precision not null default 1 check (design_effect >= 1),
      add column effective_n double precision check (effective_n > 0),
      add column set_aside integer not null default 0 check (set_aside >= 0),
      add column time_coverage double precision check (time_coverage > 0 and time_coverage <= 1),
      add column km_n integer not null default 0 check (km_n >= 0),
      add column km_median_s double precision check (km_median_s >= 0),
      add column km_lower_s double precision check (km_lower_s >= 0),
      add column km_upper_s double precision check (km_upper_s >= 0),
      add column km_steps jsonb check (km_steps is null or jsonb_typeof(km_steps) = 'array'),
      add constraint stats_cells_time_interval_has_coverage check ((time_lower_s is null) = (time_coverage is null))
  `.execute(db);
  await sql`
    create table stats_jobs (
      job_type_id integer primary key references job_types (id) on delete cascade,
      fit_n integer not null default 0 check (fit_n >= 0),
      fit_models integer not null default 0 check (fit_models >= 0),
      slope double precision,
      slope_se double precision check (slope_se > 0),
      converged boolean not null default false,
      fit_reason text,
      set_aside integer not null default 0 check (set_aside >= 0),
      prior_alpha double precision check (prior_alpha > 0),
      prior_beta double precision check (prior_beta > 0),
      computed_at timestamptz not null default now(),
      check ((slope is null) = (slope_se is null)),
      check ((slope is null) <> (fit_reason is null))
    )
  `.execute(db);
}

export async function down(db: Kysely<any>): Promise<void> {
  await sql`drop table stats_jobs`.execute(db);
  await sql`
    alter table stats_cells
      drop constraint stats_cells_time_interval_has_coverage,
      drop column reporters, drop column design_effect, drop column effective_n, drop column set_aside,
      drop column time_coverage, drop column km_n, drop column km_median_s, drop column km_lower_s,
      drop column km_upper_s, drop column km_steps
  `.execute(db);
}
