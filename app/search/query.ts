import { isFitting, isSlug } from "~/domain";

/** Search parameters, leniently: an over-long query is cut, unreadable facets are dropped and named. */
export function parseSearch(params: URLSearchParams) {
  const q = (params.get("q") ?? "").slice(0, 200).trim();
  const filters: Record<string, string> = {};
  const ignored: string[] = [];
  for (const key of ["category", "job", "shank", "kind"] as const) {
    const v = params.get(key);
    if (!v) continue;
    const ok = key === "kind" ? v === "model" || v === "report" : key === "shank" ? isFitting(v) : isSlug(v);
    if (ok) filters[key] = v;
    else ignored.push(key);
  }
  return { q, filters, ignored, truncated: (params.get("q") ?? "").length > 200 };
}
