// Synthetic data for the benchmarks: 400 models in 4 categories, 40 job types, `reports` accepted
// reports spread evenly over each category's models and jobs.
import { type Kysely, sql } from "kysely";
import type { Database } from "../db/schema";

export async function buildBenchData(db: Kysely<Database>, reports: number) {
  await sql`insert into users (email, handle) values ('bench@demo.bayproof.test', 'bench-reporter')`.execute(db);
  await sql`insert into makers (slug, name) select 'bench-maker-' || i, 'Bench maker ' || i from generate_series(1, 10) i`.execute(
    db,
  );
  await sql`insert into tool_categories (slug, name, action, description)
    select 'bench-cat-' || c, 'Bench category ' || c, 'percussive', 'benchmark' from generate_series(1, 4) c`.execute(
    db,
  );
  await sql`insert into tool_models (slug, maker_id, category_id, model_code, name, fitting, blows_per_minute, weight_kg, length_mm, air_inlet, rated_air_lps)
    select 'bench-model-' || i, (select id from makers order by id limit 1 offset (i % 10)),
      (select id from tool_categories order by id limit 1 offset (i % 4)), 'B-' || i, 'Bench model', 'shank-0.401', 3000, 1.2, 250, '1/4 in NPT', 2
    from generate_series(1, 400) i`.execute(db);
  await sql`insert into job_types (slug, category_id, name, description)
    select 'bench-job-' || j, (select id from tool_categories order by id limit 1 offset (j % 4)), 'Bench job ' || j, 'benchmark' from generate_series(1, 40) j`.execute(
    db,
  );
  await sql`
    with m as (select id, category_id, row_number() over (partition by category_id order by id) - 1 as k, count(*) over (partition by category_id) as cnt from tool_models),
         j as (select id, category_id, row_number() over (partition by category_id order by id) - 1 as k, count(*) over (partition by category_id) as cnt from job_types),
         g as (select i, (i % 4) as c, random() as u1, random() as u2, random() as u3 from generate_series(1, ${reports}) i)
    insert into reports (reporter_id, tool_model_id, category_id, job_type_id, status, vehicle_class, corrosion_level, regulator_kpa, inlet_kpa,
      inlet_source, hose_id_mm, hose_length_m, coupler_count, outcome, time_to_result_s, attempts, submitted_at, decided_at, accepted_at)
    select (select id from users limit 1), m.id, m.category_id, j.id, 'accepted', 'passenger_car', 'moderate', 750, 450 + g.u1 * 350,
      (array['measured_at_inlet','read_at_regulator','estimated'])[1 + (g.i % 3)], 9.5, 15, 2,
      case when g.u2 < 1 / (1 + exp(-((450 + g.u1 * 350) - 600) / 80)) then 'freed' else 'not_freed' end,
      greatest(1, least(28800, round(exp(3 + 1.2 * (g.u3 - 0.5) * 2)))), 1, now(), now(), now()
    from g
    join m on m.category_id = (select id from tool_categories order by id limit 1 offset g.c) and m.k = (g.i / 4) % m.cnt
    join j on j.category_id = m.category_id and j.k = (g.i / 1601) % j.cnt`.execute(db);
  await sql`analyze reports`.execute(db);
}
