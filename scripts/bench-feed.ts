// `npm run bench:feed`: the NDJSON dump of the open feed at scale. Builds a throwaway database
// with 1,000,000 accepted reports (BENCH_REPORTS to change it), serves a production build, and
// prints, for the same rows in the same order:
//   - psql's \copy of the dump's own query to /dev/null (the floor: PostgreSQL alone),
//   - GET /api/v1/reports.ndjson through the server, without compression,
//   - their ratio (goal: at least 0.3), and the server's peak resident memory while it streamed
//     (goal: under 300 MB).
// SERVER_FLAGS passes node flags to the server (e.g. "--cpu-prof --cpu-prof-dir=/tmp/prof").
// Figures only; nothing here passes or fails.
import { spawn, spawnSync } from "node:child_process";
import { mkdtempSync, readFileSync, rmSync } from "node:fs";
import http from "node:http";
import { tmpdir } from "node:os";
import path from "node:path";
import { sql } from "kysely";
import { createDb } from "../db/database";
import { migrateToLatest } from "../db/migrate";
import { buildBenchData } from "./bench-data";
import { freePort } from "./free-port";
import { startPostgres } from "./postgres";
import { waitForHttp } from "./wait-http";

const REPORTS = Number(process.env.BENCH_REPORTS ?? 1_000_000);
const root = path.resolve(import.meta.dirname, "..");
const dataDir = mkdtempSync(path.join(tmpdir(), "bayproof-bench-"));
const pg = await startPostgres({ dataDir, port: await freePort(), fast: true });
const db = createDb(pg.url, 4);
const port = await freePort();
const origin = `http://127.0.0.1:${port}`;
let server: ReturnType<typeof spawn> | null = null;
const seconds = (t0: number) => (performance.now() - t0) / 1000;
const fmt = (n: number) => Math.round(n).toLocaleString("en-US");
const rssMb = (pid: number, field: "VmRSS" | "VmHWM") =>
  Number(readFileSync(`/proc/${pid}/status`, "utf8").match(new RegExp(`${field}:\\s+(\\d+) kB`))?.[1] ?? 0) / 1024;

try {
  await migrateToLatest(db);
  console.log(`Building ${fmt(REPORTS)} accepted reports…`);
  let t0 = performance.now();
  await buildBenchData(db, REPORTS);
  await sql`vacuum analyze reports`.execute(db);
  console.log(`  built in ${seconds(t0).toFixed(1)} s`);
  const { createApiKey } = await import("../app/auth/api-keys.server");
  const user = await db.selectFrom("users").select("id").executeTakeFirstOrThrow();
  const key = await createApiKey(db, user.id, "bench");

  // The floor: psql's \copy of the dump's own query (the same rows, in the same order) to /dev/null.
  const { bulkQuery } = await import("../app/feed/queries.server");
  const q = bulkQuery(db, origin, "ndjson");
  const inline = q.sql
    .replace(/\$(\d+)/g, (_, i) => `'${String(q.parameters[Number(i) - 1]).replace(/'/g, "''")}'`)
    .replace(/\s+/g, " ");
  t0 = performance.now();
  const copy = spawnSync("psql", [pg.url, "-q", "-c", `\\copy (${inline}) to '/dev/null'`], { encoding: "utf8" });
  if (copy.status !== 0) throw new Error(`psql failed: ${copy.stderr}`);
  const floorS = seconds(t0);

  console.log("Building and starting the server…");
  const build = spawnSync(path.join(root, "node_modules/.bin/react-router"), ["build"], {
    cwd: root,
    encoding: "utf8",
  });
  if (build.status !== 0) throw new Error(`build failed:\n${build.stderr}`);
  server = spawn(
    process.execPath,
    [...(process.env.SERVER_FLAGS ? process.env.SERVER_FLAGS.split(" ") : []), "server.js"],
    {
      cwd: root,
      stdio: ["ignore", "ignore", "inherit"],
      env: {
        ...process.env,
        DATABASE_URL: pg.url,
        PORT: String(port),
        HOST: "127.0.0.1",
        APP_ORIGIN: origin,
        NODE_ENV: "production",
        // One process: the figures below are this process's memory and CPU.
        WEB_CONCURRENCY: "1",
      },
    },
  );
  await waitForHttp(`${origin}/api/v1`, server);
  const pid = server.pid!;
  const idleMb = rssMb(pid, "VmRSS");

  let peakMb = idleMb;
  const sampler = setInterval(() => (peakMb = Math.max(peakMb, rssMb(pid, "VmRSS"))), 50);
  t0 = performance.now();
  const { lines, bytes } = await new Promise<{ lines: number; bytes: number }>((resolve, reject) => {
    http
      .get(`${origin}/api/v1/reports.ndjson`, { headers: { authorization: `Bearer ${key}` } }, (res) => {
        if (res.statusCode !== 200) return reject(new Error(`dump answered ${res.statusCode}`));
        let lines = 0;
        let bytes = 0;
        res.on("data", (chunk: Buffer) => {
          bytes += chunk.length;
          for (let i = chunk.indexOf(10); i !== -1; i = chunk.indexOf(10, i + 1)) lines++;
        });
        res.on("end", () => resolve({ lines, bytes }));
        res.on("error", reject);
      })
      .on("error", reject);
  });
  const dumpS = seconds(t0);
  clearInterval(sampler);
  peakMb = Math.max(peakMb, rssMb(pid, "VmRSS"));

  // Pages: a walk of 20 pages, unfiltered and filtered by job type, through HTTP with the key.
  const pageTimes = async (query: string) => {
    const times: number[] = [];
    let path = `/api/v1/reports?${query}`;
    for (let i = 0; i < 20 && path; i++) {
      const t = performance.now();
      const res = await fetch(`${origin}${path}`, { headers: { authorization: `Bearer ${key}` } });
      const body = (await res.json()) as { next_cursor?: string | null };
      times.push(performance.now() - t);
      path = body.next_cursor ? `/api/v1/reports?${query}&cursor=${body.next_cursor}` : "";
    }
    return [...times].sort((a, b) => a - b)[times.length >> 1]!;
  };
  const plainPage = await pageTimes("limit=100");
  const jobPage = await pageTimes("limit=100&job=bench-job-7");

  const floorRate = REPORTS / floorS;
  const dumpRate = lines / dumpS;
  console.log("");
  console.log(`rows                                   ${fmt(lines)} (${(bytes / 1024 ** 2).toFixed(0)} MB of NDJSON)`);
  console.log(`psql \\copy of the same query (floor)   ${floorS.toFixed(2)} s   ${fmt(floorRate)} reports/s`);
  console.log(`GET /api/v1/reports.ndjson             ${dumpS.toFixed(2)} s   ${fmt(dumpRate)} reports/s`);
  console.log(`ratio to the floor                     ${(dumpRate / floorRate).toFixed(2)} (goal ≥ 0.30)`);
  console.log(
    `a page of 100 (median of 20 in a walk)  ${plainPage.toFixed(1)} ms; filtered by job type ${jobPage.toFixed(1)} ms`,
  );
  console.log(
    `server resident memory                 ${idleMb.toFixed(0)} MB idle, ${peakMb.toFixed(0)} MB peak while streaming (goal < 300 MB)`,
  );
  process.exitCode = 0;
} finally {
  server?.kill("SIGTERM");
  await db.destroy();
  pg.stop();
  rmSync(dataDir, { recursive: true, force: true });
}
