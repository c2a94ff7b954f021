// Bans: the account stops working at once — every session row is deleted and every API key
// revoked in the same transaction — and each ban or unban is logged with its reason in the
// append-only ban_changes table, as role changes are in role_changes. Unbanning lets the person
// sign in again; it revives no old session and no old key.
import { sql } from "kysely";
import type { Db } from "../../db/database";
import { AppError } from "~/utils/errors";

export const BAN_REASON_MIN = 3;
export const BAN_REASON_MAX = 500;

/** Bans or unbans, logging who did it and why; a change that changes nothing logs nothing. */
export async function changeBan(db: Db, actorId: number, userId: number, change: "ban" | "unban", reason: string) {
  if (change === "ban" && actorId === userId) throw new AppError("You cannot ban yourself.", 400);
  return db.transaction().execute(async (trx) => {
    const target = await trx
      .selectFrom("users")
      .select(["id", "banned_at"])
      .where("id", "=", userId)
      .forUpdate()
      .executeTakeFirst();
    if (!target) throw new AppError("No such user.", 404);
    if ((change === "ban") === (target.banned_at !== null)) return false;
    await trx
      .updateTable("users")
      .set({ banned_at: change === "ban" ? sql`now()` : null })
      .where("id", "=", userId)
      .execute();
    if (change === "ban") {
      await trx.deleteFrom("sessions").where("user_id", "=", userId).execute();
      await trx
        .updateTable("api_keys")
        .set({ revoked_at: sql`now()` })
        .where("user_id", "=", userId)
        .where("revoked_at", "is", null)
        .execute();
    }
    await trx
      .insertInto("ban_changes")
      .values({ user_id: userId, change, reason: reason.trim(), changed_by: actorId })
      .execute();
    return true;
  });
}

/** One user for the admin's page: who they are, their standing and their ban log, newest first. */
export async function userForAdmin(db: Db, userId: number) {
  const user = await db
    .selectFrom("users")
    .select(["id", "handle", "email", "created_at", "banned_at"])
    .where("id", "=", userId)
    .executeTakeFirst();
  if (!user) return null;
  const [bans, activity] = await Promise.all([
    db
      .selectFrom("ban_changes as b")
      .leftJoin("users as a", "a.id", "b.changed_by")
      .select(["b.id", "b.change", "b.reason", "b.created_at", "a.handle as actor_handle"])
      .where("b.user_id", "=", userId)
      .orderBy("b.created_at", "desc")
      .orderBy("b.id", "desc")
      .limit(50)
      .execute(),
    db
      .selectFrom("users as u")
      .where("u.id", "=", userId)
      .select([
        sql<number>`(select count(*)::int from sessions s where s.user_id = u.id)`.as("sessions"),
        sql<number>`(select count(*)::int from api_keys k where k.user_id = u.id and k.revoked_at is null)`.as(
          "activeKeys",
        ),
      ])
      .executeTakeFirstOrThrow(),
  ]);
  return { user, bans, ...activity };
}
