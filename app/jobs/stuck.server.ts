// Stuck work: background jobs that ran out of retries (failed) or are waiting for another try,
// read from pg-boss's own job table, described in plain words, and sent again on an admin's word.
import { sql } from "kysely";
import type { Db } from "../../db/database";
import { inTransaction, queue, QUEUES, type QueueName, sendThrough } from "./queue.server";

export interface StuckJob {
  id: string;
  queue: string;
  state: "failed" | "retry";
  what: string;
  lastError: string | null;
  attempts: number;
  allowedAttempts: number;
  createdAt: string;
  /** When it failed for good, or when it will be tried next. */
  at: string;
  canSendAgain: boolean;
}

interface JobRow {
  id: string;
  name: string;
  data: Record<string, unknown> | null;
  state: "failed" | "retry";
  retry_count: number;
  retry_limit: number;
  started_on: Date | null;
  created_on: Date;
  completed_on: Date | null;
  start_after: Date;
  output: { message?: string } | null;
}

const isQueue = (name: string): name is QueueName => (Object.values(QUEUES) as string[]).includes(name);

/** Failed jobs of every queue, then those waiting to retry after at least one failed attempt. */
export async function stuckJobs(db: Db, limit = 200): Promise<StuckJob[]> {
  const { rows } = await sql<JobRow>`
    select id, name, data, state::text as state, retry_count, retry_limit, started_on, created_on, completed_on, start_after, output
    from pgboss.job
    where state = 'failed' or (state = 'retry' and started_on is not null)
    order by state = 'failed' desc, coalesce(completed_on, start_after) desc
    limit ${limit}`.execute(db);
  const described = await describe(db, rows);
  return rows.map((j, i) => ({
    id: j.id,
    queue: j.name,
    state: j.state,
    what: described[i]!,
    lastError: typeof j.output?.message === "string" ? j.output.message : null,
    // retry_count counts retries begun; a failed job's last attempt is one more than that.
    attempts: j.started_on ? j.retry_count + 1 : 0,
    allowedAttempts: j.retry_limit + 1,
    createdAt: new Date(j.created_on).toISOString(),
    at: new Date(j.state === "failed" ? (j.completed_on ?? j.start_after) : j.start_after).toISOString(),
    canSendAgain: j.state === "failed" && isQueue(j.name),
  }));
}

const VERB: Record<string, string> = { accept: "accepted", return: "returned", reject: "rejected" };

/** What each job was for, in the words of the people who would miss it. */
async function describe(db: Db, jobs: JobRow[]): Promise<string[]> {
  const num = (j: JobRow, key: string) => (typeof j.data?.[key] === "number" ? j.data[key] : null);
  const decisionIds = jobs
    .filter((j) => j.name === QUEUES.decisionMail)
    .map((j) => num(j, "decisionId"))
    .filter((n): n is number => n != null);
  const decisions = decisionIds.length
    ? await db
        .selectFrom("decisions as d")
        .innerJoin("reports as r", "r.id", "d.report_id")
        .innerJoin("users as u", "u.id", "r.reporter_id")
        .select(["d.id", "d.action", "r.id as report_id", "u.email"])
        .where("d.id", "in", decisionIds)
        .execute()
    : [];
  const byDecision = new Map(decisions.map((d) => [d.id, d]));
  return jobs.map((j) => {
    switch (j.name) {
      case QUEUES.decisionMail: {
        const d = byDecision.get(num(j, "decisionId") ?? -1);
        return d
          ? `Mail to ${d.email} that report #${d.report_id} was ${VERB[d.action] ?? d.action} (decision #${d.id})`
          : `Mail about decision #${num(j, "decisionId") ?? "?"} (no longer on record)`;
      }
      case QUEUES.statsRefresh:
        return `Recompute the stats of tool model #${num(j, "modelId") ?? "?"} on job type #${num(j, "jobTypeId") ?? "?"}`;
      case QUEUES.searchIndex:
        return `Update report #${num(j, "reportId") ?? "?"} in search`;
      case QUEUES.evidenceCleanup:
        return "Remove uploads that never joined a submitted report";
      case QUEUES.feedSnapshot:
        return "Write the daily snapshot of the open data";
      default:
        return `Job of the "${j.name}" queue`;
    }
  });
}

export type SendAgainResult = { ok: true; newId: string } | { ok: false; status: 404 | 409; message: string };

/**
 * Sends a failed job again as a new job of its queue, with the queue's full retry schedule, and
 * removes the failed one — in one transaction, so it is never both or neither.
 */
export async function sendAgain(db: Db, id: string): Promise<SendAgainResult> {
  const boss = await queue();
  return db.transaction().execute(async (trx) => {
    const { rows } = await sql<{ name: string; data: object | null; state: string }>`
      select name, data, state::text as state from pgboss.job where id = ${id}::uuid for update`.execute(trx);
    const job = rows[0];
    if (!job)
      return {
        ok: false as const,
        status: 404 as const,
        message: "That job is no longer on record; it may have been sent again already.",
      };
    if (job.state !== "failed" || !isQueue(job.name))
      return { ok: false as const, status: 409 as const, message: "Only failed work can be sent again." };
    const newId = await sendThrough(trx, job.name, job.data ?? {});
    if (!newId)
      return { ok: false as const, status: 409 as const, message: "The same work is already waiting to run." };
    await boss.deleteJob(job.name, id, { db: inTransaction(trx) });
    return { ok: true as const, newId };
  });
}
