// The background worker: `npm start` runs one beside the web server; in production run as many as
// needed, each with DATABASE_URL and the storage variables.
import { createDb, createPool } from "../db/database";
import { config } from "../app/config.server";
import { startWorker } from "../app/worker.server";

const url = config.databaseUrl;
const pool = createPool(url, 4);
const db = createDb(pool);
const log = (s: string) => console.log(`[worker] ${s}`);
const worker = await startWorker(url, db, pool, log);
log("waiting for jobs");
async function shutdown() {
  await worker.stop();
  await db.destroy();
  process.exit(0);
}
for (const signal of ["SIGINT", "SIGTERM"] as const) process.on(signal, () => void shutdown());
