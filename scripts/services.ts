// Starts what the app needs on this machine: PostgreSQL on loopback (unless DATABASE_URL points
// elsewhere) with migrations and demo data, and the local fakes of hosted services. Whatever was
// started is stopped by `stopServices()`, also when a signal arrives half-way through.
import path from "node:path";
import { createDb } from "../db/database";
import { startFakes } from "../fakes/index";
import { ensureDemoEvidence } from "../seeds/demo-evidence";
import { reindexAll, searchClient } from "../app/search/search.server";
import { prepareDatabase } from "./prepare-db";
import { makeFolders, startPostgres } from "./postgres";
import { ensurePortFree, StartError } from "./processes";
import { claimRunState } from "./run-state";

export const root = path.resolve(import.meta.dirname, "..");
// Node 20 is this project's platform; the storage SDK's notice about its future needs is not news.
process.env.AWS_SDK_JS_NODE_VERSION_SUPPORT_WARNING_DISABLED = "true";

/** One line on the terminal; a terminal that has gone away (SIGHUP) must not stop the clean-up. */
export function log(s: string) {
  try {
    console.log(`[bayproof] ${s}`);
  } catch {
    // stdout closed
  }
}

/** Clean-ups of what was started so far, last first. */
const stops: (() => void | Promise<void>)[] = [];
export function onStop(stop: () => void | Promise<void>) {
  stops.push(stop);
}
/** How long one clean-up may take before the next runs anyway (PostgreSQL's own stop waits longer inside). */
const STOP_STEP_MS = 30_000;

/** Runs every clean-up, last first. One that hangs (a fake waiting on a connection) is left behind after
 * STOP_STEP_MS, so the ones before it, PostgreSQL's stop among them, still run. */
export async function stopServices() {
  while (stops.length) {
    const stop = stops.pop()!;
    let timer: NodeJS.Timeout | undefined;
    try {
      const gaveUp = new Promise<"gave up">((resolve) => {
        timer = setTimeout(() => resolve("gave up"), STOP_STEP_MS);
      });
      if ((await Promise.race([Promise.resolve(stop()), gaveUp])) === "gave up")
        log(`a clean-up did not finish in ${STOP_STEP_MS / 1000} s; going on with the rest`);
    } catch (error) {
      log(`while stopping: ${(error as Error).message}`);
    } finally {
      clearTimeout(timer);
    }
  }
}

export async function startServices() {
  const dataDir = path.resolve(process.env.BAYPROOF_DATA_DIR ?? path.join(root, ".data"));
  makeFolders(dataDir);
  const runState = await claimRunState(dataDir, log);
  onStop(() => runState.release());
  const ports = {
    oidc: Number(process.env.BAYPROOF_OIDC_PORT ?? 54330),
    smtp: Number(process.env.BAYPROOF_SMTP_PORT ?? 54325),
    s3: Number(process.env.BAYPROOF_S3_PORT ?? 54340),
    search: Number(process.env.BAYPROOF_SEARCH_PORT ?? 54350),
  };
  await ensurePortFree(ports.oidc, "the local sign-in provider", "BAYPROOF_OIDC_PORT");
  await ensurePortFree(ports.smtp, "the local mail catcher", "BAYPROOF_SMTP_PORT");
  await ensurePortFree(ports.s3, "the local object store", "BAYPROOF_S3_PORT");
  await ensurePortFree(ports.search, "the local search service", "BAYPROOF_SEARCH_PORT");
  let databaseUrl = process.env.DATABASE_URL;
  if (!databaseUrl) {
    const pgServer = await startPostgres({
      dataDir: path.join(dataDir, "postgres"),
      port: Number(process.env.BAYPROOF_PGPORT ?? 54320),
      log,
    });
    onStop(() => pgServer.stop());
    databaseUrl = pgServer.url;
  }
  const fakes = await startFakes({ ports, dataDir, appOrigins: appOrigins() });
  onStop(() => fakes.stop());
  log(
    `Local fakes: sign-in provider ${fakes.env.OIDC_ISSUER}, mail catcher ${fakes.env.SMTP_URL} (read it at /dev/mail), object store ${fakes.env.S3_ENDPOINT}, search ${fakes.env.SEARCH_URL}`,
  );
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
    runState,
  };
}

/** The origins a browser may reach the app at locally, for the object store's CORS rules. */
function appOrigins() {
  const port = process.env.PORT ?? "3000";
  return [process.env.APP_ORIGIN, `http://127.0.0.1:${port}`, `http://localhost:${port}`].filter(
    (o): o is string => !!o,
  );
}

/**
 * Runs `main`; on Ctrl-C, SIGTERM or a closed terminal (SIGHUP) runs `beforeStop` (the children)
 * and then stops every service, once. A StartError is said in one line, without a stack trace.
 */
export async function runStartCommand(main: () => Promise<void>, beforeStop: () => Promise<void>) {
  let exiting = false;
  const exit = async (code: number) => {
    if (exiting) return;
    exiting = true;
    if (code === 0) log("Stopping…");
    await beforeStop();
    await stopServices();
    if (code === 0) log("Stopped");
    process.exit(code);
  };
  // Writing to a terminal that has gone away fails; the clean-up must go on regardless.
  process.stdout.on("error", () => {});
  process.stderr.on("error", () => {});
  for (const signal of ["SIGINT", "SIGTERM", "SIGHUP"] as const) {
    process.on(signal, () => void exit(0));
  }
  try {
    await main();
  } catch (error) {
    if (error instanceof StartError) log(error.message);
    else console.error(error);
    await exit(1);
  }
  return {
    exit,
    get exiting() {
      return exiting;
    },
  };
}
