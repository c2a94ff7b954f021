import { AsyncLocalStorage } from "node:async_hooks";
import { data } from "react-router";
import { config } from "~/config.server";
import { createDb, createPool } from "../db/database";

// One pool per server process; the URL comes from the configuration (app/config.server.ts).
// The pool itself is shared with what needs a bare client (the feed's cursors and rate limits).
// Its connections are named, so an operator (or a test) can tell them apart in pg_stat_activity.
export const pool = createPool(config.databaseUrl, 10, "bayproof-web");

interface RequestKind {
  /** GET or HEAD: its reads may run again on a fresh connection. */
  read: boolean;
  /** Under /api/: errors are JSON. */
  api: boolean;
}
const currentRequest = new AsyncLocalStorage<RequestKind>();

/** Runs the handling of one request (the root middleware) so the database knows what it serves. */
export function servingRequest<T>(request: Request, work: () => T): T {
  const method = request.method.toUpperCase();
  const api = new URL(request.url).pathname.startsWith("/api/");
  return currentRequest.run({ read: method === "GET" || method === "HEAD", api }, work);
}

export const RETRY_AFTER_SECONDS = "5";
const UNAVAILABLE = "The database cannot be reached just now, so nothing was changed. Try again in a few seconds.";

/** The one answer to a lost database connection: a 503 with Retry-After (JSON under /api/). */
function unavailable(error: unknown): unknown {
  const kind = currentRequest.getStore();
  if (!kind) return error;
  const headers = { "Retry-After": RETRY_AFTER_SECONDS, "Cache-Control": "no-store" };
  return kind.api
    ? Response.json({ error: { code: "database_unavailable", message: UNAVAILABLE } }, { status: 503, headers })
    : data(UNAVAILABLE, { status: 503, headers });
}

const policy = { mayRetryRead: () => currentRequest.getStore()?.read === true, unavailable };
export const db = createDb(pool, 10, policy);

/**
 * Reads that may lag the primary by a replica's delay: the feed, stats and catalogue. Writes, the
 * session and anything read to decide a write use `db`. Without DATABASE_READ_URL it is `db`.
 */
export const readPool = config.databaseReadUrl ? createPool(config.databaseReadUrl, 10, "bayproof-web-read") : pool;
export const readDb = readPool === pool ? db : createDb(readPool, 10, policy);
