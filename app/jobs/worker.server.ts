// Background work through pg-boss, a job queue kept in PostgreSQL: nothing is lost when a process
// dies, and any number of workers can run. Started by scripts/worker.ts.
import PgBoss from "pg-boss";
import type { Kysely } from "kysely";
import type { Database } from "../../db/schema";
import { removeOrphanedEvidence } from "~/reports/evidence.server";
import { sendDecisionMail } from "~/moderation/mail.server";
import { refreshCell } from "~/stats/refresh.server";
import { indexReport } from "~/search/search.server";
import { QUEUES } from "./queue.server";

export async function startWorker(connectionString: string, db: Kysely<Database>, log: (s: string) => void) {
  const boss = new PgBoss({ connectionString, schema: "pgboss" });
  boss.on("error", (error) => log(`queue error: ${error.message}`));
  await boss.start();
  for (const name of Object.values(QUEUES)) await boss.createQueue(name);
  // Hourly: uploads older than a day that never joined a submitted report.
  await boss.schedule(QUEUES.evidenceCleanup, "17 * * * *");
  await boss.work(QUEUES.evidenceCleanup, async () => {
    const removed = await removeOrphanedEvidence(db);
    if (removed) log(`removed ${removed} orphaned evidence objects`);
  });
  await boss.work<{ decisionId: number }>(QUEUES.decisionMail, async ([job]) => {
    await sendDecisionMail(db, job!.data.decisionId);
    log(`mailed decision ${job!.data.decisionId}`);
  });
  await boss.work<{ modelId: number; jobTypeId: number }>(QUEUES.statsRefresh, async ([job]) => {
    await refreshCell(db, job!.data.modelId, job!.data.jobTypeId);
  });
  await boss.work<{ reportId: number }>(QUEUES.searchIndex, async ([job]) => {
    await indexReport(db, job!.data.reportId);
  });
  return { boss, stop: () => boss.stop({ graceful: true, timeout: 10_000 }) };
}
