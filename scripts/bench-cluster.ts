// A throwaway PostgreSQL for a benchmark: started in a temporary folder, migrated, handed to `run`,
// then stopped and its folder deleted however the run ends — normally, by an error, or by SIGINT /
// SIGTERM / SIGHUP (a 1,000,000-report cluster is over a gigabyte). The process exits afterwards
// with the run's status (outside any try: nothing is skipped on the way out).
import { mkdtempSync, rmSync } from "node:fs";
import { tmpdir } from "node:os";
import path from "node:path";
import type { Kysely } from "kysely";
import { createDb } from "../db/database";
import { migrateToLatest } from "../db/migrate";
import type { Database } from "../db/schema";
import { freePort } from "./free-port";
import { type RunningPostgres, startPostgres } from "./postgres";

export async function benchCluster(
  run: (ctx: { db: Kysely<Database>; url: string }) => Promise<void>,
  { onStop }: { onStop?: () => Promise<void> | void } = {},
) {
  const dataDir = mkdtempSync(path.join(tmpdir(), "bayproof-bench-"));
  let pg: RunningPostgres | null = null;
  let db: Kysely<Database> | null = null;
  // One clean-up, however many ways the run ends at once (a signal makes the run fail too): every
  // caller waits for the same one to finish before the process may exit.
  let cleaning: Promise<void> | null = null;
  const cleanUp = () =>
    (cleaning ??= (async () => {
      await db?.destroy().catch(() => {});
      await Promise.resolve(onStop?.()).catch(() => {});
      try {
        pg?.stop();
      } catch (e) {
        console.error("stopping PostgreSQL:", e);
      }
      rmSync(pg?.dataDir ?? dataDir, { recursive: true, force: true });
      rmSync(dataDir, { recursive: true, force: true });
    })());
  const onSignal = (signal: NodeJS.Signals) => {
    console.error(`\n${signal}: stopping the benchmark's PostgreSQL and deleting its folder…`);
    void cleanUp().then(() => process.exit(128 + (signal === "SIGINT" ? 2 : signal === "SIGHUP" ? 1 : 15)));
  };
  for (const s of ["SIGINT", "SIGTERM", "SIGHUP"] as const) process.once(s, onSignal);
  let status = 0;
  try {
    pg = await startPostgres({ dataDir, port: await freePort(), fast: true });
    db = createDb(pg.url, 4);
    await migrateToLatest(db);
    await run({ db, url: pg.url });
  } catch (e) {
    console.error(e);
    status = 1;
  } finally {
    await cleanUp();
  }
  // Pools the benchmark imported (the app's own db, the search client) must not keep it alive.
  process.exit(status);
}
