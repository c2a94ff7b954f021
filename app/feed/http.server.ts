// The feed's HTTP habits: JSON errors naming the parameter at fault, strict query parameters,
// ETags with 304s, and the cache lifetimes of each kind of answer.
import type { z } from "zod";
import { AppError, failureAnswer } from "~/utils/errors";
import { etagOf } from "~/http-cache/page-cache.server";
import { matchesIfNoneMatch } from "~/utils/http";
import { hasControlCharacters } from "~/utils/text";
import { idParam } from "./params";

/** The feed's expected failures: an AppError with the code its JSON answer carries. */
export const feedError = (
  status: number,
  code: string,
  message: string,
  parameter?: string,
  headers: Record<string, string> = {},
) => new AppError(message, status, { code, field: parameter, headers });

/** Runs a loader body, turning expected failures (thrown anywhere inside) into the feed's JSON answers. */
export async function answer(work: () => Promise<Response>): Promise<Response> {
  try {
    return await work();
  } catch (error) {
    return failureAnswer(error, "feed");
  }
}

/**
 * Reads the query string against `shape`: an unknown or repeated parameter and a value that
 * does not parse are 400s naming the parameter — nothing is silently dropped.
 */
export function readParams<S extends Record<string, z.ZodType>>(
  url: URL,
  shape: S,
): { [K in keyof S]: z.output<S[K]> } {
  const out: Record<string, unknown> = {};
  const seen = new Set<string>();
  for (const [name, value] of url.searchParams) {
    if (!Object.hasOwn(shape, name)) {
      const known = Object.keys(shape);
      throw feedError(
        400,
        "unknown_parameter",
        `Unknown parameter "${name}"${known.length ? `; this endpoint takes ${known.join(", ")}` : "; this endpoint takes none"}.`,
        name,
      );
    }
    if (seen.has(name)) throw feedError(400, "repeated_parameter", `Give "${name}" once.`, name);
    if (hasControlCharacters(value))
      throw feedError(400, "invalid_parameter", `"${name}" holds control characters (such as NUL).`, name);
    seen.add(name);
  }
  for (const [name, schema] of Object.entries(shape)) {
    const raw = url.searchParams.get(name) ?? undefined;
    const parsed = schema.safeParse(raw);
    if (!parsed.success) {
      const why = parsed.error.issues[0]?.message ?? "cannot be read";
      throw feedError(400, "invalid_parameter", `"${name}" ${why}.`, name);
    }
    out[name] = parsed.data;
  }
  return out as { [K in keyof S]: z.output<S[K]> };
}

export const CACHE = {
  /**
   * Lists that grow as reports are accepted, and the stats: a client revalidates every time (a 304 when
   * nothing changed), so no one keeps a rate an accept has changed; a CDN keeps them as it keeps pages.
   */
  live: "public, max-age=0, s-maxage=30, stale-while-revalidate=30",
  /** One accepted report, a model, a job type: they change rarely. */
  record: "public, max-age=300",
  /** Schemas and documents describing the feed. */
  document: "public, max-age=3600",
} as const;

/** A JSON answer with a strong ETag over its exact bytes, or a 304 when the client has them. */
export function jsonResponse(
  request: Request,
  value: unknown,
  cacheControl: string,
  headers: Record<string, string> = {},
): Response {
  const body = JSON.stringify(value);
  const etag = etagOf(body);
  // The body is the same for every caller; the RateLimit headers are not, so a shared cache keeps
  // one answer per API key (and one for anonymous callers).
  const common = { ETag: etag, "Cache-Control": cacheControl, Vary: "Authorization", ...headers };
  if (matchesIfNoneMatch(request.headers.get("if-none-match"), etag))
    return new Response(null, { status: 304, headers: common });
  return new Response(body, { status: 200, headers: { "Content-Type": "application/json; charset=utf-8", ...common } });
}

/**
 * A record endpoint's address: no query parameters, and the path's id a record number; a 400 that
 * says what to give (`what`: "a report number", …) otherwise.
 */
export function readRecordId(request: Request, id: string | undefined, what: string): number {
  readParams(new URL(request.url), {});
  const parsed = idParam.safeParse(id);
  if (!parsed.success)
    throw feedError(
      400,
      "invalid_parameter",
      `"id" ${parsed.error.issues[0]?.message ?? "cannot be read"}: give ${what}.`,
      "id",
    );
  return parsed.data;
}
