// Anonymous renders of public pages, kept in this process: a stand-in for a CDN in front of the app,
// and the headers that let a real one do the same (docs/decisions/012-page-caching.md).
import { createHash } from "node:crypto";
import { gzipSync } from "node:zlib";
import { createContext, type MiddlewareFunction } from "react-router";
import { matchesIfNoneMatch } from "~/utils/http";
import { nonceContext } from "~/utils/nonce";
import { ByteLru } from "./byte-lru";
import type { ListenerEvents } from "./listener.server";
import { isPublicPage, PRIVATE_CACHE_CONTROL, PUBLIC_CACHE_CONTROL, PUBLIC_VARY } from "./policy";

/** How many shared loader results each process keeps (a job page's is ~40 kB of objects). */
const READS_KEPT = 300;

export interface CachedPage {
  body: Uint8Array;
  /** The same bytes gzipped once when stored, so a hit costs no compression (its own ETag: RFC 9110 §8.8.3). */
  gzipped: Uint8Array;
  /**
   * The two as Blobs, made once: a Response over a Blob shares its bytes, where one over a
   * Uint8Array copies them (undici: ~2 ms for a 170 kB page, most of what a hit used to cost).
   */
  bodyBlob: Blob;
  gzippedBlob: Blob;
  headers: [string, string][];
  etag: string;
  /** CSP sources for the page's inline scripts (their hashes); null for data requests. */
  scriptSources: string[] | null;
}

/**
 * The CSP script sources a cacheable page was sent with. A stored page is sent to many visitors, so
 * its inline scripts are allowed by their hashes, not by a per-request nonce that would be shared.
 * The root middleware reads it when it writes the CSP.
 */
export const scriptSourcesContext = createContext<string[] | null>(null);

export interface PageCacheOptions {
  /** No session cookie: the render is the same as any other anonymous visitor's with the same units. */
  isAnonymous(request: Request): boolean;
  /** What else changes an anonymous render (the unit system). */
  variant(request: Request): Promise<string> | string;
}

/** A strong ETag over exact bytes (RFC 9110 §8.8.3): the cached pages' and the feed's answers. */
export const etagOf = (body: string | Uint8Array) =>
  `"${createHash("sha256").update(body).digest("base64url").slice(0, 32)}"`;

const INLINE_SCRIPT = /<script\b([^>]*)>([\s\S]*?)<\/script>/gi;
/** The 'sha256-…' source of every inline script, as CSP Level 2 hashes them (the text between the tags). */
export function inlineScriptSources(html: string): string[] {
  const sources = new Set<string>();
  for (const [, attributes, text] of html.matchAll(INLINE_SCRIPT)) {
    if (/\bsrc\s*=/i.test(attributes!)) continue;
    sources.add(`'sha256-${createHash("sha256").update(text!).digest("base64")}'`);
  }
  return [...sources];
}

/** Freezes a plain value and everything reachable from it (objects and arrays). */
export function deepFreeze<T>(value: T): T {
  if (value === null || typeof value !== "object" || Object.isFrozen(value) || ArrayBuffer.isView(value)) return value;
  Object.freeze(value);
  for (const key of Object.keys(value)) deepFreeze((value as Record<string, unknown>)[key]);
  return value;
}

export class PageCache {
  private readonly pages: ByteLru<CachedPage>;
  private readonly filling = new Map<string, Promise<CachedPage | null>>();
  /**
   * Loader results of public pages, shared by every visitor whatever their session (see remember):
   * the reads a signed-in visitor's render would repeat. Bounded by count.
   */
  private readonly reads = new ByteLru<Promise<unknown>>(READS_KEPT, () => 1);
  /** Bumped by every invalidation: a render begun before it is not stored. */
  private generation = 0;
  private listening = false;
  /** Invalidations still waiting for the read replica to catch up; no fills meanwhile. */
  private settling = 0;
  hits = 0;
  misses = 0;

  constructor(maxBytes: number) {
    // Each page is held twice: as bytes (written by the server) and as Blobs (the Responses' bodies).
    this.pages = new ByteLru(
      maxBytes,
      (page, key) => 2 * (page.body.byteLength + page.gzipped.byteLength) + key.length * 2 + 512,
    );
  }

  /** Usable only while changes are heard and the replica has caught up with the last one. */
  get usable() {
    return this.listening && this.settling === 0;
  }

  get bytes() {
    return this.pages.bytes;
  }

  clear() {
    this.generation++;
    this.pages.clear();
    this.filling.clear();
    this.reads.clear();
  }

  /**
   * A loader's result for a public page, computed once and shared by all who ask until the next
   * change empties the cache (the same notification, the same wait for the replica). `key` must name
   * everything the result depends on: the route, the address and the viewer's units, never who the
   * viewer is. Computed afresh, and not kept, while changes are not heard. A failure is not kept.
   * The result is frozen, deeply: many renders read it at once, so none may change it.
   */
  remember<T>(key: string, compute: () => Promise<T>): Promise<T> {
    if (!this.usable) return compute();
    const known = this.reads.get(key);
    if (known) return known as Promise<T>;
    const work = compute().then(deepFreeze);
    this.reads.set(key, work);
    work.catch(() => {
      if (this.reads.get(key) === work) this.reads.delete(key);
    });
    return work;
  }

  /**
   * The listener's events. `caughtUp` resolves once the read replica has applied what the primary
   * had committed when the notification arrived; fills wait for it, and the cache is emptied again
   * afterwards, so a render from a lagging replica is never kept.
   */
  events(caughtUp: () => Promise<void>): ListenerEvents {
    return {
      changed: () => {
        this.clear();
        this.settling++;
        caughtUp()
          .catch((error: unknown) => console.warn(`[page-cache] replica position unknown: ${String(error)}`))
          .finally(() => {
            this.settling--;
            this.clear();
          });
      },
      listening: (on) => {
        this.listening = on;
        this.clear();
      },
    };
  }

  lookup(key: string) {
    return this.usable ? this.pages.get(key) : undefined;
  }

  /** Renders once per key however many ask at the same moment; stores the page unless something changed meanwhile. */
  async fill(key: string, render: () => Promise<CachedPage | null>): Promise<CachedPage | null> {
    const pending = this.filling.get(key);
    if (pending) return pending;
    const generation = this.generation;
    const work = render().finally(() => {
      if (this.filling.get(key) === work) this.filling.delete(key);
    });
    this.filling.set(key, work);
    const page = await work;
    if (page && this.usable && generation === this.generation) this.pages.set(key, page);
    return page;
  }
}

const gzipEtag = (etag: string) => `${etag.slice(0, -1)}-gz"`;
/** Accept-Encoding names gzip without q=0 (RFC 9110 §12.5.3). */
export function acceptsGzip(acceptEncoding: string | null | undefined): boolean {
  return (acceptEncoding ?? "").split(",").some((part) => {
    const [coding, ...params] = part.split(";").map((x) => x.trim().toLowerCase());
    const q = params.find((p) => p.startsWith("q="));
    return coding === "gzip" && (!q || Number(q.slice(2)) > 0);
  });
}

/** What a stored page answers to a request with these headers: 304, or 200 with the bytes it takes (none for HEAD). */
export function storedAnswer(
  page: CachedPage,
  ask: { method: string; acceptEncoding: string | null | undefined; ifNoneMatch: string | null | undefined },
): { status: 200 | 304; headers: Headers; bytes: Uint8Array | null; gzip: boolean } {
  const headers = new Headers(page.headers);
  const gzip = acceptsGzip(ask.acceptEncoding);
  const etag = gzip ? gzipEtag(page.etag) : page.etag;
  headers.set("ETag", etag);
  if (matchesIfNoneMatch(ask.ifNoneMatch ?? null, etag)) {
    const notModified = new Headers();
    for (const name of ["ETag", "Cache-Control", "Vary"]) notModified.set(name, headers.get(name)!);
    return { status: 304, headers: notModified, bytes: null, gzip };
  }
  if (gzip) headers.set("Content-Encoding", "gzip");
  const bytes = gzip ? page.gzipped : page.body;
  headers.set("Content-Length", String(bytes.byteLength));
  return { status: 200, headers, bytes: ask.method.toUpperCase() === "HEAD" ? null : bytes, gzip };
}

function answer(request: Request, page: CachedPage): Response {
  const { status, headers, bytes, gzip } = storedAnswer(page, {
    method: request.method,
    acceptEncoding: request.headers.get("accept-encoding"),
    ifNoneMatch: request.headers.get("if-none-match"),
  });
  if (!bytes) return new Response(null, { status, headers });
  const response = new Response(gzip ? page.gzippedBlob : page.bodyBlob, { status, headers });
  storedBodies.set(response, bytes);
  return response;
}

/** The stored bytes behind a cache hit's Response, for the server to write in one go. */
const storedBodies = new WeakMap<Response, Uint8Array>();

/**
 * The bytes of a Response answered from the cache (undefined for any other): the production server
 * writes them to the socket at once instead of reading the Response's stream chunk by chunk.
 */
export function storedBodyOf(response: Response): Uint8Array | undefined {
  return storedBodies.get(response);
}

const refusesStorage = (response: Response) =>
  response.status !== 200 ||
  response.headers.has("Set-Cookie") ||
  /no-store|private/i.test(response.headers.get("Cache-Control") ?? "") ||
  !response.body;

/**
 * Buffers a fresh render into a page to keep, or null when it may not be kept. A kept page's scripts
 * are allowed by their hashes, so the render's own nonce is blanked (as the browser's render writes
 * it): every process then keeps the same bytes under the same ETag, and a visitor's If-None-Match
 * gets its 304 from whichever worker or machine answers.
 */
async function toPage(response: Response, nonce: string): Promise<CachedPage | null> {
  if (refusesStorage(response)) return null;
  const headers = new Headers(response.headers);
  const type = headers.get("Content-Type");
  if (type) headers.set("Content-Type", withCharset(type));
  let body = new Uint8Array(await response.arrayBuffer());
  let scriptSources: string[] | null = null;
  if (type?.startsWith("text/html")) {
    const html = nonce ? new TextDecoder().decode(body).replaceAll(`nonce="${nonce}"`, 'nonce=""') : null;
    if (html != null) body = new TextEncoder().encode(html);
    scriptSources = inlineScriptSources(html ?? new TextDecoder().decode(body));
  }
  headers.set("Cache-Control", PUBLIC_CACHE_CONTROL);
  headers.set("Vary", `${PUBLIC_VARY}, Accept-Encoding`);
  const etag = etagOf(body);
  headers.set("ETag", etag);
  const gzipped = gzipSync(body);
  return {
    body,
    gzipped,
    bodyBlob: new Blob([body]),
    gzippedBlob: new Blob([gzipped]),
    headers: [...headers],
    etag,
    scriptSources,
  };
}

/**
 * Content-Type as Express writes it on the long way (text, JavaScript and JSON get
 * "; charset=utf-8" when they name none). A page is stored so, and every answer of it, early or
 * not, sends the same header.
 */
export const withCharset = (type: string) =>
  /;\s*charset\s*=/i.test(type) || !/^(text\/|application\/(javascript|json))/i.test(type.split(";")[0]!.trim())
    ? type
    : `${type}; charset=utf-8`;

/** A stored page's key: the variant (unit system) and the address as the WHATWG URL parser normalises it. */
export const pageKey = (variant: string, url: URL) => `${variant} ${url.pathname}${url.search}`;

/**
 * The root middleware's cache step. Public pages for anonymous visitors: served from the cache
 * (304 on a matching If-None-Match) before any loader runs, else rendered, stored and served the
 * same way. Everything else: `private, no-store` unless the route chose its own Cache-Control.
 */
export function pageCacheMiddleware(cache: PageCache, options: PageCacheOptions): MiddlewareFunction<Response> {
  return async ({ request, context }, next) => {
    const method = request.method.toUpperCase();
    const url = new URL(request.url);
    const shared =
      (method === "GET" || method === "HEAD") && isPublicPage(url.pathname) && options.isAnonymous(request);
    if (!shared) {
      const response = await next();
      if (!response.headers.has("Cache-Control")) response.headers.set("Cache-Control", PRIVATE_CACHE_CONTROL);
      return response;
    }
    const key = pageKey(await options.variant(request), url);
    const hit = cache.lookup(key);
    if (hit) {
      cache.hits++;
      context.set(scriptSourcesContext, hit.scriptSources);
      return answer(request, hit);
    }
    cache.misses++;
    let own: Response | null = null;
    const page =
      method === "GET"
        ? await cache.fill(key, async () => {
            own = await next();
            return toPage(own, context.get(nonceContext));
          })
        : null;
    if (page) {
      context.set(scriptSourcesContext, page.scriptSources);
      return answer(request, page);
    }
    // Not kept: a HEAD, an error, a redirect — or another request's render that turned out not to be keepable.
    const response: Response = own ?? (await next());
    if (response.status === 200 && !response.headers.has("Cache-Control") && !response.headers.has("Set-Cookie")) {
      response.headers.set("Cache-Control", PUBLIC_CACHE_CONTROL);
      response.headers.set("Vary", PUBLIC_VARY);
    } else if (!response.headers.has("Cache-Control")) {
      response.headers.set("Cache-Control", PRIVATE_CACHE_CONTROL);
    }
    return response;
  };
}
