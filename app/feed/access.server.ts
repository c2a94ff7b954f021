// Who is calling the feed and how much they may: anonymous clients 60 requests a minute each,
// API keys (Authorization: Bearer …) BAYPROOF_FEED_KEY_LIMIT a minute each (600 unless configured),
// counted in PostgreSQL so every app
// server shares the counts. Answers carry RateLimit-Policy / RateLimit in the structured-field
// form of draft-ietf-httpapi-ratelimit-headers-10 (from memory), and a 429 carries Retry-After.
//
// One round trip per admitted request: an anonymous client's count is one upsert
// (rate-limiter-flexible); a key is checked, its count raised and its last use recorded (at most once a
// minute) by one statement. A client already over its limit is answered 429 from this process's
// memory until its window ends, without touching the database.
import { sql } from "kysely";
import { RateLimiterPostgres, RateLimiterRes } from "rate-limiter-flexible";
import { config } from "~/config.server";
import { clientKey } from "~/utils/client-address.server";
import { sha256Hex } from "~/utils/tokens.server";
import type pg from "pg";
import { type Db, PREPARED } from "../../db/database";
import { feedError } from "./http.server";
import { ANONYMOUS_LIMIT, KEY_LIMIT_WINDOW } from "./params";

/** Requests a minute per anonymous client and per API key, as configured. */
export const LIMITS = {
  anonymous: ANONYMOUS_LIMIT,
  key: { points: config.feed.keyLimit, duration: KEY_LIMIT_WINDOW },
} as const;

type Tier = keyof typeof LIMITS;

const TABLE = "feed_rate_limits";
const prefix = (tier: Tier) => `feed-${tier}`;

// One limiter per pool, made on first use (it keeps no counts of its own beyond the in-memory block).
const anonymousLimiters = new WeakMap<pg.Pool, RateLimiterPostgres>();
const anonymousLimiter = (pool: pg.Pool) => {
  let limiter = anonymousLimiters.get(pool);
  if (!limiter) {
    limiter = new RateLimiterPostgres({
      storeClient: pool,
      storeType: "pool",
      tableName: TABLE,
      tableCreated: true,
      keyPrefix: prefix("anonymous"),
      points: LIMITS.anonymous.points,
      duration: LIMITS.anonymous.duration,
      // The request that uses the last point blocks the client here until its window ends.
      inMemoryBlockOnConsumed: LIMITS.anonymous.points,
    });
    anonymousLimiters.set(pool, limiter);
  }
  return limiter;
};

/** Keys over their limit, by key hash: the end of their window (ms since the epoch). */
const blockedKeys = new Map<string, number>();
const LAST_USED_EVERY = "1 minute";

function block(hash: string, until: number) {
  if (blockedKeys.size >= 10_000) {
    const now = Date.now();
    for (const [k, end] of blockedKeys) if (end <= now) blockedKeys.delete(k);
  }
  blockedKeys.set(hash, until);
}

/**
 * Checks a key and counts one request against it in one statement (the rows rate-limiter-flexible
 * keeps, so both tiers share one table and one format). Null for an unknown or revoked key, or a
 * banned owner's.
 */
async function countKeyedRequest(db: Db, hash: string) {
  const now = Date.now();
  const expire = now + LIMITS.key.duration * 1000;
  const { rows } = await sql<{ id: number; user_id: number; points: number; expire: string }>`${sql.raw(PREPARED)}
    with k as (
      select a.id, a.user_id from api_keys a join users u on u.id = a.user_id
      where a.key_hash = ${hash} and a.revoked_at is null and u.banned_at is null
    ), used as (
      update api_keys set last_used_at = now()
      where id in (select id from k) and (last_used_at is null or last_used_at < now() - ${LAST_USED_EVERY}::interval)
      returning id
    ), counted as (
      insert into feed_rate_limits as l (key, points, expire)
      select ${`${prefix("key")}:key-`} || k.id, 1, ${expire} from k
      on conflict (key) do update set
        points = case when l.expire <= ${now} then 1 else l.points + 1 end,
        expire = case when l.expire <= ${now} then ${expire} else l.expire end
      returning points, expire
    )
    select k.id, k.user_id, c.points, c.expire from k cross join counted c`.execute(db);
  const row = rows[0];
  if (!row) return null;
  const points = Number(row.points);
  const res = new RateLimiterRes(
    Math.max(LIMITS.key.points - points, 0),
    Math.max(Number(row.expire) - Date.now(), 0),
    points,
    points === 1,
  );
  return { id: row.id, userId: row.user_id, res, over: points > LIMITS.key.points };
}

export interface Caller {
  tier: Tier;
  userId: number | null;
  headers: Record<string, string>;
}

const policy = (tier: Tier) => `"${tier}";q=${LIMITS[tier].points};w=${LIMITS[tier].duration}`;
const state = (tier: Tier, res: RateLimiterRes) =>
  `"${tier}";r=${res.remainingPoints};t=${Math.max(0, Math.ceil(res.msBeforeNext / 1000))}`;

const invalidAuthorization = () =>
  feedError(
    401,
    "invalid_authorization",
    'Send an API key as "Authorization: Bearer <key>", or no Authorization header at all.',
    undefined,
    { "WWW-Authenticate": 'Bearer realm="bayproof-feed"' },
  );

const unknownKey = () =>
  feedError(
    401,
    "invalid_api_key",
    "This API key is unknown or has been revoked; create a new one on your account page.",
    undefined,
    { "WWW-Authenticate": 'Bearer realm="bayproof-feed", error="invalid_token"' },
  );

const unavailable = () =>
  feedError(503, "unavailable", "The feed cannot count requests right now; try again in a minute.", undefined, {
    "Retry-After": "60",
  });

function limited(tier: Tier, res: RateLimiterRes) {
  const retry = String(Math.max(1, Math.ceil(res.msBeforeNext / 1000)));
  return feedError(
    429,
    "rate_limited",
    tier === "anonymous"
      ? `More than ${LIMITS.anonymous.points} requests a minute from this client; wait ${retry} s, or use an API key (${LIMITS.key.points} a minute).`
      : `More than ${LIMITS.key.points} requests a minute with this API key; wait ${retry} s.`,
    undefined,
    { "Retry-After": retry, "RateLimit-Policy": policy(tier), RateLimit: state(tier, res) },
  );
}

const admitted = (tier: Tier, userId: number | null, res: RateLimiterRes): Caller => ({
  tier,
  userId,
  headers: { "RateLimit-Policy": policy(tier), RateLimit: state(tier, res) },
});

/** Admits one request or throws the 401 / 429 that refuses it; the counts live in `pool`'s database. */
export async function admit(db: Db, pool: pg.Pool, request: Request): Promise<Caller> {
  const header = request.headers.get("authorization");
  if (!header) {
    try {
      return admitted("anonymous", null, await anonymousLimiter(pool).consume(clientKey(request), 1));
    } catch (error) {
      if (error instanceof RateLimiterRes) throw limited("anonymous", error);
      throw unavailable();
    }
  }
  const m = /^Bearer\s+(\S{1,200})$/i.exec(header.trim());
  if (!m) throw invalidAuthorization();
  const hash = sha256Hex(m[1]!);
  const blockedUntil = blockedKeys.get(hash);
  if (blockedUntil !== undefined) {
    if (blockedUntil > Date.now()) throw limited("key", new RateLimiterRes(0, blockedUntil - Date.now()));
    blockedKeys.delete(hash);
  }
  let counted: Awaited<ReturnType<typeof countKeyedRequest>>;
  try {
    counted = await countKeyedRequest(db, hash);
  } catch {
    throw unavailable();
  }
  if (!counted) throw unknownKey();
  if (counted.res.remainingPoints === 0) block(hash, Date.now() + counted.res.msBeforeNext);
  if (counted.over) throw limited("key", counted.res);
  return admitted("key", counted.userId, counted.res);
}

/** Refuses a caller without an API key (the bulk files are for keys: free on any account). */
export function requireKeyCaller(caller: Caller | null | undefined) {
  if (caller?.tier !== "key")
    throw feedError(
      401,
      "api_key_required",
      'The bulk files need an API key: sign in, create one on your account page, and send it as "Authorization: Bearer <key>".',
      undefined,
      { "WWW-Authenticate": 'Bearer realm="bayproof-feed"' },
    );
}
