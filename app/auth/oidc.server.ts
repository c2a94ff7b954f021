// OpenID Connect sign-in through arctic: authorization code with PKCE (S256), a `state` and a
// `nonce`, all three kept in one short-lived HttpOnly cookie and checked on the callback.
// Accounts are linked by (provider, subject), never by e-mail alone.
import { CodeChallengeMethod, decodeIdToken, generateCodeVerifier, generateState, OAuth2Client } from "arctic";
import { createCookie } from "react-router";
import { z } from "zod";
import { config, isHttps } from "~/config.server";
import type { Db } from "../../db/database";
import { createUser, findUserByEmail } from "./users.server";
import { AppError } from "~/utils/errors";

const flowCookie = createCookie("bayproof_oidc", {
  httpOnly: true,
  sameSite: "lax",
  secure: isHttps,
  path: "/auth",
  maxAge: 600,
});

const flowSchema = z.object({ state: z.string(), verifier: z.string(), nonce: z.string(), redirectTo: z.string() });

export const providers = { [config.oidc.id]: config.oidc };

export function getProvider(id: string) {
  return Object.hasOwn(providers, id) ? providers[id]! : null;
}

function client(provider: typeof config.oidc) {
  return new OAuth2Client(provider.clientId, provider.clientSecret, `${config.appOrigin}/auth/${provider.id}/callback`);
}

/** The provider's authorization URL and the cookie that remembers this attempt. */
export async function startSignIn(provider: typeof config.oidc, redirectTo: string) {
  const state = generateState();
  const verifier = generateCodeVerifier();
  const nonce = generateState();
  const url = client(provider).createAuthorizationURLWithPKCE(
    provider.authorizationUrl,
    state,
    CodeChallengeMethod.S256,
    verifier,
    ["openid", "email", "profile"],
  );
  url.searchParams.set("nonce", nonce);
  const cookie = await flowCookie.serialize({ state, verifier, nonce, redirectTo });
  return { url: url.toString(), cookie };
}

const claimsSchema = z.object({
  iss: z.string(),
  sub: z.string().min(1).max(255),
  aud: z.union([z.string(), z.array(z.string())]),
  exp: z.number(),
  nonce: z.string().optional(),
  email: z.string().email().optional(),
});

/** Checks the callback against the remembered attempt and returns the user to sign in. */
export async function finishSignIn(db: Db, provider: typeof config.oidc, request: Request) {
  const url = new URL(request.url);
  const flow = flowSchema.safeParse(await flowCookie.parse(request.headers.get("cookie")));
  if (!flow.success)
    throw new AppError("This sign-in attempt has expired or was started in another browser. Start again.");
  const providerError = url.searchParams.get("error");
  if (providerError)
    throw new AppError(
      `The sign-in provider refused: ${url.searchParams.get("error_description") ?? providerError}`,
      401,
    );
  const code = url.searchParams.get("code");
  const state = url.searchParams.get("state");
  if (!code || !state || state !== flow.data.state)
    throw new AppError("The sign-in response does not match this attempt (state). Start again.");

  let idToken: string;
  try {
    const tokens = await client(provider).validateAuthorizationCode(provider.tokenUrl, code, flow.data.verifier);
    idToken = tokens.idToken();
  } catch {
    throw new AppError("The sign-in provider did not accept the code. Start again.", 401);
  }
  // The ID token comes straight from the token endpoint, so its signature need not be re-checked
  // (OpenID Connect Core §3.1.3.7); its claims still must match this client and this attempt.
  const claims = claimsSchema.safeParse(decodeIdToken(idToken));
  if (!claims.success) throw new AppError("The provider's ID token is missing required claims.", 401);
  const c = claims.data;
  const audiences = Array.isArray(c.aud) ? c.aud : [c.aud];
  if (c.iss.replace(/\/$/, "") !== provider.issuer.replace(/\/$/, ""))
    throw new AppError("The ID token is from another issuer.", 401);
  if (!audiences.includes(provider.clientId)) throw new AppError("The ID token is for another application.", 401);
  if (c.exp * 1000 < Date.now()) throw new AppError("The ID token has expired. Start again.", 401);
  if (c.nonce !== flow.data.nonce)
    throw new AppError("The ID token does not match this attempt (nonce). Start again.", 401);

  const userId = await db.transaction().execute(async (trx) => {
    const linked = await trx
      .selectFrom("oauth_accounts as o")
      .innerJoin("users as u", "u.id", "o.user_id")
      .select(["u.id", "u.banned_at"])
      .where("o.provider", "=", provider.id)
      .where("o.subject", "=", c.sub)
      .executeTakeFirst();
    if (linked) {
      if (linked.banned_at) throw new AppError("This account is suspended.", 403);
      return linked.id;
    }
    if (!c.email)
      throw new AppError(
        "The provider did not share an e-mail address; Bayproof needs one for decisions on your reports.",
      );
    if (await findUserByEmail(trx, c.email)) {
      throw new AppError(
        "A Bayproof account already uses this e-mail address. Sign in with an e-mail link instead; accounts are never joined by e-mail alone.",
        409,
      );
    }
    const id = await createUser(trx, c.email);
    await trx
      .insertInto("oauth_accounts")
      .values({ provider: provider.id, subject: c.sub, user_id: id, email_at_link: c.email.toLowerCase() })
      .execute();
    return id;
  });
  const clear = await flowCookie.serialize("", { maxAge: 0 });
  return { userId, redirectTo: flow.data.redirectTo, clearCookie: clear };
}
