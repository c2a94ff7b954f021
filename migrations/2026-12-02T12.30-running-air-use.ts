import { type Kysely, sql } from "kysely";

// Frozen: never edit after it has landed; add a new migration instead.
// A tool model's second air figure (issue 17): the use while running (hammering, impacting), free
// air in l/s at 90 psi (6.2 bar) inlet, beside the average a maker states (rated_air_lps). Where it
// came from: the maker's sheet, measured, or estimated as the average times a stated factor.
// Null: not known yet (the supply calculations then estimate it and say so).
export async function up(db: Kysely<any>): Promise<void> {
  await sql`alter table tool_models
    add column running_air_lps double precision check (running_air_lps > 0 and running_air_lps < 400),
    add column running_air_source text check (running_air_source in ('maker_sheet', 'measured', 'estimated')),
    add column running_air_factor double precision check (running_air_factor >= 1 and running_air_factor <= 10),
    add constraint tool_models_running_air_sourced check (case
      when running_air_lps is null then running_air_source is null and running_air_factor is null
      when running_air_source = 'estimated' then running_air_factor is not null
      when running_air_source in ('maker_sheet', 'measured') then running_air_factor is null
      else false end)`.execute(db);
}

export async function down(db: Kysely<any>): Promise<void> {
  await sql`alter table tool_models drop constraint tool_models_running_air_sourced,
    drop column running_air_lps, drop column running_air_source, drop column running_air_factor`.execute(db);
}
