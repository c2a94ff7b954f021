// The whole stack for integration and end-to-end tests, started once per run: a throwaway
// PostgreSQL with migrations and the demo scenario, the local fakes on free ports, a production
// build of the app, and server.js on a free loopback port — the path `npm start` takes.
// A run of only the unit project starts nothing.
import { type ChildProcess, spawn } from "node:child_process";
import { closeSync, mkdirSync, openSync, readFileSync } from "node:fs";
import path from "node:path";
import type { TestProject } from "vitest/node";
import { reindexAll, searchClient } from "../../app/search/search.server";
import { createDb } from "../../db/database";
import { buildApp } from "../../scripts/build-app";
import { ensureDemoEvidence } from "../../seeds/demo-evidence";
import { waitForHttp } from "../../scripts/wait-http";
import { ensureChromium, startTestServices } from "./system";

const root = path.resolve(import.meta.dirname, "../..");

/** SIGTERM, then wait for the exit, so the database outlives its last client. */
async function stopChild(child: ChildProcess) {
  if (child.exitCode != null) return;
  const exited = new Promise((resolve) => child.once("exit", resolve));
  child.kill("SIGTERM");
  await exited;
}

export default async function setup(project: TestProject) {
  const running = project.vitest.projects.map((p) => p.name);
  if (!running.some((name) => name === "integration" || name === "e2e" || name === "hostile")) return;
  if (running.includes("e2e")) ensureChromium();

  const cleanups: (() => Promise<void> | void)[] = [];
  const teardown = async () => {
    for (const c of cleanups.reverse()) await c();
  };
  try {
    const { database, port, baseUrl, fakes } = await startTestServices(cleanups);
    cleanups.push(() => fakes.stop());

    {
      // As `npm start` does (scripts/services.ts): the search index, and a file behind every demo evidence row.
      const db = createDb(database.url, 2);
      await Promise.all([
        reindexAll(db, searchClient(fakes.env.SEARCH_URL)),
        ensureDemoEvidence(db, fakes.env),
      ]).finally(() => db.destroy());
    }
    const build = buildApp(root, () => {}, { inheritOutput: false });
    if (!build.ok) throw new Error(`react-router build failed:\n${build.output}`);
    // The server's log goes straight to a file (node writes to files synchronously, so a line
    // logged while answering a request is there once the answer is in); tests read it through
    // tests/support/server-log.ts, and it is echoed to the terminal at the end.
    mkdirSync(path.join(root, ".data"), { recursive: true });
    const serverLog = path.join(root, ".data/test-server.log");
    const logFd = openSync(serverLog, "w");
    cleanups.push(() => {
      closeSync(logFd);
      process.stderr.write(readFileSync(serverLog));
    });
    // What the app server is started with; a test that starts a second one (page-cache) takes the same.
    const appEnv: Record<string, string> = {
      ...fakes.env,
      DATABASE_URL: database.url,
      // The read instance is the same database here; the code path is the one a replica takes.
      DATABASE_READ_URL: database.url,
      HOST: "127.0.0.1",
      PORT: String(port),
      APP_ORIGIN: baseUrl,
      NODE_ENV: "production",
      // Tests that count requests per client (the feed's rate limits) name their own client.
      BAYPROOF_TRUST_PROXY: "1",
      AWS_SDK_JS_NODE_VERSION_SUPPORT_WARNING_DISABLED: "true",
    };
    const server = spawn(process.execPath, ["server.js"], {
      cwd: root,
      env: { ...process.env, ...appEnv },
      stdio: ["ignore", "ignore", logFd],
    });
    cleanups.push(() => stopChild(server));
    await waitForHttp(baseUrl, server);
    const worker = spawn(path.join(root, "node_modules/.bin/tsx"), ["scripts/worker.ts"], {
      cwd: root,
      env: {
        ...process.env,
        ...fakes.env,
        DATABASE_URL: database.url,
        APP_ORIGIN: baseUrl,
        AWS_SDK_JS_NODE_VERSION_SUPPORT_WARNING_DISABLED: "true",
      },
      stdio: ["ignore", "ignore", "inherit"],
    });
    cleanups.push(() => stopChild(worker));

    project.provide("databaseUrl", database.url);
    project.provide("baseUrl", baseUrl);
    project.provide("mailDir", fakes.env.BAYPROOF_MAIL_CATCHER_DIR);
    project.provide("oidcUrl", fakes.env.OIDC_ISSUER);
    project.provide("s3", { endpoint: fakes.env.S3_ENDPOINT, bucket: fakes.env.S3_BUCKET });
    project.provide("searchUrl", fakes.env.SEARCH_URL);
    project.provide("serverLog", serverLog);
    project.provide("appEnv", appEnv);
  } catch (error) {
    await teardown();
    throw error;
  }
  return teardown;
}
