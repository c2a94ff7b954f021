// Test-side helpers to start throwaway services: a free loopback port, a temporary PostgreSQL
// cluster with the schema and demo data, and Debian's Chromium.
import { spawnSync } from "node:child_process";
import { existsSync, mkdtempSync, rmSync } from "node:fs";
import { tmpdir } from "node:os";
import path from "node:path";
import { createDb } from "../../db/database";
import { startFakes } from "../../fakes/index";
import { prepareDatabase } from "../../scripts/prepare-db";
import { freePort } from "../../scripts/free-port";
import { startPostgres } from "../../scripts/postgres";

export { freePort };

/**
 * A throwaway database with the demo data, a data folder, and the fakes on free ports, for a
 * server that will listen at the returned `baseUrl`. Each clean-up is pushed onto `cleanups`
 * (run them last first).
 */
export async function startTestServices(cleanups: (() => unknown)[], prefix = "bayproof-test-data-") {
  const database = await startTestDatabase();
  cleanups.push(() => database.stop());
  const dataDir = mkdtempSync(path.join(tmpdir(), prefix));
  cleanups.push(() => rmSync(dataDir, { recursive: true, force: true }));
  const port = await freePort();
  const baseUrl = `http://127.0.0.1:${port}`;
  const fakes = await startFakes({
    ports: { oidc: await freePort(), smtp: await freePort(), s3: await freePort(), search: await freePort() },
    dataDir,
    appOrigins: [baseUrl],
  });
  return { database, dataDir, port, baseUrl, fakes };
}

/** A fresh cluster in a temporary folder, never the demo data; removed on stop. */
export async function startTestDatabase() {
  const dataDir = mkdtempSync(path.join(tmpdir(), "bayproof-test-pg-"));
  const server = await startPostgres({ dataDir, port: await freePort(), fast: true });
  const db = createDb(server.url, 2);
  await prepareDatabase(db, () => {});
  await db.destroy();
  return {
    url: server.url,
    restart: () => server.restart(),
    stop() {
      server.stop();
      rmSync(dataDir, { recursive: true, force: true });
    },
  };
}

export const CHROMIUM = "/usr/bin/chromium";

export function ensureChromium() {
  if (existsSync(CHROMIUM)) return;
  if (process.getuid?.() !== 0) {
    throw new Error("Chromium is missing. Install Debian's package first: sudo apt-get install -y chromium");
  }
  spawnSync("apt-get", ["update", "-qq"], { stdio: "inherit" });
  const r = spawnSync("apt-get", ["install", "-y", "-qq", "chromium"], {
    stdio: "inherit",
    env: { ...process.env, DEBIAN_FRONTEND: "noninteractive" },
  });
  if (r.status !== 0 || !existsSync(CHROMIUM)) throw new Error("apt-get could not install chromium");
}
