import { sql } from "kysely";
import type { Db } from "../../db/database";

export async function listSessions(db: Db, userId: number) {
  return db
    .selectFrom("sessions")
    .select(["id_hash", "created_at", "last_seen_at", "expires_at", "user_agent", "sign_in_method"])
    .where("user_id", "=", userId)
    .where("expires_at", ">", sql<Date>`now()`)
    .orderBy("last_seen_at", "desc")
    .execute();
}

/** Ends one of the user's own sessions, identified by a short public prefix of its hash. */
export async function endSession(db: Db, userId: number, hashPrefix: string) {
  const r = await db
    .deleteFrom("sessions")
    .where("user_id", "=", userId)
    .where("id_hash", "like", `${hashPrefix}%`)
    .executeTakeFirst();
  return r.numDeletedRows > 0n;
}

export async function endOtherSessions(db: Db, userId: number, currentHash: string) {
  await db.deleteFrom("sessions").where("user_id", "=", userId).where("id_hash", "!=", currentHash).execute();
}
