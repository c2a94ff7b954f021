// A project-local PostgreSQL cluster on loopback, used by `npm start`, `npm run dev` and the tests.
// Debian's server refuses to run initdb as root, so as root every server program runs as the
// `postgres` system user and the data folder is handed to that user.
import { execFileSync, spawnSync } from "node:child_process";
import { chownSync, existsSync, mkdirSync, readdirSync, statSync } from "node:fs";
import path from "node:path";
import pg from "pg";

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
  throw new Error(
    "PostgreSQL server programs not found. Install Debian's server: apt-get install -y postgresql",
  );
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
  const uid = Number(execFileSync("id", ["-u", "postgres"], { encoding: "utf8" }).trim());
  const gid = Number(execFileSync("id", ["-g", "postgres"], { encoding: "utf8" }).trim());
  return { uid, gid };
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
  const dataDir = path.resolve(options.dataDir);
  const bin = findBinDir();
  const pgCtl = path.join(bin, "pg_ctl");

  if (!existsSync(path.join(dataDir, "PG_VERSION"))) {
    mkdirSync(dataDir, { recursive: true, mode: 0o700 });
    handToPostgresUser(dataDir);
    log(`Creating a PostgreSQL cluster in ${dataDir}`);
    run(path.join(bin, "initdb"), [
      "-D", dataDir, "-U", USER, "--auth=trust", "-E", "UTF8", "--no-locale",
    ]);
  } else if (isRoot && statSync(dataDir).uid !== postgresIds().uid) {
    handToPostgresUser(dataDir);
  }

  const status = run(pgCtl, ["-D", dataDir, "status"], { allowFail: true });
  let startedHere = false;
  if (status.status !== 0) {
    const serverOptions = [
      "-c listen_addresses=127.0.0.1",
      `-p ${port}`,
      `-k ${dataDir}`,
      ...(fast ? ["-c fsync=off", "-c synchronous_commit=off", "-c full_page_writes=off"] : []),
    ].join(" ");
    run(pgCtl, ["-D", dataDir, "-l", path.join(dataDir, "server.log"), "-w", "-t", "60", "-o", serverOptions, "start"]);
    startedHere = true;
    log(`PostgreSQL listening on 127.0.0.1:${port}`);
  } else {
    log(`PostgreSQL already running for ${dataDir}; reusing it`);
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
    stop() {
      if (stopped || !startedHere) return;
      stopped = true;
      run(pgCtl, ["-D", dataDir, "-m", "fast", "-w", "stop"], { allowFail: true });
      log("PostgreSQL stopped");
    },
  };
}
