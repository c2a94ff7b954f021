// Cross-site request protection and security headers, applied to every response by the root
// middleware.
import { randomBytes } from "node:crypto";
import { config } from "~/config.server";
import { storageOrigin } from "~/storage/s3.server";

const SAFE_METHODS = new Set(["GET", "HEAD", "OPTIONS"]);

/**
 * A state-changing request must come from our own pages: its Origin header (sent by every
 * current browser on POST) must be ours, or, failing that, Sec-Fetch-Site must say same-origin.
 * Requests carrying neither are refused too: a form cannot be posted without them.
 */
export function isCrossSiteWrite(request: Request): boolean {
  if (SAFE_METHODS.has(request.method.toUpperCase())) return false;
  const origin = request.headers.get("origin");
  if (origin) return origin !== config.appOrigin && origin !== new URL(request.url).origin;
  return request.headers.get("sec-fetch-site") !== "same-origin";
}

/**
 * The answer to a cross-site write, or null to go on. The root middleware asks it, and so does
 * server.js (through the build's entry module) before React Router's own origin check, which
 * would refuse such a page POST first with a bare 400 and a stack trace in the log.
 */
export function crossSiteRefusal(request: Request): Response | null {
  if (!isCrossSiteWrite(request)) return null;
  return new Response("Cross-site request refused: this form must be sent from Bayproof's own pages.", {
    status: 403,
    headers: {
      "Content-Type": "text/plain; charset=utf-8",
      "Content-Security-Policy": "default-src 'none'",
      "X-Content-Type-Options": "nosniff",
    },
  });
}

/** One year, subdomains included; server.js sends the same value on static files (a unit test checks). */
export const HSTS = "max-age=31536000; includeSubDomains";

/** Strict-Transport-Security only where users reach us over https: over http browsers ignore it. */
export const strictTransportSecurity = (appOrigin: string) => (appOrigin.startsWith("https://") ? HSTS : null);

export const newNonce = () => randomBytes(16).toString("base64");

/**
 * `scriptSources`, when given, replaces the nonce: a page kept in a shared cache allows its inline
 * scripts by their hashes (app/http-cache), since one nonce would otherwise serve many visitors.
 */
export function contentSecurityPolicy(nonce: string, dev: boolean, scriptSources?: string[] | null): string {
  const directives: Record<string, string[]> = {
    "default-src": ["'self'"],
    "script-src": ["'self'", ...(scriptSources ?? [`'nonce-${nonce}'`]), ...(dev ? ["'unsafe-inline'"] : [])],
    "style-src": ["'self'", "'unsafe-inline'"],
    "img-src": ["'self'", "data:", "blob:", storageOrigin],
    "media-src": ["'self'", "blob:", storageOrigin],
    "font-src": ["'self'"],
    // Evidence goes from the browser straight to object storage.
    "connect-src": ["'self'", storageOrigin, ...(dev ? ["ws:"] : [])],
    "form-action": ["'self'"],
    "frame-ancestors": ["'none'"],
    "base-uri": ["'self'"],
    "object-src": ["'none'"],
  };
  return Object.entries(directives)
    .map(([k, v]) => `${k} ${v.join(" ")}`)
    .join("; ");
}

export function applySecurityHeaders(
  headers: Headers,
  nonce: string,
  dev: boolean,
  appOrigin = config.appOrigin,
  scriptSources: string[] | null = null,
) {
  const hsts = strictTransportSecurity(appOrigin);
  if (hsts) headers.set("Strict-Transport-Security", hsts);
  headers.set("Content-Security-Policy", contentSecurityPolicy(nonce, dev, scriptSources));
  headers.set("X-Content-Type-Options", "nosniff");
  headers.set("Referrer-Policy", "strict-origin-when-cross-origin");
  headers.set("X-Frame-Options", "DENY");
  headers.set("Permissions-Policy", "camera=(self), microphone=(), geolocation=()");
  headers.set("Cross-Origin-Opener-Policy", "same-origin");
}
