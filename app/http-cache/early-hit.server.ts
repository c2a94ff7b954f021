// A page-cache hit answered by the production server before Express and React Router see the
// request (server.js calls earlyHit first). It sends what the root middleware would have sent for the
// same hit — the stored page, its ETag or a 304, and the same security headers — so it changes only
// the cost: a hit no longer pays for Express's routing, a Fetch Request and React Router's middleware
// chain (docs/decisions/012-page-caching.md). Anything it is unsure of goes the long way.
import type { IncomingHttpHeaders } from "node:http";
import { acceptsGzip, type PageCache, pageKey, storedAnswer } from "./page-cache.server";
import { isPublicPage } from "./policy";

/** What the root middleware decides from a request, here from its raw headers (app/entry.server.tsx wires them). */
export interface EarlyHitOptions {
  /** The Cookie header may carry a session: not an anonymous visitor's request. */
  mayHoldSession(cookie: string | null): boolean;
  /** The page's variant, as the root middleware's `variant` gives it. */
  variant(cookie: string | null, acceptLanguage: string | null): Promise<string> | string;
  /** The root middleware's security headers; `scriptSources` null asks for a fresh nonce (a 304). */
  securityHeaders(headers: Headers, scriptSources: string[] | null): void;
}

export interface EarlyHit {
  status: number;
  /** Header names and values, as node's writeHead takes them. */
  headers: [string, string][];
  /** Null for a 304 or a HEAD. */
  body: Uint8Array | null;
}

const header = (headers: IncomingHttpHeaders, name: string): string | null => {
  const value = headers[name];
  return typeof value === "string" ? value : null;
};

/**
 * Encodings the early answer can honour as the long way would: gzip (the stored copy), or no coding
 * at all when the client names none. Anything else (br only, say) goes through the compression
 * middleware.
 */
function codingServed(acceptEncoding: string | null): boolean {
  if (acceptsGzip(acceptEncoding)) return true;
  return acceptEncoding == null || acceptEncoding.trim() === "" || acceptEncoding.trim().toLowerCase() === "identity";
}

/** The early answer: the stored answer for an anonymous GET or HEAD of a public page, or null to take the long way. */
export function earlyHitFor(cache: PageCache, options: EarlyHitOptions) {
  return async (req: { method?: string; url?: string; headers: IncomingHttpHeaders }): Promise<EarlyHit | null> => {
    const method = req.method ?? "";
    if ((method !== "GET" && method !== "HEAD") || !cache.usable) return null;
    // Origin-form only ("/path?query"); "//host/…" would parse as another host.
    if (!req.url?.startsWith("/") || req.url.startsWith("//")) return null;
    const cookie = header(req.headers, "cookie");
    if (options.mayHoldSession(cookie)) return null;
    const acceptEncoding = header(req.headers, "accept-encoding");
    if (!codingServed(acceptEncoding)) return null;
    let url: URL;
    try {
      url = new URL(req.url, "http://early.invalid");
      decodeURIComponent(url.pathname); // a broken %-escape gets the long way's 400
    } catch {
      return null;
    }
    if (!isPublicPage(url.pathname)) return null;
    const page = cache.lookup(pageKey(await options.variant(cookie, header(req.headers, "accept-language")), url));
    if (!page) return null;
    cache.hits++;
    const answer = storedAnswer(page, { method, acceptEncoding, ifNoneMatch: header(req.headers, "if-none-match") });
    // As the root middleware does: hashes for a page, a fresh nonce on a 304 (it has no body to allow).
    options.securityHeaders(answer.headers, answer.status === 304 ? null : page.scriptSources);
    return { status: answer.status, headers: [...answer.headers], body: answer.bytes };
  };
}
