// `npm run bench:pages`: the pages under load. Starts a throwaway PostgreSQL with the demo scenario,
// the local fakes and the production server (WEB_CONCURRENCY workers, as set in this environment),
// then runs autocannon against the main pages, a signed-in page and a page of 100 from the open feed
// with an API key, at 1, 10 and 50 connections. Beside each page, a plain node:http server in
// another process sends the same bytes (the floor no page can beat on this machine), in the same run.
// Prints req/s, exact p50/p95/p99 and each page's share of its floor. Figures only: nothing passes
// or fails; the load generator shares the machine's cores with the server, so compare runs made on
// the same machine at a quiet moment.
//
//   npm run bench:pages                      10 s per case
//   npm run bench:pages -- --quick           3 s per case
//   npm run bench:pages -- --duration=20 --connections=1,50 --only=/models
//   npm run bench:pages -- --identity         without Accept-Encoding (uncompressed answers)
//
// Every request carries the Accept-Encoding a browser sends (Chromium's), so the server compresses
// as it does for real visitors; the floor sends the very bytes the app sent, compressed the same way.
import { type ChildProcess, spawn } from "node:child_process";
import { get as httpGet } from "node:http";
import { mkdtempSync, rmSync, writeFileSync } from "node:fs";
import { availableParallelism, loadavg, tmpdir } from "node:os";
import path from "node:path";
import { parseArgs } from "node:util";
import autocannon from "autocannon";
import { sql } from "kysely";
import { startFakes } from "../fakes/index";
import { newSession } from "../tests/support/sessions";
import { benchCluster } from "./bench-cluster";
import { buildApp } from "./build-app";
import { freePort } from "./free-port";
import { prepareDatabase } from "./prepare-db";
import { waitForHttp } from "./wait-http";

const { values: args } = parseArgs({
  options: {
    quick: { type: "boolean", default: false },
    duration: { type: "string" },
    connections: { type: "string", default: "1,10,50" },
    only: { type: "string" },
    identity: { type: "boolean", default: false },
  },
});
const duration = Number(args.duration ?? (args.quick ? 3 : 10));
const levels = args.connections.split(",").map(Number);
if (!(duration > 0) || levels.some((c) => !(c > 0))) throw new Error("--duration and --connections take numbers");

const root = path.resolve(import.meta.dirname, "..");
const log = (s: string) => console.log(`[bench] ${s}`);
const children: ChildProcess[] = [];
let fakesStop: (() => Promise<void>) | null = null;
const tempDir = mkdtempSync(path.join(tmpdir(), "bayproof-bench-pages-"));

/** SIGTERM and wait, so PostgreSQL outlives its last client. */
async function stopChild(child: ChildProcess) {
  if (child.exitCode != null || child.signalCode != null) return;
  const exited = new Promise((resolve) => child.once("exit", resolve));
  child.kill("SIGTERM");
  await exited;
}

interface Target {
  name: string;
  path: string;
  headers: Record<string, string>;
}

interface Figures {
  rps: number;
  p50: number;
  p95: number;
  p99: number;
  /** Answers that were not 2xx (429s of the feed's rate limit, say), and socket errors. */
  refused: number;
}

const percentile = (sorted: number[], p: number) =>
  sorted.length ? sorted[Math.min(sorted.length - 1, Math.ceil((p / 100) * sorted.length) - 1)]! : NaN;

/** One autocannon run; every response time is kept, so the percentiles are exact. */
async function load(url: string, headers: Record<string, string>, connections: number): Promise<Figures> {
  const times: number[] = [];
  const result = await new Promise<autocannon.Result>((resolve, reject) => {
    const instance = autocannon({ url, headers, connections, duration, timeout: 30 }, (error, result) =>
      error ? reject(error as Error) : resolve(result),
    );
    instance.on("response", (_client, _status, _bytes, time) => times.push(time));
  });
  times.sort((a, b) => a - b);
  return {
    rps: result["2xx"] / result.duration,
    p50: percentile(times, 50),
    p95: percentile(times, 95),
    p99: percentile(times, 99),
    refused: result.non2xx + result.errors + result.timeouts,
  };
}

/** What a browser sends as Accept-Encoding (Chromium). */
const BROWSER_ENCODINGS = "gzip, deflate, br, zstd";

interface Sent {
  status: number;
  type: string;
  /** Content-Encoding, or "" for none. */
  encoding: string;
  /** The bytes as they crossed the wire (compressed when `encoding` says so). */
  body: Buffer;
}

/** A GET whose body is kept exactly as sent (fetch would decompress it). */
function getRaw(url: string, headers: Record<string, string>): Promise<Sent> {
  return new Promise((resolve, reject) => {
    httpGet(url, { headers }, (res) => {
      const chunks: Buffer[] = [];
      res.on("data", (c: Buffer) => chunks.push(c));
      res.on("end", () =>
        resolve({
          status: res.statusCode ?? 0,
          type: res.headers["content-type"] ?? "text/html",
          encoding: res.headers["content-encoding"] ?? "",
          body: Buffer.concat(chunks),
        }),
      );
    }).on("error", reject);
  });
}

/** A plain node:http server in its own process answering each path with the bytes the app sent. */
async function startStaticServer(pages: { path: string; type: string; encoding: string; body: Buffer }[]) {
  const file = path.join(tempDir, "pages.json");
  writeFileSync(file, JSON.stringify(pages.map((p) => ({ ...p, body: p.body.toString("base64") }))));
  const port = await freePort();
  const script = `
    const http = require("node:http");
    const pages = new Map(JSON.parse(require("node:fs").readFileSync(${JSON.stringify(file)}, "utf8"))
      .map((p) => [p.path, { type: p.type, encoding: p.encoding, body: Buffer.from(p.body, "base64") }]));
    http.createServer((req, res) => {
      const page = pages.get(req.url);
      if (!page) { res.statusCode = 404; return res.end(); }
      const headers = { "content-type": page.type, "content-length": page.body.length };
      if (page.encoding) headers["content-encoding"] = page.encoding;
      res.writeHead(200, headers);
      res.end(page.body);
    }).listen(${port}, "127.0.0.1");`;
  const child = spawn(process.execPath, ["-e", script], { stdio: ["ignore", "ignore", "inherit"] });
  children.push(child);
  const origin = `http://127.0.0.1:${port}`;
  await waitForHttp(`${origin}/`, child);
  return origin;
}

const ms = (n: number) => (Number.isFinite(n) ? `${n < 10 ? n.toFixed(1) : Math.round(n)} ms` : "—");
const rate = (n: number) => Math.round(n).toLocaleString("en-US");

function printTable(rows: { target: Target; connections: number; app: Figures; floor: Figures }[]) {
  const header = ["page", "conns", "req/s", "p50", "p95", "p99", "not 2xx", "floor req/s", "floor p95", "share"];
  const lines = rows.map(({ target, connections, app, floor }) => [
    target.name,
    String(connections),
    rate(app.rps),
    ms(app.p50),
    ms(app.p95),
    ms(app.p99),
    String(app.refused),
    rate(floor.rps),
    ms(floor.p95),
    `${((100 * app.rps) / floor.rps).toFixed(1)} %`,
  ]);
  const widths = header.map((h, i) => Math.max(h.length, ...lines.map((l) => l[i]!.length)));
  const row = (cells: string[]) =>
    `| ${cells.map((c, i) => (i < 2 ? c.padEnd(widths[i]!) : c.padStart(widths[i]!))).join(" | ")} |`;
  console.log(row(header));
  console.log(`| ${widths.map((w, i) => (i < 2 ? "-".repeat(w) : `${"-".repeat(w - 1)}:`)).join(" | ")} |`);
  for (const l of lines) console.log(row(l));
}

await benchCluster(
  async ({ db, url }) => {
    const port = await freePort();
    const origin = `http://127.0.0.1:${port}`;
    log("Loading the demo scenario…");
    await prepareDatabase(db, log);
    const fakes = await startFakes({
      ports: { oidc: await freePort(), smtp: await freePort(), s3: await freePort(), search: await freePort() },
      dataDir: tempDir,
      appOrigins: [origin],
    });
    fakesStop = () => fakes.stop();
    if (!buildApp(root, log, { inheritOutput: false }).ok) throw new Error("the build failed (npm run build)");

    const server = spawn(process.execPath, ["server.js"], {
      cwd: root,
      stdio: ["ignore", "ignore", "inherit"],
      env: {
        ...process.env,
        ...fakes.env,
        DATABASE_URL: url,
        HOST: "127.0.0.1",
        PORT: String(port),
        APP_ORIGIN: origin,
        NODE_ENV: "production",
        // The feed's per-key limit raised so the benchmark measures pages, not 429s.
        BAYPROOF_FEED_KEY_LIMIT: "1000000",
        AWS_SDK_JS_NODE_VERSION_SUPPORT_WARNING_DISABLED: "true",
      },
    });
    children.push(server);
    await waitForHttp(`${origin}/`, server);

    // A reporter's session and an API key.
    const session = await newSession(db, "reporter@demo.bayproof.test", 24 * 3600_000);
    const cookie = `bayproof_session=${session.cookie}`;
    const { createApiKey } = await import("../app/auth/api-keys.server");
    const key = await createApiKey(db, session.userId, "bench");
    const job =
      (await db
        .selectFrom("job_types")
        .select("slug")
        .where("slug", "=", "ball-joint-separation")
        .executeTakeFirst()) ??
      (await db.selectFrom("job_types").select("slug").orderBy("id").executeTakeFirstOrThrow());
    const model = (
      await sql<{ slug: string }>`select m.slug from tool_models m join reports r on r.tool_model_id = m.id
        where r.status = 'accepted' group by m.slug order by count(*) desc limit 1`.execute(db)
    ).rows[0]!;

    const everyTarget: Target[] = [
      { name: "/", path: "/", headers: {} },
      { name: `/jobs/${job.slug}`, path: `/jobs/${job.slug}`, headers: {} },
      { name: "/models", path: "/models", headers: {} },
      { name: `/models/${model.slug}`, path: `/models/${model.slug}`, headers: {} },
      { name: "/compare", path: "/compare", headers: {} },
      { name: "/search", path: "/search", headers: {} },
      { name: "/air", path: "/air", headers: {} },
      { name: `/jobs/${job.slug} (signed in)`, path: `/jobs/${job.slug}`, headers: { cookie } },
      {
        name: "/api/v1/reports?limit=100 (key)",
        path: "/api/v1/reports?limit=100",
        headers: { authorization: `Bearer ${key}` },
      },
    ];
    const targets = everyTarget
      .filter((t) => !args.only || t.name.includes(args.only))
      .map((t) => (args.identity ? t : { ...t, headers: { ...t.headers, "accept-encoding": BROWSER_ENCODINGS } }));

    // The bytes each page sends, for the floor (keyed by a path of its own: two targets share a path).
    const pages: { path: string; type: string; encoding: string; body: Buffer }[] = [];
    for (const [i, t] of targets.entries()) {
      const sent = await getRaw(`${origin}${t.path}`, t.headers);
      if (sent.status !== 200)
        throw new Error(`${t.name} answered ${sent.status}: ${sent.body.toString().slice(0, 300)}`);
      const plain = (await getRaw(`${origin}${t.path}`, { ...t.headers, "accept-encoding": "identity" })).body;
      pages.push({ path: `/${i}`, type: sent.type, encoding: sent.encoding, body: sent.body });
      const kB = (n: number) => `${(n / 1024).toFixed(1)} kB`;
      log(
        `${t.name}: ${kB(plain.byteLength)}${sent.encoding ? `, ${kB(sent.body.byteLength)} as ${sent.encoding}` : ""}`,
      );
    }
    const floorOrigin = await startStaticServer(pages);

    const workers = process.env.WEB_CONCURRENCY ?? "the server's default";
    log(
      `${duration} s per case, connections ${levels.join(", ")}; server workers: ${workers}; ` +
        `${availableParallelism()} cores; Accept-Encoding: ${args.identity ? "none" : BROWSER_ENCODINGS}; load average ${loadavg()
          .map((l) => l.toFixed(2))
          .join(" ")}`,
    );
    const rows: { target: Target; connections: number; app: Figures; floor: Figures }[] = [];
    for (const connections of levels) {
      for (const [i, target] of targets.entries()) {
        const app = await load(`${origin}${target.path}`, target.headers, connections);
        const floor = await load(`${floorOrigin}/${i}`, {}, connections);
        rows.push({ target, connections, app, floor });
        log(`${target.name} at ${connections}: ${rate(app.rps)} req/s, p95 ${ms(app.p95)} (floor ${rate(floor.rps)})`);
      }
    }
    console.log("");
    printTable(rows);
    console.log(
      `\nload average after the run: ${loadavg()
        .map((l) => l.toFixed(2))
        .join(" ")} (the load generator shares the cores with the server)`,
    );
  },
  {
    onStop: async () => {
      for (const child of children.reverse()) await stopChild(child);
      await fakesStop?.();
      rmSync(tempDir, { recursive: true, force: true });
    },
  },
);
