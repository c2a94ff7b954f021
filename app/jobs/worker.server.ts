// Background work through pg-boss, a job queue kept in PostgreSQL: nothing is lost when a process
// dies, and any number of workers can run. Started by scripts/worker.ts.
import PgBoss from "pg-boss";
import type { Kysely } from "kysely";
import type { Database } from "../../db/schema";
import { removeOrphanedEvidence } from "~/reports/evidence.server";

export const QUEUES = {
  evidenceCleanup: "evidence-cleanup",
} as const;

export async function startWorker(connectionString: string, db: Kysely<Database>, log: (s: string) => void) {
  const boss = new PgBoss({ connectionString, schema: "pgboss" });
  boss.on("error", (error) => log(`queue error: ${error.message}`));
  await boss.start();
  await boss.createQueue(QUEUES.evidenceCleanup);
  // Hourly: uploads older than a day that never joined a submitted report.
  await boss.schedule(QUEUES.evidenceCleanup, "17 * * * *");
  await boss.work(QUEUES.evidenceCleanup, async () => {
    const removed = await removeOrphanedEvidence(db);
    if (removed) log(`removed ${removed} orphaned evidence objects`);
  });
  return { boss, stop: () => boss.stop({ graceful: true, timeout: 10_000 }) };
}
