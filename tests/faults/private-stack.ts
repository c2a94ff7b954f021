// A stack of the fault suite's own — PostgreSQL with the demo data, the fakes, server.js — so it
// can kill the server and restart the database without disturbing the shared test stack.
import { type ChildProcess, spawn } from "node:child_process";
import { closeSync, openSync, readFileSync } from "node:fs";
import path from "node:path";
import { reindexAll, searchClient } from "../../app/search/search.server";
import { createDb } from "../../db/database";
import { buildApp } from "../../scripts/build-app";
import { waitForHttp } from "../../scripts/wait-http";
import { startTestServices } from "../support/system";

const root = path.resolve(import.meta.dirname, "../..");

export async function startPrivateStack() {
  const cleanups: (() => unknown)[] = [];
  const { database, dataDir, port, baseUrl, fakes } = await startTestServices(cleanups, "bayproof-faults-");
  let fakesStopped = false;
  cleanups.push(() => fakesStopped || fakes.stop());
  const db = createDb(database.url, 4);
  cleanups.push(() => db.destroy());
  await reindexAll(db, searchClient(fakes.env.SEARCH_URL));
  const build = buildApp(root, () => {}, { inheritOutput: false });
  if (!build.ok) throw new Error(`build failed:\n${build.output}`);

  // The server's errors, for a look after a failed run.
  const serverLogPath = path.join(dataDir, "server.log");
  const serverLog = openSync(serverLogPath, "a");
  cleanups.push(() => closeSync(serverLog));
  let server: ChildProcess | undefined;
  const startServer = async () => {
    server = spawn(process.execPath, ["server.js"], {
      cwd: root,
      env: {
        ...process.env,
        ...fakes.env,
        DATABASE_URL: database.url,
        HOST: "127.0.0.1",
        PORT: String(port),
        APP_ORIGIN: baseUrl,
        NODE_ENV: "production",
        AWS_SDK_JS_NODE_VERSION_SUPPORT_WARNING_DISABLED: "true",
        BAYPROOF_TRUST_PROXY: "1",
      },
      stdio: ["ignore", "ignore", serverLog],
    });
    await waitForHttp(baseUrl, server, 180_000);
  };
  const stopServer = async (signal: NodeJS.Signals = "SIGTERM") => {
    if (!server || server.exitCode != null || server.signalCode != null) return;
    const exited = new Promise((r) => server!.once("exit", r));
    server.kill(signal);
    await exited;
  };
  cleanups.push(() => stopServer());
  await startServer();

  return {
    db,
    baseUrl,
    restartDatabase: () => database.restart(),
    /** The server's stderr so far, without Node's version notices, for a failed test to print. */
    serverLog: () =>
      readFileSync(serverLogPath, "utf8")
        .split("\n")
        .filter(
          (line) =>
            line.trim() &&
            !/AWS|node >=22|upgrade to node|a\.co\/|security updates|first week|continue receiving/i.test(line),
        )
        .slice(-200)
        .join("\n"),
    startServer,
    /** kill -9 of the app server, as the machine's out-of-memory killer would. */
    killServer: () => stopServer("SIGKILL"),
    stopFakes: async () => {
      fakesStopped = true;
      await fakes.stop();
    },
    async stop() {
      for (const c of cleanups.reverse()) await c();
    },
  };
}
