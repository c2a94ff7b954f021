// Telling every app process that public pages changed: a NOTIFY on one channel, sent inside the
// transaction that made the change, so it is delivered when (and only if) that transaction commits.
import { sql } from "kysely";
import type { Db } from "../../db/database";

export const PAGES_CHANNEL = "bayproof_pages";

/** What changed: an accept, a stats refresh, the catalogue or the bench figures (both notified by database triggers), the search index, a snapshot, a reporter's handle. */
export type PageChange = "report" | "stats" | "catalogue" | "bench" | "search" | "snapshot" | "reporter";

export async function notifyPagesChanged(db: Db, what: PageChange): Promise<void> {
  await sql`select pg_notify(${PAGES_CHANNEL}, ${what})`.execute(db);
}
