// `npm run bench:stats`: the stats refresh and the job page at scale. Builds a throwaway database
// with 1,000,000 accepted reports over 400 models and 40 job types, then prints:
//   - a bare GROUP BY count over the same rows (the floor a refresh cannot beat),
//   - the full refresh of every cell, and its ratio to that floor,
//   - one cell's refresh after an accept (median of 20),
//   - the /jobs/:slug loader (median of 50), which reads stored cells.
// Figures only; nothing here passes or fails.
import { mkdtempSync, rmSync } from "node:fs";
import { tmpdir } from "node:os";
import path from "node:path";
import { sql } from "kysely";
import { createDb } from "../db/database";
import { migrateToLatest } from "../db/migrate";
import { startPostgres } from "./postgres";
import { freePort } from "./free-port";

const REPORTS = Number(process.env.BENCH_REPORTS ?? 1_000_000);
const dataDir = mkdtempSync(path.join(tmpdir(), "bayproof-bench-"));
const pg = await startPostgres({ dataDir, port: await freePort(), fast: true });
const db = createDb(pg.url, 4);
const ms = (t0: number) => performance.now() - t0;
const medianOf = (xs: number[]) => [...xs].sort((a, b) => a - b)[xs.length >> 1]!;

try {
  await migrateToLatest(db);
  console.log(`Building ${REPORTS.toLocaleString("en-US")} accepted reports over 400 models and 40 job types…`);
  let t0 = performance.now();
  await sql`insert into users (email, handle) values ('bench@demo.bayproof.test', 'bench-reporter')`.execute(db);
  await sql`insert into makers (slug, name) select 'bench-maker-' || i, 'Bench maker ' || i from generate_series(1, 10) i`.execute(db);
  await sql`insert into tool_categories (slug, name, action, description)
    select 'bench-cat-' || c, 'Bench category ' || c, 'percussive', 'benchmark' from generate_series(1, 4) c`.execute(db);
  await sql`insert into tool_models (slug, maker_id, category_id, model_code, name, fitting, blows_per_minute, weight_kg, length_mm, air_inlet, rated_air_lps)
    select 'bench-model-' || i, (select id from makers order by id limit 1 offset (i % 10)),
      (select id from tool_categories order by id limit 1 offset (i % 4)), 'B-' || i, 'Bench model', 'shank-0.401', 3000, 1.2, 250, '1/4 in NPT', 2
    from generate_series(1, 400) i`.execute(db);
  await sql`insert into job_types (slug, category_id, name, description)
    select 'bench-job-' || j, (select id from tool_categories order by id limit 1 offset (j % 4)), 'Bench job ' || j, 'benchmark' from generate_series(1, 40) j`.execute(db);
  await sql`
    with m as (select id, category_id, row_number() over (partition by category_id order by id) - 1 as k, count(*) over (partition by category_id) as cnt from tool_models),
         j as (select id, category_id, row_number() over (partition by category_id order by id) - 1 as k, count(*) over (partition by category_id) as cnt from job_types),
         g as (select i, (i % 4) as c, random() as u1, random() as u2, random() as u3 from generate_series(1, ${REPORTS}) i)
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
  const count = (await sql<{ n: number }>`select count(*)::int n from reports`.execute(db)).rows[0]!.n;
  console.log(`  built ${count.toLocaleString("en-US")} reports in ${(ms(t0) / 1000).toFixed(1)} s`);

  t0 = performance.now();
  await sql`select tool_model_id, job_type_id, count(*), count(*) filter (where outcome = 'freed') from reports where status = 'accepted' group by 1, 2`.execute(db);
  const floor = ms(t0);

  const { refreshAll, refreshCell } = await import("../app/stats/refresh.server");
  t0 = performance.now();
  const cells = await refreshAll(db);
  const full = ms(t0);

  const sample = await sql<{ m: number; j: number }>`select tool_model_id m, job_type_id j from stats_cells order by random() limit 20`.execute(db);
  const single: number[] = [];
  for (const c of sample.rows) {
    t0 = performance.now();
    await refreshCell(db, c.m, c.j);
    single.push(ms(t0));
  }

  process.env.DATABASE_URL = pg.url;
  const { loader } = await import("../app/routes/jobs.$slug");
  const jobs = await sql<{ slug: string }>`select slug from job_types order by id limit 10`.execute(db);
  const loads: number[] = [];
  for (let i = 0; i < 50; i++) {
    const slug = jobs.rows[i % jobs.rows.length]!.slug;
    const request = new Request(`http://127.0.0.1/jobs/${slug}`);
    t0 = performance.now();
    await loader({ request, params: { slug }, context: {} as never } as never);
    loads.push(ms(t0));
  }

  console.log("");
  console.log(`cells                          ${cells}`);
  console.log(`bare GROUP BY (floor)          ${floor.toFixed(0)} ms`);
  console.log(`full refresh of every cell     ${(full / 1000).toFixed(2)} s   (goal < 60 s; ${(full / floor).toFixed(1)}× the floor)`);
  console.log(`one cell after an accept       ${medianOf(single).toFixed(1)} ms median of 20   (goal < 100 ms)`);
  console.log(`/jobs/:slug loader             ${medianOf(loads).toFixed(1)} ms median of 50   (goal < 30 ms)`);
  process.exit(0);
} finally {
  await db.destroy();
  pg.stop();
  rmSync(dataDir, { recursive: true, force: true });
}
