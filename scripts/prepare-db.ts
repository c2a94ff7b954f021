// Applies migrations and loads the demo scenario when the database is empty.
import { pathToFileURL } from "node:url";
import { type Kysely, sql } from "kysely";
import { createDb } from "../db/database";
import { migrateToLatest } from "../db/migrate";
import type { Database } from "../db/schema";
import { loadDemoScenario } from "../seeds/index";
import { refreshAll } from "../app/stats/refresh.server";

export async function prepareDatabase(db: Kysely<Database>, log: (s: string) => void = console.log) {
  const applied = await migrateToLatest(db);
  if (applied.length) log(`Applied migrations: ${applied.join(", ")}`);
  const t0 = Date.now();
  const seeded = await loadDemoScenario(db);
  if (seeded.loaded) {
    // Planner statistics now rather than when autovacuum next looks (PostgreSQL manual, "Populating a
    // Database": run ANALYZE after a bulk load); until then the first pages and feed answers are
    // planned from guesses.
    await sql`analyze`.execute(db);
    log(`Loaded the demo scenario: ${seeded.reports} reports in ${((Date.now() - t0) / 1000).toFixed(1)} s`);
  } else log("Demo scenario already present; left as it is");
  const cells = await db
    .selectFrom("stats_cells")
    .select((eb) => eb.fn.countAll<string>().as("n"))
    .executeTakeFirstOrThrow();
  if (Number(cells.n) === 0) {
    const t1 = Date.now();
    log(`Computed ${await refreshAll(db)} stats cells in ${((Date.now() - t1) / 1000).toFixed(1)} s`);
  }
  // Imported here, not at the top: the bench refresh reaches the job queue, which reads the app's
  // configuration from the environment when first imported, and tests set that environment after
  // importing this file.
  const { refreshBenchFiguresWhenEmpty } = await import("./refresh-bench");
  await refreshBenchFiguresWhenEmpty(db, log);
}

// `npm run db:prepare`: the same against DATABASE_URL (a database npm start does not manage).
if (import.meta.url === pathToFileURL(process.argv[1] ?? "").href) {
  const url = process.env.DATABASE_URL;
  if (!url) throw new Error("DATABASE_URL is not set");
  const db = createDb(url, 2);
  await prepareDatabase(db).finally(() => db.destroy());
}
