// Which pages a shared cache may keep, and the headers that say so. One list, so a new public page
// is one line here; anything not listed is `private, no-store`. Pure; no framework.
import { matchPath } from "react-router";

/**
 * Pages whose anonymous render is the same for every anonymous visitor with the same unit system:
 * no form with a per-visitor token, no flash message, nothing from a session. The query string is
 * part of the page (filters, search terms, page numbers).
 */
export const PUBLIC_PAGES = [
  "/",
  "/jobs",
  "/jobs/:slug",
  "/models",
  "/models/:slug",
  "/compare",
  "/air",
  "/search",
  "/data",
  "/day",
] as const;

/**
 * Browsers revalidate every time (max-age=0: a 304 when nothing changed), so a visitor never keeps a
 * stale rate; a CDN keeps the page for s-maxage and may serve it while refetching for
 * stale-while-revalidate more — the bound on staleness when nothing purges it
 * (docs/decisions/012-page-caching.md).
 */
export const PUBLIC_CACHE_CONTROL = "public, max-age=0, s-maxage=30, stale-while-revalidate=30";
/** Signed-in visitors, forms, errors, redirects: never stored anywhere. */
export const PRIVATE_CACHE_CONTROL = "private, no-store";
/** What changes a public page: the session cookie and the units cookie, else the language. */
export const PUBLIC_VARY = "Cookie, Accept-Language";

/** The page a URL path asks for: a single-fetch data request (`/jobs/x.data`, `/_root.data`) names its page. */
export function pagePath(pathname: string): string {
  if (pathname === "/_root.data") return "/";
  return pathname.endsWith(".data") ? pathname.slice(0, -".data".length) : pathname;
}

export function isPublicPage(pathname: string): boolean {
  const page = pagePath(pathname);
  return PUBLIC_PAGES.some((pattern) => matchPath({ path: pattern, end: true }, page) != null);
}
