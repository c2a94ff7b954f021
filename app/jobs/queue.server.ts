// Enqueueing background work from the app, inside the caller's transaction, so a decision and its
// mail either both happen or neither does. Every queue's retry options live here, once.
import PgBoss from "pg-boss";
import { CompiledQuery } from "kysely";
import type { Trx } from "../../db/database";
import { config } from "~/config.server";

export const QUEUES = {
  evidenceCleanup: "evidence-cleanup",
  decisionMail: "decision-mail",
  statsRefresh: "stats-refresh",
  searchIndex: "search-index",
  feedSnapshot: "feed-snapshot",
  benchFigures: "bench-figures-refresh",
} as const;
export type QueueName = (typeof QUEUES)[keyof typeof QUEUES];

/** What each queue's jobs carry: `enqueue` takes it and the worker's handlers (`work`) receive it. */
export interface JobPayloads {
  [QUEUES.evidenceCleanup]: Record<string, never>;
  [QUEUES.decisionMail]: { decisionId: number };
  [QUEUES.statsRefresh]: { modelId: number; jobTypeId: number };
  [QUEUES.searchIndex]: { reportId: number };
  [QUEUES.feedSnapshot]: Record<string, never>;
  [QUEUES.benchFigures]: Record<string, never>;
}

/**
 * Mail must outlast a relay outage of a day. pg-boss (10.x, src/plans.js `failJobs`) waits
 * retryDelay × 2^(k−1) × (1 + random) seconds before retry k (the exponent stops growing at 16;
 * there is no other cap). With 3 s and 15 retries the waits are 3–6 s, 6–12 s, 12–24 s, 24–48 s,
 * 48–96 s, 1.6–3.2 min, 3.2–6.4 min, 6.4–13 min, 13–26 min, 26–51 min, 51–102 min, 1.7–3.4 h,
 * 3.4–6.8 h, 6.8–13.7 h and 13.7–27.3 h: 16 attempts over 27.3 h at the least (3 × (2^15 − 1) s)
 * and 54.6 h at the most, plus each attempt's own time. Early retries cover a relay that blinks.
 * expireInSeconds bounds one attempt (nodemailer's timeouts are shorter). A job waiting to run
 * is archived by maintenance once keep_until (send time + retention) passes, so retention (7
 * days) must exceed the whole schedule. A job that still fails stays `failed` in the job table for
 * WORKER_OPTIONS.archiveFailedAfterSeconds and is listed on /admin/jobs ("Stuck work").
 */
export const MAIL_RETRY = {
  retryLimit: 15,
  retryDelay: 3,
  retryBackoff: true,
  expireInSeconds: 5 * 60,
  retentionDays: 7,
} as const;

/** Options each queue's jobs get when sent (enqueue merges them in; a caller may override). */
export const JOB_OPTIONS: Record<QueueName, PgBoss.SendOptions> = {
  [QUEUES.evidenceCleanup]: { retryLimit: 2, retryDelay: 60 },
  [QUEUES.decisionMail]: MAIL_RETRY,
  [QUEUES.statsRefresh]: { retryLimit: 5, retryDelay: 5, retryBackoff: true },
  [QUEUES.searchIndex]: { retryLimit: 10, retryDelay: 5, retryBackoff: true, retentionDays: 2 },
  [QUEUES.feedSnapshot]: { retryLimit: 3, retryDelay: 300, expireInSeconds: 60 * 60 },
  [QUEUES.benchFigures]: { retryLimit: 5, retryDelay: 5, retryBackoff: true },
};

/**
 * The worker's housekeeping: failed jobs stay in the job table (where pg-boss can retry them)
 * for 30 days, so stuck work is listed until someone acts on it.
 */
export const WORKER_OPTIONS = {
  archiveFailedAfterSeconds: 30 * 24 * 3600,
  archiveCompletedAfterSeconds: 12 * 3600,
  deleteAfterDays: 7,
} as const;

/** The snapshot and bench-figures queues hold at most one waiting and one running job, however many workers ask. */
const POLICY: Partial<Record<QueueName, PgBoss.QueuePolicy>> = {
  [QUEUES.feedSnapshot]: "stately",
  [QUEUES.benchFigures]: "stately",
};

/** Creates every queue (a no-op for those that exist), in the app and in the worker alike. */
export async function createQueues(b: PgBoss) {
  for (const name of Object.values(QUEUES)) await b.createQueue(name, { name, policy: POLICY[name] ?? "standard" });
}

let boss: Promise<PgBoss> | null = null;

/** One pg-boss client per process; the app only sends, the worker (scripts/worker.ts) works. */
export function queue(): Promise<PgBoss> {
  boss ??= (async () => {
    const b = new PgBoss({
      connectionString: config.databaseUrl,
      schema: "pgboss",
      supervise: false,
      schedule: false,
      max: 2,
    });
    b.on("error", (error) => console.warn(`[queue] ${error.message}`));
    await b.start();
    await createQueues(b);
    return b;
  })();
  return boss;
}

/** A pg-boss `db` option that runs its SQL through a Kysely transaction. */
export function inTransaction(trx: Trx) {
  return {
    executeSql: async (text: string, values: unknown[]) => ({
      rows: (await trx.executeQuery(CompiledQuery.raw(text, values))).rows,
    }),
  };
}

/** Enqueues a job through the caller's transaction, with its queue's options. */
export function enqueue<N extends QueueName>(
  trx: Trx,
  name: N,
  data: JobPayloads[N],
  options: PgBoss.SendOptions = {},
) {
  return sendThrough(trx, name, data, options);
}

/** Sends again what a job of `name` carried when it was first sent (stuck.server.ts). */
export async function sendThrough(trx: Trx, name: QueueName, data: object, options: PgBoss.SendOptions = {}) {
  const b = await queue();
  return b.send(name, data, { ...JOB_OPTIONS[name], ...options, db: inTransaction(trx) });
}

/** The worker's side: one handler per job of queue `name`, given the payload `enqueue` was sent. */
export function work<N extends QueueName>(boss: PgBoss, name: N, handler: (data: JobPayloads[N]) => Promise<void>) {
  return boss.work<JobPayloads[N]>(name, async ([job]) => {
    if (job) await handler(job.data);
  });
}
