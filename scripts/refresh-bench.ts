// `npm run bench:refresh`: recompute every stored bench figure from the accepted bench runs and
// reports (DATABASE_URL). prepare-db.ts uses `refreshBenchFiguresWhenEmpty` after the demo loads.
import { pathToFileURL } from "node:url";
import type { Kysely } from "kysely";
import { createDb, DEFAULT_DATABASE_URL } from "../db/database";
import type { Database } from "../db/schema";
import { refreshBenchFigures } from "../app/bench/figures.server";

function describe(c: Awaited<ReturnType<typeof refreshBenchFigures>>) {
  return `${c.pooled} pooled figures, ${c.agreements} rig agreements, ${c.slopes} pressure lines, ${c.jobs} job force fits`;
}

/** Computes the bench figures when none are stored and there are accepted runs to compute them from. */
export async function refreshBenchFiguresWhenEmpty(db: Kysely<Database>, log: (s: string) => void) {
  const stored = await db.selectFrom("bench_pooled_figures").select("tool_model_id").limit(1).executeTakeFirst();
  if (stored) return;
  const runs = await db
    .selectFrom("bench_runs")
    .select("id")
    .where("status", "=", "accepted")
    .limit(1)
    .executeTakeFirst();
  if (!runs) return;
  const t0 = Date.now();
  const counts = await refreshBenchFigures(db);
  log(`Computed ${describe(counts)} in ${((Date.now() - t0) / 1000).toFixed(1)} s`);
}

if (import.meta.url === pathToFileURL(process.argv[1] ?? "").href) {
  const db = createDb(process.env.DATABASE_URL ?? DEFAULT_DATABASE_URL, 2);
  const t0 = Date.now();
  const counts = await refreshBenchFigures(db);
  console.log(`Refreshed ${describe(counts)} in ${((Date.now() - t0) / 1000).toFixed(2)} s`);
  await db.destroy();
}
