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
import { buildBenchData } from "./bench-data";
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
  await buildBenchData(db, REPORTS);
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
