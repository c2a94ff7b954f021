// Starts what the app needs on this machine: PostgreSQL on loopback (unless DATABASE_URL points
// elsewhere) with migrations and demo data, and the local fakes of hosted services.
import path from "node:path";
import { createDb } from "../db/database";
import { startFakes } from "../fakes/index";
import { ensureDemoEvidence } from "../seeds/demo-evidence";
import { reindexAll, searchClient } from "../app/search/search.server";
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
    ports: {
      oidc: Number(process.env.BAYPROOF_OIDC_PORT ?? 54330),
      smtp: Number(process.env.BAYPROOF_SMTP_PORT ?? 54325),
      s3: Number(process.env.BAYPROOF_S3_PORT ?? 54340),
      search: Number(process.env.BAYPROOF_SEARCH_PORT ?? 54350),
    },
    dataDir,
    appOrigins: appOrigins(),
  });
  stops.push(() => fakes.stop());
  log(`Local fakes: sign-in provider ${fakes.env.OIDC_ISSUER}, mail catcher ${fakes.env.SMTP_URL} (read it at /dev/mail), object store ${fakes.env.S3_ENDPOINT}, search ${fakes.env.SEARCH_URL}`);
  const db = createDb(databaseUrl, 2);
  try {
    await prepareDatabase(db, log);
    const placed = await ensureDemoEvidence(db, fakes.env);
    if (placed) log(`Placed ${placed} demo evidence files in the local object store`);
    // The local search fake keeps its index in memory: fill it on every start.
    log(`Indexed ${await reindexAll(db, searchClient(fakes.env.SEARCH_URL))} documents in the local search service`);
  } finally {
    await db.destroy();
  }
  return {
    env: { DATABASE_URL: databaseUrl, ...fakes.env, AWS_SDK_JS_NODE_VERSION_SUPPORT_WARNING_DISABLED: "true" },
    async stop() {
      for (const stop of stops.reverse()) await stop();
    },
  };
}

/** The origins a browser may reach the app at locally, for the object store's CORS rules. */
function appOrigins() {
  const port = process.env.PORT ?? "3000";
  return [process.env.APP_ORIGIN, `http://127.0.0.1:${port}`, `http://localhost:${port}`].filter((o): o is string => !!o);
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
