// A project-local PostgreSQL cluster on loopback, used by `npm start`, `npm run dev` and the tests.
// Debian's server refuses to run initdb as root, so as root every server program runs as the
// `postgres` system user and the data folder is handed to that user. When that user cannot
// reach the folder asked for (a clone inside root's 0700 home), the cluster lives in its own
// home instead, in a folder named after the one asked for (docs/decisions/001).
import { createHash } from "node:crypto";
import { execFileSync, spawn, spawnSync } from "node:child_process";
import { chownSync, existsSync, mkdirSync, readdirSync, readFileSync, rmSync, statSync } from "node:fs";
import path from "node:path";
import pg from "pg";
import { commandLine, ensurePortFree, isAlive } from "./processes";

export interface PostgresOptions {
  dataDir: string;
  port: number;
  /** Tests only: skip fsync for speed. The start command never sets it. */
  fast?: boolean;
  database?: string;
  log?: (line: string) => void;
}

export interface RunningPostgres {
  url: string;
  /** Where the cluster is: the folder asked for, or its stand-in in the server user's home. */
  dataDir: string;
  /** A fast restart (open connections are cut), as after a crash or a minor-version upgrade; the caller's event loop keeps running. */
  restart(): Promise<void>;
  stop(): void;
}

const USER = "bayproof";
const isRoot = process.getuid?.() === 0;

function findBinDir(): string {
  const candidates: string[] = [];
  try {
    candidates.push(execFileSync("pg_config", ["--bindir"], { encoding: "utf8" }).trim());
  } catch {
    // pg_config may be missing; fall back to Debian's usual folders
  }
  if (existsSync("/usr/lib/postgresql")) {
    for (const v of readdirSync("/usr/lib/postgresql").sort().reverse()) {
      candidates.push(`/usr/lib/postgresql/${v}/bin`);
    }
  }
  const found = candidates.find((dir) => existsSync(path.join(dir, "initdb")));
  if (found) return found;
  if (isRoot) {
    spawnSync("apt-get", ["update", "-qq"], { stdio: "inherit" });
    const r = spawnSync("apt-get", ["install", "-y", "-qq", "postgresql"], { stdio: "inherit" });
    if (r.status === 0) return findBinDir();
  }
  throw new Error("PostgreSQL server programs not found. Install Debian's server: apt-get install -y postgresql");
}

function run(bin: string, args: string[], opts: { allowFail?: boolean } = {}) {
  const [cmd, fullArgs] = isRoot ? ["runuser", ["-u", "postgres", "--", bin, ...args]] : [bin, args];
  const r = spawnSync(cmd, fullArgs, { encoding: "utf8" });
  if (r.status !== 0 && !opts.allowFail) {
    throw new Error(`${path.basename(bin)} failed (${r.status}):\n${r.stdout}\n${r.stderr}`);
  }
  return r;
}

function handToPostgresUser(dir: string) {
  if (!isRoot) return;
  const { uid, gid } = postgresIds();
  chownSync(dir, uid, gid);
}

function postgresIds() {
  const [, , uid, gid, , home] = execFileSync("getent", ["passwd", "postgres"], { encoding: "utf8" }).trim().split(":");
  return { uid: Number(uid), gid: Number(gid), home: home ?? "/var/lib/postgresql" };
}

/** Whether the `postgres` user may enter `dir` (every folder on the way must let it through). */
function postgresCanEnter(dir: string) {
  return run("/usr/bin/test", ["-x", dir], { allowFail: true }).status === 0;
}

/**
 * Creates `dir` and any missing parents: 0700 for an ordinary user; as root, root:postgres 0710,
 * so the server's user can pass through to the cluster and read nothing else. Folders that are
 * already there are left as they are.
 */
export function makeFolders(dir: string) {
  const missing: string[] = [];
  for (let d = path.resolve(dir); !existsSync(d); d = path.dirname(d)) missing.unshift(d);
  const gid = isRoot ? postgresIds().gid : undefined;
  for (const d of missing) {
    mkdirSync(d, { mode: isRoot ? 0o710 : 0o700 });
    if (gid !== undefined) chownSync(d, 0, gid);
  }
}

/**
 * The folder the cluster goes in. As an ordinary user the server runs as that user: `wanted`.
 * As root: `wanted` when the `postgres` user can reach its parent (see makeFolders), else a folder in that user's
 * home named after `wanted`, so the next start from the same place finds the same cluster.
 * Never changes the modes of folders that were already there.
 */
export function clusterDirFor(wanted: string): { dir: string; moved: boolean } {
  if (!isRoot) return { dir: wanted, moved: false };
  const parent = path.dirname(wanted);
  makeFolders(parent);
  if (postgresCanEnter(parent)) return { dir: wanted, moved: false };
  const { uid, gid, home } = postgresIds();
  const base = path.join(home, "bayproof");
  if (!existsSync(base)) {
    mkdirSync(base, { mode: 0o700 });
    chownSync(base, uid, gid);
  }
  // Short: the server's socket lives in the cluster folder, and a socket path has at most 107 bytes.
  const name = wanted
    .replace(/^\/+/, "")
    .replace(/[^A-Za-z0-9._-]+/g, "_")
    .slice(-40);
  const hash = createHash("sha256").update(wanted).digest("hex").slice(0, 8);
  return { dir: path.join(base, `${name}-${hash}`), moved: true };
}

/**
 * A postmaster.pid left by a server that died without cleaning up (kill -9, power loss) names a
 * process that is gone — or, after a restart of the machine, some other process that got the
 * same number, which makes PostgreSQL refuse to start. Remove it when its process is not a
 * PostgreSQL server; returns the port it recorded when the server is still running.
 */
function checkPidFile(dataDir: string, log: (line: string) => void): number | null {
  const file = path.join(dataDir, "postmaster.pid");
  if (!existsSync(file)) return null;
  const lines = readFileSync(file, "utf8").split("\n");
  const pid = Number(lines[0]);
  if (pid > 0 && isAlive(pid) && /postgres|postmaster/.test(commandLine(pid))) return Number(lines[3]) || null;
  rmSync(file, { force: true });
  // The socket's lock file (the socket lives in the data folder) names the same process.
  for (const f of readdirSync(dataDir))
    if (/^\.s\.PGSQL\.\d+\.lock$/.test(f)) rmSync(path.join(dataDir, f), { force: true });
  log(`Removed a stale postmaster.pid (process ${pid} is not a PostgreSQL server)`);
  return null;
}

async function waitForConnections(url: string, timeoutMs = 30_000) {
  const deadline = Date.now() + timeoutMs;
  let lastError: unknown;
  while (Date.now() < deadline) {
    const client = new pg.Client({ connectionString: url });
    try {
      await client.connect();
      await client.query("select 1");
      await client.end();
      return;
    } catch (error) {
      lastError = error;
      await client.end().catch(() => {});
      await new Promise((r) => setTimeout(r, 200));
    }
  }
  throw new Error(`PostgreSQL did not accept connections in time: ${String(lastError)}`);
}

export async function startPostgres(options: PostgresOptions): Promise<RunningPostgres> {
  const { port, fast = false, database = "bayproof", log = () => {} } = options;
  const bin = findBinDir();
  const pgCtl = path.join(bin, "pg_ctl");
  const wanted = path.resolve(options.dataDir);
  const { dir: dataDir, moved } = clusterDirFor(wanted);
  if (moved) log(`The postgres user cannot reach ${path.dirname(wanted)}; the cluster lives in ${dataDir} instead`);

  if (!existsSync(path.join(dataDir, "PG_VERSION"))) {
    mkdirSync(dataDir, { recursive: true, mode: 0o700 });
    handToPostgresUser(dataDir);
    log(`Creating a PostgreSQL cluster in ${dataDir}`);
    run(path.join(bin, "initdb"), ["-D", dataDir, "-U", USER, "--auth=trust", "-E", "UTF8", "--no-locale"]);
  } else if (isRoot && statSync(dataDir).uid !== postgresIds().uid) {
    handToPostgresUser(dataDir);
  }

  const runningPort = checkPidFile(dataDir, log);
  if (runningPort != null && runningPort !== port) {
    log(`PostgreSQL is running for ${dataDir} on port ${runningPort}; restarting it on ${port}`);
    run(pgCtl, ["-D", dataDir, "-m", "fast", "-w", "stop"], { allowFail: true });
  }
  const status = run(pgCtl, ["-D", dataDir, "status"], { allowFail: true });
  // A server found running was left by a start that is gone (a live one is refused before this,
  // in scripts/run-state.ts): this start takes it over and stops it on the way out.
  if (status.status !== 0) {
    await ensurePortFree(port, "PostgreSQL", "BAYPROOF_PGPORT");
    const serverOptions = [
      "-c listen_addresses=127.0.0.1",
      `-p ${port}`,
      // Connections go over TCP; the socket is a convenience, left out where its path would be too long.
      path.join(dataDir, `.s.PGSQL.${port}`).length <= 100 ? `-k ${dataDir}` : "-c unix_socket_directories=''",
      ...(fast ? ["-c fsync=off", "-c synchronous_commit=off", "-c full_page_writes=off"] : []),
    ].join(" ");
    run(pgCtl, [
      "-D",
      dataDir,
      "-l",
      path.join(dataDir, "server.log"),
      "-w",
      "-t",
      "120",
      "-o",
      serverOptions,
      "start",
    ]);
    log(`PostgreSQL listening on 127.0.0.1:${port} (cluster in ${dataDir})`);
  } else {
    log(`PostgreSQL was already running for ${dataDir}; taking it over`);
  }

  const adminUrl = `postgres://${USER}@127.0.0.1:${port}/postgres`;
  await waitForConnections(adminUrl);
  const admin = new pg.Client({ connectionString: adminUrl });
  await admin.connect();
  const exists = await admin.query("select 1 from pg_database where datname = $1", [database]);
  if (exists.rowCount === 0) await admin.query(`create database "${database}"`);
  await admin.end();

  let stopped = false;
  return {
    url: `postgres://${USER}@127.0.0.1:${port}/${database}`,
    dataDir,
    restart() {
      // With its log file, as at start: otherwise the new server keeps this call's output pipes open.
      const args = ["-D", dataDir, "-l", path.join(dataDir, "server.log"), "-m", "fast", "-w", "-t", "120", "restart"];
      const [cmd, fullArgs] = isRoot ? ["runuser", ["-u", "postgres", "--", pgCtl, ...args]] : [pgCtl, args];
      return new Promise<void>((resolve, reject) => {
        const child = spawn(cmd, fullArgs, { stdio: "ignore" });
        child.on("error", reject);
        child.on("exit", (code) => (code === 0 ? resolve() : reject(new Error(`pg_ctl restart failed (${code})`))));
      });
    },
    stop() {
      if (stopped) return;
      stopped = true;
      // A shutdown checkpoint can take minutes on a busy machine: wait for it rather than leave
      // a server running; only if it still has not stopped, stop it without one.
      const r = run(pgCtl, ["-D", dataDir, "-m", "fast", "-w", "-t", "300", "stop"], { allowFail: true });
      if (r.status !== 0 && run(pgCtl, ["-D", dataDir, "status"], { allowFail: true }).status === 0) {
        log(`PostgreSQL did not stop in time (${(r.stderr || r.stdout).trim()}); stopping it at once`);
        run(pgCtl, ["-D", dataDir, "-m", "immediate", "-w", "-t", "60", "stop"], { allowFail: true });
      }
      log("PostgreSQL stopped");
    },
  };
}
