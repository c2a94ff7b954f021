// In-app notices to a reporter (a decision on one of their reports): the newest few, and marking
// them read. Written by moderation/decide.server.ts in the decision's transaction.
import { sql } from "kysely";
import type { Db } from "../../db/database";

/** The reporter's newest notices, read or not. */
export async function recentNotices(db: Db, userId: number, limit = 10) {
  return db
    .selectFrom("notices")
    .select(["id", "message", "created_at", "read_at", "report_id"])
    .where("user_id", "=", userId)
    .orderBy("created_at", "desc")
    .limit(limit)
    .execute();
}

export async function markNoticesRead(db: Db, userId: number) {
  await db
    .updateTable("notices")
    .set({ read_at: sql`now()` })
    .where("user_id", "=", userId)
    .where("read_at", "is", null)
    .execute();
}
