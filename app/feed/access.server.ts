// Who is calling the feed and how much they may: anonymous clients 60 requests a minute each,
// API keys (Authorization: Bearer …) 600 a minute each, counted in PostgreSQL so every app
// server shares the counts. Answers carry RateLimit-Policy / RateLimit in the structured-field
// form of draft-ietf-httpapi-ratelimit-headers-10 (from memory), and a 429 carries Retry-After.
import { RateLimiterPostgres, RateLimiterRes } from "rate-limiter-flexible";
import { verifyApiKey } from "~/auth/api-keys.server";
import { clientKey } from "~/utils/client-address.server";
import type pg from "pg";
import type { Db } from "../../db/database";
import { feedError } from "./http.server";
import { LIMITS } from "./params";

type Tier = keyof typeof LIMITS;

// One limiter per pool and tier, made on first use (it keeps no counts of its own).
const limiters = new WeakMap<pg.Pool, Partial<Record<Tier, RateLimiterPostgres>>>();
const limiter = (pool: pg.Pool, tier: Tier) => {
  const forPool = limiters.get(pool) ?? {};
  limiters.set(pool, forPool);
  return (forPool[tier] ??= new RateLimiterPostgres({
    storeClient: pool,
    storeType: "pool",
    tableName: "feed_rate_limits",
    tableCreated: true,
    keyPrefix: `feed-${tier}`,
    points: LIMITS[tier].points,
    duration: LIMITS[tier].duration,
  }));
};

export interface Caller {
  tier: Tier;
  userId: number | null;
  headers: Record<string, string>;
}

const policy = (tier: Tier) => `"${tier}";q=${LIMITS[tier].points};w=${LIMITS[tier].duration}`;
const state = (tier: Tier, res: RateLimiterRes) =>
  `"${tier}";r=${res.remainingPoints};t=${Math.max(0, Math.ceil(res.msBeforeNext / 1000))}`;

/** The caller's API key: absent (anonymous), or checked — an unknown or revoked key is a 401. */
async function identify(db: Db, request: Request): Promise<{ tier: Tier; key: string; userId: number | null }> {
  const header = request.headers.get("authorization");
  if (!header) return { tier: "anonymous", key: clientKey(request), userId: null };
  const m = /^Bearer\s+(\S{1,200})$/i.exec(header.trim());
  const challenge = { "WWW-Authenticate": 'Bearer realm="bayproof-feed"' };
  if (!m)
    throw feedError(
      401,
      "invalid_authorization",
      'Send an API key as "Authorization: Bearer <key>", or no Authorization header at all.',
      undefined,
      challenge,
    );
  const found = await verifyApiKey(db, m[1]!);
  if (!found) {
    throw feedError(
      401,
      "invalid_api_key",
      "This API key is unknown or has been revoked; create a new one on your account page.",
      undefined,
      { "WWW-Authenticate": 'Bearer realm="bayproof-feed", error="invalid_token"' },
    );
  }
  return { tier: "key", key: `key-${found.id}`, userId: found.user_id };
}

/** Admits one request or throws the 401 / 429 that refuses it; the counts live in `pool`'s database. */
export async function admit(db: Db, pool: pg.Pool, request: Request): Promise<Caller> {
  const who = await identify(db, request);
  try {
    const res = await limiter(pool, who.tier).consume(who.key, 1);
    return {
      tier: who.tier,
      userId: who.userId,
      headers: { "RateLimit-Policy": policy(who.tier), RateLimit: state(who.tier, res) },
    };
  } catch (error) {
    if (!(error instanceof RateLimiterRes)) {
      throw feedError(
        503,
        "unavailable",
        "The feed cannot count requests right now; try again in a minute.",
        undefined,
        { "Retry-After": "60" },
      );
    }
    const retry = String(Math.max(1, Math.ceil(error.msBeforeNext / 1000)));
    throw feedError(
      429,
      "rate_limited",
      who.tier === "anonymous"
        ? `More than ${LIMITS.anonymous.points} requests a minute from this client; wait ${retry} s, or use an API key (${LIMITS.key.points} a minute).`
        : `More than ${LIMITS.key.points} requests a minute with this API key; wait ${retry} s.`,
      undefined,
      { "Retry-After": retry, "RateLimit-Policy": policy(who.tier), RateLimit: state(who.tier, error) },
    );
  }
}
