// Starts what the app needs on this machine: PostgreSQL on loopback (unless DATABASE_URL points
// elsewhere) with migrations and demo data, and the local fakes of hosted services.
import path from "node:path";
import { createDb } from "../db/database";
import { startFakes } from "../fakes/index";
import { prepareDatabase } from "./prepare-db";
import { startPostgres } from "./postgres";

export const root = path.resolve(import.meta.dirname, "..");
const log = (s: string) => console.log(`[bayproof] ${s}`);

export async function startServices() {
  const stops: (() => void | Promise<void>)[] = [];
  const dataDir = path.resolve(process.env.BAYPROOF_DATA_DIR ?? path.join(root, ".data"));
  let databaseUrl = process.env.DATABASE_URL;
  if (!databaseUrl) {
    const pgServer = await startPostgres({ dataDir: path.join(dataDir, "postgres"), port: Number(process.env.BAYPROOF_PGPORT ?? 54320), log });
    stops.push(() => pgServer.stop());
    databaseUrl = pgServer.url;
  }
  const fakes = await startFakes({
    ports: { oidc: Number(process.env.BAYPROOF_OIDC_PORT ?? 54330), smtp: Number(process.env.BAYPROOF_SMTP_PORT ?? 54325) },
    dataDir,
  });
  stops.push(() => fakes.stop());
  log(`Local fakes: sign-in provider ${fakes.env.OIDC_ISSUER}, mail catcher ${fakes.env.SMTP_URL} (read it at /dev/mail)`);
  const db = createDb(databaseUrl, 2);
  try {
    await prepareDatabase(db, log);
  } finally {
    await db.destroy();
  }
  return {
    env: { DATABASE_URL: databaseUrl, ...fakes.env },
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
