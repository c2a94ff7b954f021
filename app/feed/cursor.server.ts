// Opaque page cursors for the feed's walks (/api/v1/reports, /api/v1/bench-runs): the last (accepted time, id) seen, the walk's fixed
// horizon and a digest of its filters, signed with HMAC-SHA256 under a secret kept in PostgreSQL
// (so every app server accepts every other's cursors). A cursor that was altered, or that is
// used with other filters, is refused.
import { createHash, createHmac, timingSafeEqual } from "node:crypto";
import type { Db } from "../../db/database";
import { CACHE, feedError, jsonResponse } from "./http.server";
import { microsToIso } from "./queries.server";

export interface CursorState {
  /** Accepted time of the last report sent, in microseconds since 1970 (a decimal string). */
  afterMicros: string;
  afterId: number;
  /** The walk's horizon: reports accepted after it are left to the next walk. */
  asOfMicros: string;
  filters: string;
}

let secret: Promise<string> | null = null;
function cursorSecret(db: Db) {
  if (!secret) {
    secret = db
      .selectFrom("app_secrets")
      .select("value")
      .where("name", "=", "feed-cursor")
      .executeTakeFirstOrThrow()
      .then((r) => r.value);
    secret.catch(() => (secret = null)); // a failed read is tried again next time
  }
  return secret;
}

export const filtersDigest = (filters: Record<string, unknown>) =>
  createHash("sha256")
    .update(
      JSON.stringify(
        Object.entries(filters)
          .filter(([, v]) => v != null)
          .sort(),
      ),
    )
    .digest("base64url")
    .slice(0, 16);

const sign = (key: string, payload: string) => createHmac("sha256", key).update(payload).digest().subarray(0, 16);

export async function encodeCursor(db: Db, state: CursorState) {
  const payload = Buffer.from(
    JSON.stringify([1, state.afterMicros, state.afterId, state.asOfMicros, state.filters]),
  ).toString("base64url");
  return `${payload}.${sign(await cursorSecret(db), payload).toString("base64url")}`;
}

const invalid = (why: string) =>
  feedError(
    400,
    "invalid_cursor",
    `"cursor" ${why}; start again without it or use the next_cursor of the previous page.`,
    "cursor",
  );

export async function decodeCursor(db: Db, cursor: string, filters: string): Promise<CursorState> {
  const m = /^([A-Za-z0-9_-]{1,400})\.([A-Za-z0-9_-]{22})$/.exec(cursor);
  if (!m) throw invalid("is not a cursor this feed issued");
  const [, payload, mac] = m as unknown as [string, string, string];
  const expected = sign(await cursorSecret(db), payload);
  const given = Buffer.from(mac, "base64url");
  if (given.length !== expected.length || !timingSafeEqual(given, expected)) throw invalid("has been altered");
  let parts: unknown;
  try {
    parts = JSON.parse(Buffer.from(payload, "base64url").toString("utf8"));
  } catch {
    throw invalid("cannot be read");
  }
  const [v, afterMicros, afterId, asOfMicros, digest] = Array.isArray(parts) ? (parts as unknown[]) : [];
  const micros = (x: unknown): x is string => typeof x === "string" && /^\d{1,18}$/.test(x);
  if (
    v !== 1 ||
    !micros(afterMicros) ||
    !Number.isSafeInteger(afterId) ||
    !micros(asOfMicros) ||
    typeof digest !== "string"
  )
    throw invalid("cannot be read");
  if (digest !== filters)
    throw feedError(
      400,
      "cursor_mismatch",
      `"cursor" belongs to a walk with other filters; keep the filters of its first page.`,
      "cursor",
    );
  return { afterMicros, afterId: afterId as number, asOfMicros, filters: digest };
}

type After = { micros: string; id: number };

/**
 * One page of a walk (/api/v1/reports, /api/v1/bench-runs): the cursor's horizon or a new one, the
 * page read after the cursor's position, and the answer with `next_cursor` and a Link to the next
 * page (the same address and filters, the new cursor). `digest` binds the cursor to the endpoint
 * and its filters.
 */
export async function walkAnswer<R>(
  request: Request,
  db: Db,
  walk: {
    url: URL;
    origin: string;
    cursor: string | undefined;
    digest: string;
    horizon: () => Promise<string>;
    page: (asOfMicros: string, after: After | undefined) => Promise<{ records: R[]; next: After | null }>;
  },
): Promise<Response> {
  const state = walk.cursor ? await decodeCursor(db, walk.cursor, walk.digest) : null;
  const asOf = state?.asOfMicros ?? (await walk.horizon());
  const page = await walk.page(asOf, state ? { micros: state.afterMicros, id: state.afterId } : undefined);
  const nextCursor = page.next
    ? await encodeCursor(db, {
        afterMicros: page.next.micros,
        afterId: page.next.id,
        asOfMicros: asOf,
        filters: walk.digest,
      })
    : null;
  const headers: Record<string, string> = {};
  if (nextCursor) {
    const next = new URL(`${walk.origin}${walk.url.pathname}`);
    for (const [k, v] of walk.url.searchParams) if (k !== "cursor") next.searchParams.set(k, v);
    next.searchParams.set("cursor", nextCursor);
    headers.Link = `<${next.toString()}>; rel="next"`;
  }
  return jsonResponse(
    request,
    { data: page.records, next_cursor: nextCursor, as_of: microsToIso(asOf) },
    CACHE.live,
    headers,
  );
}
