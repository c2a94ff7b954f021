// One-time e-mail sign-in links: 256-bit random token, stored hashed, single use, 10 minutes,
// at most 3 per address and 10 per client in any 15 minutes. Sent directly, not queued (see
// docs/decisions/006-mail-delivery.md): a link that cannot be mailed is removed again, so it does
// not count toward the limits, and the person is asked to try again in a minute.
import { sql } from "kysely";
import { clientKey } from "~/utils/client-address.server";
import { config } from "~/config.server";
import type { Db } from "../../db/database";
import { sendMail } from "./mail.server";
import { randomToken, sha256Hex } from "~/utils/tokens.server";
import { createUser, findUserByEmail } from "./users.server";

export const LINK_LIFETIME_MS = 10 * 60_000;
export const RATE_WINDOW = "15 minutes";
export const MAX_PER_ADDRESS = 3;
export const MAX_PER_CLIENT = 10;

export type LinkRequestResult =
  { ok: true } | { ok: false; reason: "too_many_for_address" | "too_many_for_client" | "mail_failed" };

export async function requestSignInLink(
  db: Db,
  email: string,
  request: Request,
  redirectTo: string,
): Promise<LinkRequestResult> {
  const address = email.toLowerCase();
  const client = clientKey(request);
  const counts = await db
    .selectFrom("sign_in_links")
    .select([
      sql<number>`count(*) filter (where email = ${address})::int`.as("for_address"),
      sql<number>`count(*) filter (where client_key = ${client})::int`.as("for_client"),
    ])
    .where("created_at", ">", sql<Date>`now() - ${RATE_WINDOW}::interval`)
    .where((eb) => eb.or([eb("email", "=", address), eb("client_key", "=", client)]))
    .executeTakeFirstOrThrow();
  if (counts.for_address >= MAX_PER_ADDRESS) return { ok: false, reason: "too_many_for_address" };
  if (counts.for_client >= MAX_PER_CLIENT) return { ok: false, reason: "too_many_for_client" };

  const token = randomToken();
  const tokenHash = sha256Hex(token);
  await db
    .insertInto("sign_in_links")
    .values({
      token_hash: tokenHash,
      email: address,
      client_key: client,
      expires_at: new Date(Date.now() + LINK_LIFETIME_MS),
    })
    .execute();
  const link = `${config.appOrigin}/sign-in/link?token=${token}&redirectTo=${encodeURIComponent(redirectTo)}`;
  try {
    await sendMail({
      to: address,
      subject: "Your Bayproof sign-in link",
      text: [
        "Someone (hopefully you) asked to sign in to Bayproof with this address.",
        "",
        `Open this link within 10 minutes to sign in. It works once.`,
        link,
        "",
        "If you did not ask for it, ignore this message; nothing happens without the link.",
      ].join("\n"),
    });
  } catch (error) {
    await db.deleteFrom("sign_in_links").where("token_hash", "=", tokenHash).execute();
    console.warn(`[sign-in] mail could not be sent: ${(error as Error).message}`);
    return { ok: false, reason: "mail_failed" };
  }
  return { ok: true };
}

export type ConsumeResult =
  { ok: true; userId: number } | { ok: false; reason: "unknown" | "used" | "expired" | "banned" };

/** Spends the link (once) and returns the user it signs in, creating the account on first use. */
export async function consumeSignInLink(db: Db, token: string): Promise<ConsumeResult> {
  const hash = sha256Hex(token);
  return db.transaction().execute(async (trx) => {
    const spent = await trx
      .updateTable("sign_in_links")
      .set({ used_at: sql`now()` })
      .where("token_hash", "=", hash)
      .where("used_at", "is", null)
      .where("expires_at", ">", sql<Date>`now()`)
      .returning("email")
      .executeTakeFirst();
    if (!spent) {
      const link = await trx
        .selectFrom("sign_in_links")
        .select(["used_at"])
        .where("token_hash", "=", hash)
        .executeTakeFirst();
      return {
        ok: false as const,
        reason: !link ? ("unknown" as const) : link.used_at ? ("used" as const) : ("expired" as const),
      };
    }
    const existing = await findUserByEmail(trx, spent.email);
    if (existing?.banned_at) return { ok: false as const, reason: "banned" as const };
    const userId = existing?.id ?? (await createUser(trx, spent.email));
    return { ok: true as const, userId };
  });
}
