import { readDb } from "~/db.server";
import { parseSearch } from "~/search/query";
import { search } from "~/search/search.server";
import type { Route } from "./+types/api.search";

// Suggestions as you type, for the header's search box.
export async function loader({ request }: Route.LoaderArgs) {
  const { q, filters } = parseSearch(new URL(request.url).searchParams);
  if (!q) return Response.json({ source: "search", hits: [] });
  const r = await search(readDb, q, filters, 20, undefined, { facets: false });
  // Many reports of one tool on one job read alike: suggest each destination once.
  const seen = new Set<string>();
  const place = (h: { title: string; url: string }) => h.title + h.url.split("#")[0];
  const hits = r.hits.filter((h) => !seen.has(place(h)) && seen.add(place(h))).slice(0, 8);
  return Response.json({
    source: r.source,
    hits: hits.map((h) => ({
      id: h.id,
      title: h.title,
      url: h.url,
      kind: h.kind,
      detail: h.kind === "report" ? h.job_name : h.category_name,
    })),
  });
}
