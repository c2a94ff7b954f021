// A session made directly in the database, and the cookie that carries it. Without vitest, so the
// page benchmark (scripts/bench-pages.ts) signs in the same way the tests do.
import type { Kysely } from "kysely";
import { randomToken, sha256Hex } from "../../app/utils/tokens.server";
import type { Database } from "../../db/schema";

/** The cookie value React Router's createCookie writes for a string (base64 of its JSON). */
export const cookieValue = (token: string) => encodeURIComponent(Buffer.from(JSON.stringify(token)).toString("base64"));

/**
 * A new session, valid for `ttlMs`, for the user with this e-mail: the user's id and the value of the
 * bayproof_session cookie (the cookie carries only the random token).
 */
export async function newSession(db: Kysely<Database>, email: string, ttlMs = 3600_000) {
  const user = await db.selectFrom("users").select("id").where("email", "=", email).executeTakeFirstOrThrow();
  const token = randomToken();
  await db
    .insertInto("sessions")
    .values({
      id_hash: sha256Hex(token),
      user_id: user.id,
      expires_at: new Date(Date.now() + ttlMs),
      sign_in_method: "email_link",
    })
    .execute();
  return { userId: user.id, cookie: cookieValue(token) };
}
