import type { Db } from "../../db/database";
import { randomToken } from "~/utils/tokens.server";

/** A new pseudonymous handle; the user can change it on /account. */
function newHandle() {
  return `tech-${randomToken(6)
    .toLowerCase()
    .replace(/[^a-z0-9]/g, "")
    .slice(0, 6)
    .padEnd(6, "0")}`;
}

export async function findUserByEmail(db: Db, email: string) {
  return db.selectFrom("users").select(["id", "banned_at"]).where("email", "=", email.toLowerCase()).executeTakeFirst();
}

export async function createUser(db: Db, email: string): Promise<number> {
  for (let attempt = 0; attempt < 5; attempt++) {
    const row = await db
      .insertInto("users")
      .values({ email: email.toLowerCase(), handle: newHandle() })
      .onConflict((oc) => oc.column("handle").doNothing())
      .returning("id")
      .executeTakeFirst();
    if (row) return row.id;
  }
  throw new Error("could not find a free handle");
}
