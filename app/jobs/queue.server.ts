// Enqueueing background work from the app, inside the caller's transaction, so a decision and its
// mail either both happen or neither does.
import PgBoss from "pg-boss";
import { CompiledQuery, type Transaction } from "kysely";
import type { Database } from "../../db/schema";
import { DEFAULT_DATABASE_URL } from "../../db/database";

export const QUEUES = {
  evidenceCleanup: "evidence-cleanup",
  decisionMail: "decision-mail",
  statsRefresh: "stats-refresh",
  searchIndex: "search-index",
} as const;
export type QueueName = (typeof QUEUES)[keyof typeof QUEUES];

/** Delivery retries for mail: 6 tries, 2 s apart and growing (pg-boss retryBackoff). */
export const MAIL_RETRY = { retryLimit: 6, retryDelay: 2, retryBackoff: true } as const;

let boss: Promise<PgBoss> | null = null;

/** One pg-boss client per process; the app only sends, the worker (scripts/worker.ts) works. */
export function queue(): Promise<PgBoss> {
  boss ??= (async () => {
    const b = new PgBoss({ connectionString: process.env.DATABASE_URL ?? DEFAULT_DATABASE_URL, schema: "pgboss", supervise: false, schedule: false, max: 2 });
    b.on("error", (error) => console.warn(`[queue] ${error.message}`));
    await b.start();
    for (const name of Object.values(QUEUES)) await b.createQueue(name);
    return b;
  })();
  return boss;
}

/** Enqueues a job through the caller's transaction. */
export async function enqueue(trx: Transaction<Database>, name: QueueName, data: object, options: PgBoss.SendOptions = {}) {
  const b = await queue();
  const db = {
    executeSql: async (text: string, values: unknown[]) => ({ rows: (await trx.executeQuery(CompiledQuery.raw(text, values))).rows as unknown[] }),
  };
  return b.send(name, data, { ...options, db });
}
