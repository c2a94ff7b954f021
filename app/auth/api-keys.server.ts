// API keys for the open feed: shown once at creation, stored as SHA-256, revocable.
import { sql } from "kysely";
import type { Db } from "../../db/database";
import { randomToken, sha256Hex } from "~/utils/tokens.server";

export const MAX_KEYS_PER_USER = 10;

export async function createApiKey(db: Db, userId: number, name: string) {
  const key = `bpk_${randomToken()}`;
  await db
    .insertInto("api_keys")
    .values({ user_id: userId, name, key_hash: sha256Hex(key), key_prefix: key.slice(0, 10) })
    .execute();
  return key;
}

export async function listApiKeys(db: Db, userId: number) {
  return db
    .selectFrom("api_keys")
    .select(["id", "name", "key_prefix", "created_at", "last_used_at", "revoked_at"])
    .where("user_id", "=", userId)
    .orderBy("revoked_at", (ob) => ob.desc().nullsFirst())
    .orderBy("created_at", "desc")
    .execute();
}

export async function countActiveKeys(db: Db, userId: number) {
  const row = await db
    .selectFrom("api_keys")
    .select(sql<number>`count(*)::int`.as("n"))
    .where("user_id", "=", userId)
    .where("revoked_at", "is", null)
    .executeTakeFirstOrThrow();
  return row.n;
}

/** Revokes one of the user's own keys; false when it is not theirs or already revoked. */
export async function revokeApiKey(db: Db, userId: number, keyId: number) {
  const r = await db
    .updateTable("api_keys")
    .set({ revoked_at: sql`now()` })
    .where("id", "=", keyId)
    .where("user_id", "=", userId)
    .where("revoked_at", "is", null)
    .executeTakeFirst();
  return r.numUpdatedRows > 0n;
}
