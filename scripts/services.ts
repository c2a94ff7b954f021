// Starts what the app needs on this machine: PostgreSQL on loopback (unless DATABASE_URL points
// elsewhere) with migrations and demo data, and the local fakes of hosted services.
import path from "node:path";
import { createDb } from "../db/database";
import { prepareDatabase } from "./prepare-db";
import { startPostgres } from "./postgres";

export const root = path.resolve(import.meta.dirname, "..");
const log = (s: string) => console.log(`[bayproof] ${s}`);

export async function startServices() {
  const stops: (() => void | Promise<void>)[] = [];
  let databaseUrl = process.env.DATABASE_URL;
  if (!databaseUrl) {
    const dataDir = path.resolve(process.env.BAYPROOF_DATA_DIR ?? path.join(root, ".data"), "postgres");
    const pgServer = await startPostgres({ dataDir, port: Number(process.env.BAYPROOF_PGPORT ?? 54320), log });
    stops.push(() => pgServer.stop());
    databaseUrl = pgServer.url;
  }
  const db = createDb(databaseUrl, 2);
  try {
    await prepareDatabase(db, log);
  } finally {
    await db.destroy();
  }
  return {
    env: { DATABASE_URL: databaseUrl },
    async stop() {
      for (const stop of stops.reverse()) await stop();
    },
  };
}

export function onExit(cleanup: () => Promise<void> | void) {
  let exiting = false;
  for (const signal of ["SIGINT", "SIGTERM", "SIGHUP"] as const) {
    process.on(signal, async () => {
      if (exiting) return;
      exiting = true;
      log("Stopping…");
      await cleanup();
      process.exit(0);
    });
  }
}

export { log };
