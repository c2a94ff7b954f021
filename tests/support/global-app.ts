// End-to-end: a throwaway database, a production build of the app, and react-router-serve on a
// free loopback port — the same path `npm start` takes.
import { spawn, spawnSync } from "node:child_process";
import path from "node:path";
import type { TestProject } from "vitest/node";
import { waitForHttp } from "../../scripts/wait-http";
import { ensureChromium, freePort, startTestDatabase } from "./system";

const root = path.resolve(import.meta.dirname, "../..");

export default async function setup(project: TestProject) {
  ensureChromium();
  const database = await startTestDatabase();
  const build = spawnSync(path.join(root, "node_modules/.bin/react-router"), ["build"], { cwd: root, encoding: "utf8" });
  if (build.status !== 0) {
    database.stop();
    throw new Error(`react-router build failed:\n${build.stdout}\n${build.stderr}`);
  }
  const port = await freePort();
  const server = spawn(path.join(root, "node_modules/.bin/react-router-serve"), ["./build/server/index.js"], {
    cwd: root,
    env: { ...process.env, DATABASE_URL: database.url, HOST: "127.0.0.1", PORT: String(port), NODE_ENV: "production" },
    stdio: ["ignore", "ignore", "inherit"],
  });
  const baseUrl = `http://127.0.0.1:${port}`;
  try {
    await waitForHttp(baseUrl, server);
  } catch (error) {
    server.kill();
    database.stop();
    throw error;
  }
  project.provide("baseUrl", baseUrl);
  project.provide("databaseUrl", database.url);
  return async () => {
    const exited = new Promise((resolve) => server.once("exit", resolve));
    server.kill("SIGTERM");
    await exited;
    database.stop();
  };
}
