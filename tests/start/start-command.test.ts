// The README's first command, as a newcomer runs it: a fresh clone, `npm start` (node_modules
// linked instead of `npm ci`), as the user the suite runs as (root in CI), on free ports with a
// fresh data folder. It must serve, stop everything on Ctrl-C, reuse its data on the next start,
// recover after a kill -9 of the start command, and do all that from a folder the `postgres`
// user cannot enter (a clone inside a 0700 folder, as in root's home).
import { type ChildProcess, spawn, spawnSync } from "node:child_process";
import { chmodSync, existsSync, mkdtempSync, readFileSync, rmSync, symlinkSync } from "node:fs";
import { availableParallelism, tmpdir } from "node:os";
import path from "node:path";
import { afterAll, describe, expect, it } from "vitest";
import { freePort } from "../../scripts/free-port";
import { commandLine, isAlive, portInUse, startTime } from "../../scripts/processes";

const root = path.resolve(import.meta.dirname, "../..");
const isRoot = process.getuid?.() === 0;
const cleanups: (() => void)[] = [];
afterAll(() => {
  for (const c of cleanups.reverse()) c();
});

/** A clone of this repository in `parent` with this checkout's node_modules linked in. */
function cloneInto(parent: string) {
  const dir = path.join(parent, "bayproof");
  const r = spawnSync("git", ["clone", "-q", root, dir], { encoding: "utf8" });
  if (r.status !== 0) throw new Error(`git clone failed: ${r.stderr}`);
  symlinkSync(path.join(root, "node_modules"), path.join(dir, "node_modules"));
  return dir;
}

interface Ports {
  PORT: number;
  BAYPROOF_PGPORT: number;
  BAYPROOF_OIDC_PORT: number;
  BAYPROOF_SMTP_PORT: number;
  BAYPROOF_S3_PORT: number;
  BAYPROOF_SEARCH_PORT: number;
}

async function freePorts(): Promise<Ports> {
  return {
    PORT: await freePort(),
    BAYPROOF_PGPORT: await freePort(),
    BAYPROOF_OIDC_PORT: await freePort(),
    BAYPROOF_SMTP_PORT: await freePort(),
    BAYPROOF_S3_PORT: await freePort(),
    BAYPROOF_SEARCH_PORT: await freePort(),
  };
}

/** This process's environment without anything that would point the clone at the test stack. */
function cleanEnv(ports: Ports) {
  const env: NodeJS.ProcessEnv = {};
  for (const [k, v] of Object.entries(process.env)) {
    if (!/^(BAYPROOF_|S3_|OIDC_|SMTP_|SEARCH_|DATABASE_URL$|APP_ORIGIN$|HOST$|PORT$|NODE_ENV$|VITEST)/.test(k))
      env[k] = v;
  }
  for (const [k, v] of Object.entries(ports)) env[k] = String(v);
  return env;
}

/** `npm start` in its own process group, as a terminal runs it; resolves once it says where it serves. */
async function start(dir: string, ports: Ports) {
  const child = spawn("npm", ["start"], {
    cwd: dir,
    env: cleanEnv(ports),
    detached: true,
    stdio: ["ignore", "pipe", "pipe"],
  });
  let output = "";
  child.stdout.on("data", (d) => (output += d));
  child.stderr.on("data", (d) => (output += d));
  const serving = `Bayproof is serving on http://127.0.0.1:${ports.PORT}`;
  await new Promise<void>((resolve, reject) => {
    const check = () => {
      if (output.includes(serving)) return resolve();
      if (child.exitCode != null) return reject(new Error(`npm start exited with ${child.exitCode}:\n${output}`));
    };
    child.stdout.on("data", check);
    child.on("exit", check);
  });
  return { child, output: () => output };
}

/** A process as pid and start time, so a later process given the same number is not mistaken for it. */
interface Proc {
  pid: number;
  started: string | null;
}
const stillRunning = (p: Proc) => isAlive(p.pid) && startTime(p.pid) === p.started;

/** Every process of the start command's group and the PostgreSQL server it runs. */
function startedProcesses(leader: ChildProcess, dataDir: string, clusterDir: string): Proc[] {
  const pids = new Set<number>();
  for (const entry of spawnSync("ps", ["-eo", "pid=,pgid="], { encoding: "utf8" }).stdout.trim().split("\n")) {
    const [pid, pgid] = entry.trim().split(/\s+/).map(Number);
    if (pgid === leader.pid) pids.add(pid!);
  }
  const state = JSON.parse(readFileSync(path.join(dataDir, "run.json"), "utf8")) as {
    startPid: number;
    children: Record<string, number>;
  };
  for (const pid of [state.startPid, ...Object.values(state.children)]) pids.add(pid);
  pids.add(Number(readFileSync(path.join(clusterDir, "postmaster.pid"), "utf8").split("\n")[0]));
  return [...pids].map((pid) => ({ pid, started: startTime(pid) })).filter((p) => p.started !== null);
}

async function until(what: string, condition: () => boolean | Promise<boolean>, timeoutMs = 120_000) {
  const deadline = Date.now() + timeoutMs;
  while (!(await condition())) {
    if (Date.now() > deadline) throw new Error(`timed out waiting for ${what}`);
    await new Promise((r) => setTimeout(r, 200));
  }
}

async function expectAllGone(procs: Proc[], ports: Ports) {
  // PostgreSQL's shutdown checkpoint can take minutes on a busy machine; the start command waits for it.
  await until("every started process to exit", () => !procs.some(stillRunning), 420_000).catch((error: Error) => {
    const left = procs.filter(stillRunning).map((p) => `${p.pid}: ${commandLine(p.pid)}`);
    throw new Error(`${error.message}; still running: ${left.join("; ")}`);
  });
  for (const port of Object.values(ports)) await until(`port ${port} to be free`, async () => !(await portInUse(port)));
}

/** Reads the pages a first visitor opens: the front page, the jobs and one model. */
async function browse(ports: Ports) {
  const base = `http://127.0.0.1:${ports.PORT}`;
  expect((await fetch(`${base}/`)).status).toBe(200);
  expect((await fetch(`${base}/jobs`)).status).toBe(200);
  const models = await (await fetch(`${base}/models`)).text();
  const slug = /href="\/models\/([a-z0-9-]+)"/.exec(models)?.[1];
  expect(slug).toBeTruthy();
  const model = await fetch(`${base}/models/${slug}`);
  expect(model.status).toBe(200);
}

/** Where the cluster went, from the start command's own words. */
function clusterDirFrom(output: string, dataDir: string) {
  return /the cluster lives in (\S+) instead/.exec(output)?.[1] ?? path.join(dataDir, "postgres");
}

async function stopWithCtrlC(run: Awaited<ReturnType<typeof start>>, pids: Proc[], ports: Ports) {
  process.kill(-run.child.pid!, "SIGINT");
  await until("npm start to exit", () => run.child.exitCode != null || run.child.signalCode != null, 420_000);
  await expectAllGone(pids, ports).catch((error: Error) => {
    throw new Error(`${error.message}\nwhat the start command said:\n${run.output().slice(-3000)}`);
  });
}

describe("npm start from a fresh clone", () => {
  it("serves, stops everything on Ctrl-C, reuses its data, restarts a dead server, and recovers after a kill -9", async () => {
    const parent = mkdtempSync(path.join(tmpdir(), "bayproof-start-"));
    chmodSync(parent, 0o755); // a folder anyone can enter
    cleanups.push(() => rmSync(parent, { recursive: true, force: true }));
    const dir = cloneInto(parent);
    const dataDir = path.join(dir, ".data");
    const ports = await freePorts();

    const first = await start(dir, ports);
    expect(first.output()).toMatch(/Loaded the demo scenario: \d+ reports/);
    // One server worker per core (server-cluster.js), all in the start command's process group.
    if (availableParallelism() > 1)
      expect(first.output()).toMatch(new RegExp(`\\[server\\] ${availableParallelism()} workers`));
    const clusterDir = clusterDirFrom(first.output(), dataDir);
    expect(clusterDir).toBe(path.join(dataDir, "postgres"));
    await browse(ports);
    await stopWithCtrlC(first, startedProcesses(first.child, dataDir, clusterDir), ports);
    expect(existsSync(path.join(dataDir, "run.json"))).toBe(false);

    const second = await start(dir, ports);
    expect(second.output()).toMatch(/Demo scenario already present/);
    expect(second.output()).not.toMatch(/Loaded the demo scenario/);
    expect(second.output()).toMatch(/The build is up to date/);
    // The second start's figure (no build, no demo load), for the log; speed is a benchmark's business.
    console.info(/Bayproof is serving on .*\(ready in [\d.]+ s\)/.exec(second.output())?.[0]);
    await browse(ports);
    // A server that dies on its own is started again alone; the database and fakes stay up.
    const before = JSON.parse(readFileSync(path.join(dataDir, "run.json"), "utf8")) as {
      children: Record<string, number>;
    };
    process.kill(before.children.server!, "SIGKILL");
    await until("the server to be started again", () =>
      /The server stopped \(SIGKILL\); starting it again/.test(second.output()),
    );
    await until("the new server to answer", () =>
      fetch(`http://127.0.0.1:${ports.PORT}/jobs`).then(
        (r) => r.ok,
        () => false,
      ),
    );
    expect(second.output()).not.toMatch(/PostgreSQL stopped/);
    await browse(ports);
    const secondPids = startedProcesses(second.child, dataDir, clusterDir);

    // kill -9 of the start command itself leaves its server, worker and PostgreSQL behind.
    const state = JSON.parse(readFileSync(path.join(dataDir, "run.json"), "utf8")) as {
      startPid: number;
      children: Record<string, number>;
    };
    process.kill(state.startPid, "SIGKILL");
    await until("the killed start command to be gone", () => !isAlive(state.startPid));
    expect(isAlive(state.children.server!)).toBe(true);

    const third = await start(dir, ports);
    expect(third.output()).toMatch(/Stopping the server \(process \d+\) left running/);
    expect(third.output()).toMatch(/PostgreSQL was already running .* taking it over/);
    await browse(ports);
    await stopWithCtrlC(third, [...secondPids, ...startedProcesses(third.child, dataDir, clusterDir)], ports);
  });

  it("runs from a clone inside a folder the postgres user cannot enter, keeping its cluster elsewhere", async () => {
    const parent = mkdtempSync(path.join(tmpdir(), "bayproof-start-private-")); // mode 0700
    cleanups.push(() => rmSync(parent, { recursive: true, force: true }));
    const dir = cloneInto(parent);
    const dataDir = path.join(dir, ".data");
    const ports = await freePorts();

    const first = await start(dir, ports);
    const clusterDir = clusterDirFrom(first.output(), dataDir);
    cleanups.push(() => rmSync(clusterDir, { recursive: true, force: true }));
    if (isRoot) {
      // The server runs as `postgres`, which cannot pass the 0700 folder: the cluster moves to its home.
      expect(clusterDir).not.toContain(parent);
      expect(first.output()).toMatch(/The postgres user cannot reach/);
    }
    expect(spawnSync("stat", ["-c", "%a", parent], { encoding: "utf8" }).stdout.trim()).toBe("700");
    await browse(ports);
    await stopWithCtrlC(first, startedProcesses(first.child, dataDir, clusterDir), ports);

    const second = await start(dir, ports);
    expect(second.output()).toMatch(/Demo scenario already present/);
    expect(clusterDirFrom(second.output(), dataDir)).toBe(clusterDir);
    await stopWithCtrlC(second, startedProcesses(second.child, dataDir, clusterDir), ports);
  });
});
