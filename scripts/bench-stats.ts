// `npm run bench:stats`: the stats refresh and the job page at scale. Builds a throwaway database
// with 1,000,000 accepted reports over 400 models and 40 job types, then prints:
//   - a bare GROUP BY count over the same rows (the floor a refresh cannot beat),
//   - the full refresh of every cell (best of 3, as the floor; the first, cold, beside it) and its
//     ratio to that floor (goal ≤ 5×),
//   - one cell's refresh after an accept (median of 20; goal < 50 ms),
//   - the /jobs/:slug loader (median of 50), which reads stored cells.
// Figures only; nothing here passes or fails. The PostgreSQL it starts is stopped and its folder
// deleted however the run ends (an error, Ctrl-C, a kill).
import { sql } from "kysely";
import { buildBenchData } from "./bench-data";
import { benchCluster } from "./bench-cluster";

const REPORTS = Number(process.env.BENCH_REPORTS ?? 1_000_000);
const ms = (t0: number) => performance.now() - t0;
const medianOf = (xs: number[]) => [...xs].sort((a, b) => a - b)[xs.length >> 1]!;

await benchCluster(async ({ db, url }) => {
  console.log(`Building ${REPORTS.toLocaleString("en-US")} accepted reports over 400 models and 40 job types…`);
  let t0 = performance.now();
  await buildBenchData(db, REPORTS);
  await sql`analyze reports`.execute(db);
  const count = (await sql<{ n: number }>`select count(*)::int n from reports`.execute(db)).rows[0]!.n;
  console.log(`  built ${count.toLocaleString("en-US")} reports in ${(ms(t0) / 1000).toFixed(1)} s`);

  // The floor: the best of three, so a cold cache does not flatter the ratio.
  const floors: number[] = [];
  for (let i = 0; i < 3; i++) {
    t0 = performance.now();
    await sql`select tool_model_id, job_type_id, count(*), count(*) filter (where outcome = 'freed') from reports where status = 'accepted' group by 1, 2`.execute(
      db,
    );
    floors.push(ms(t0));
  }
  const floor = Math.min(...floors);

  const { refreshAll, refreshCell } = await import("../app/stats/refresh.server");
  // As the floor: the best of three, the first (cold: JIT, caches) printed beside it.
  const fulls: number[] = [];
  let cells = 0;
  for (let i = 0; i < 3; i++) {
    t0 = performance.now();
    cells = await refreshAll(db);
    fulls.push(ms(t0));
  }
  const full = Math.min(...fulls);

  const sample = await sql<{
    m: number;
    j: number;
  }>`select tool_model_id m, job_type_id j from stats_cells order by random() limit 20`.execute(db);
  const single: number[] = [];
  for (const c of sample.rows) {
    t0 = performance.now();
    await refreshCell(db, c.m, c.j);
    single.push(ms(t0));
  }

  process.env.DATABASE_URL = url;
  const { loader } = await import("../app/routes/jobs.$slug");
  const { db: appDb } = await import("../app/db.server");
  const { withSessions } = await import("../app/auth/session.server");
  const jobs = await sql<{ slug: string }>`select slug from job_types order by id limit 10`.execute(db);
  const loads: number[] = [];
  for (let i = 0; i < 50; i++) {
    const slug = jobs.rows[i % jobs.rows.length]!.slug;
    const request = new Request(`http://127.0.0.1/jobs/${slug}`);
    t0 = performance.now();
    // As the root middleware serves it: the guards read the session through withSessions.
    await withSessions(appDb, () => loader({ request, params: { slug }, context: {} as never } as never));
    loads.push(ms(t0));
  }
  await appDb.destroy();

  console.log("");
  console.log(`cells                          ${cells}`);
  console.log(`bare GROUP BY (floor)          ${floor.toFixed(0)} ms (best of 3)`);
  console.log(
    `full refresh of every cell     ${(full / 1000).toFixed(2)} s   (${(full / floor).toFixed(1)}× the floor; goal ≤ 5×) best of 3; the first ${(fulls[0]! / 1000).toFixed(2)} s`,
  );
  console.log(`one cell after an accept       ${medianOf(single).toFixed(1)} ms median of 20   (goal < 50 ms)`);
  console.log(`/jobs/:slug loader             ${medianOf(loads).toFixed(1)} ms median of 50   (goal < 30 ms)`);
});
