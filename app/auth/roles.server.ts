import { sql } from "kysely";
import type { Db } from "../../db/database";
import type { Role } from "./session.server";
import { AppError } from "~/utils/errors";

/** Grants or removes a role, logging who did it; idempotent changes log nothing. */
export async function changeRole(db: Db, actorId: number, userId: number, role: Role, change: "grant" | "revoke") {
  if (change === "revoke" && role === "admin" && actorId === userId) {
    throw new AppError("You cannot remove your own admin role; ask another admin.");
  }
  return db.transaction().execute(async (trx) => {
    const target = await trx.selectFrom("users").select("id").where("id", "=", userId).forUpdate().executeTakeFirst();
    if (!target) throw new AppError("No such user.");
    const changed =
      change === "grant"
        ? (
            await trx
              .insertInto("user_roles")
              .values({ user_id: userId, role, granted_by: actorId })
              .onConflict((oc) => oc.columns(["user_id", "role"]).doNothing())
              .executeTakeFirst()
          ).numInsertedOrUpdatedRows! > 0n
        : (await trx.deleteFrom("user_roles").where("user_id", "=", userId).where("role", "=", role).executeTakeFirst())
            .numDeletedRows > 0n;
    if (changed)
      await trx.insertInto("role_changes").values({ user_id: userId, role, change, changed_by: actorId }).execute();
    return changed;
  });
}

export async function searchUsers(db: Db, q: string, limit = 50) {
  let query = db
    .selectFrom("users as u")
    .leftJoin("shops as s", "s.id", "u.shop_id")
    .select([
      "u.id",
      "u.handle",
      "u.email",
      "u.created_at",
      "u.banned_at",
      "s.name as shop_name",
      sql<
        Role[]
      >`coalesce((select array_agg(ur.role order by ur.role) from user_roles ur where ur.user_id = u.id), '{}')`.as(
        "roles",
      ),
    ]);
  if (q) {
    const like = `%${q.replace(/[\\%_]/g, (c) => `\\${c}`)}%`;
    query = query.where((eb) => eb.or([eb("u.handle", "ilike", like), eb("u.email", "ilike", like)]));
  }
  return query.orderBy("u.handle").limit(limit).execute();
}

export async function recentRoleChanges(db: Db, limit = 20) {
  return db
    .selectFrom("role_changes as rc")
    .innerJoin("users as u", "u.id", "rc.user_id")
    .leftJoin("users as a", "a.id", "rc.changed_by")
    .select(["rc.id", "rc.role", "rc.change", "rc.created_at", "u.handle as user_handle", "a.handle as actor_handle"])
    .orderBy("rc.created_at", "desc")
    .orderBy("rc.id", "desc")
    .limit(limit)
    .execute();
}
