// Background work through pg-boss, a job queue kept in PostgreSQL: nothing is lost when a process
// dies, and any number of workers can run. Started by scripts/worker.ts. Like a route module, it
// joins the features (each queue's handler); the queue itself (names, payloads, enqueue) is
// app/jobs, which the features use and which imports none of them.
import PgBoss from "pg-boss";
import type pg from "pg";
import type { Db } from "../db/database";
import { removeOrphanedEvidence } from "~/reports/evidence.server";
import { sendDecisionMail } from "~/moderation/mail.server";
import { refreshCell } from "~/stats/refresh.server";
import { refreshBenchFigures } from "~/bench/figures.server";
import { indexReport } from "~/search/search.server";
import { latestSnapshot, writeSnapshot } from "~/feed/snapshot.server";
import { defaultStore } from "~/storage/s3.server";
import { config } from "~/config.server";
import { notifyPagesChanged } from "~/http-cache/notify.server";
import { createQueues, JOB_OPTIONS, QUEUES, work, WORKER_OPTIONS } from "~/jobs/queue.server";

export async function startWorker(connectionString: string, db: Db, pool: pg.Pool, log: (s: string) => void) {
  const boss = new PgBoss({ connectionString, schema: "pgboss", ...WORKER_OPTIONS });
  boss.on("error", (error) => log(`queue error: ${error.message}`));
  await boss.start();
  await createQueues(boss);
  // Hourly: uploads older than a day that never joined a submitted report.
  await boss.schedule(QUEUES.evidenceCleanup, "17 * * * *", {}, JOB_OPTIONS[QUEUES.evidenceCleanup]);
  await work(boss, QUEUES.evidenceCleanup, async () => {
    const removed = await removeOrphanedEvidence(db);
    if (removed) log(`removed ${removed} orphaned evidence objects`);
  });
  await work(boss, QUEUES.decisionMail, async ({ decisionId }) => {
    await sendDecisionMail(db, decisionId);
    log(`mailed decision ${decisionId}`);
  });
  await work(boss, QUEUES.statsRefresh, async ({ modelId, jobTypeId }) => {
    await refreshCell(db, modelId, jobTypeId);
  });
  await work(boss, QUEUES.benchFigures, async () => {
    await refreshBenchFigures(db);
  });
  await work(boss, QUEUES.searchIndex, async ({ reportId }) => {
    await indexReport(db, reportId);
    await notifyPagesChanged(db, "search");
  });
  // Daily at 03:15 UTC, and once now when there is none yet: the open data's bulk files.
  await boss.schedule(QUEUES.feedSnapshot, "15 3 * * *", {}, { ...JOB_OPTIONS[QUEUES.feedSnapshot], tz: "UTC" });
  await work(boss, QUEUES.feedSnapshot, async () => {
    const s = await writeSnapshot(db, pool, defaultStore, config.appOrigin);
    log(`wrote open-data snapshot ${s.id} (${s.reportCount} reports)`);
  });
  if (!(await latestSnapshot(db))) await boss.send(QUEUES.feedSnapshot, {}, JOB_OPTIONS[QUEUES.feedSnapshot]);
  return { boss, stop: () => boss.stop({ graceful: true, timeout: 10_000 }) };
}
