// The search page's results in the order a reader wants them: the job pages and tool pages that
// match first, then the matching reports, paged, each told apart by outcome, date and pressure.
import { sql } from "kysely";
import type { Db } from "../../db/database";
import { search, type SearchFilters, type SearchResult } from "./search.server";

export const REPORTS_PER_PAGE = 20;
/** Far enough for any reader; a deeper page is answered as the last one. */
export const MAX_PAGE = 50;
const TOOLS_SHOWN = 12;

export interface JobMatch {
  slug: string;
  name: string;
  category_name: string;
}

/** Job pages whose name or category holds every word of the query. */
export async function matchingJobs(db: Db, q: string, filters: SearchFilters): Promise<JobMatch[]> {
  const words = q.toLowerCase().split(/\s+/).filter(Boolean).slice(0, 6);
  if (!words.length) return [];
  const like = words.map((w) => `%${w.replace(/[\\%_]/g, (c) => `\\${c}`)}%`);
  return db
    .selectFrom("job_types as j")
    .innerJoin("tool_categories as c", "c.id", "j.category_id")
    .select(["j.slug", "j.name", "c.name as category_name"])
    .where((eb) => eb.and(like.map((w) => eb(sql<string>`lower(j.name || ' ' || j.slug || ' ' || c.name)`, "like", w))))
    .$if(!!filters.category, (qb) => qb.where("c.slug", "=", filters.category!))
    .$if(!!filters.job, (qb) => qb.where("j.slug", "=", filters.job!))
    .orderBy("j.name")
    .limit(8)
    .execute();
}

export interface SearchResults {
  source: SearchResult["source"];
  jobs: JobMatch[];
  tools: SearchResult["hits"];
  reports: SearchResult["hits"];
  reportTotal: number;
  page: number;
  pageCount: number;
  facets: SearchResult["facets"];
}

export async function searchResults(db: Db, q: string, filters: SearchFilters, page: number): Promise<SearchResults> {
  // Job and tool pages head the first page only; later pages hold reports alone.
  const pagesFirst = page === 1 && filters.kind !== "report";
  const [jobs, tools, reports] = await Promise.all([
    pagesFirst && !filters.kind && !filters.shank ? matchingJobs(db, q, filters) : Promise.resolve([]),
    pagesFirst ? search(db, q, { ...filters, kind: "model" }, TOOLS_SHOWN) : Promise.resolve(null),
    filters.kind === "model"
      ? Promise.resolve(null)
      : search(db, q, { ...filters, kind: "report" }, REPORTS_PER_PAGE, undefined, {
          offset: (page - 1) * REPORTS_PER_PAGE,
        }),
  ]);
  const reportTotal = reports?.total ?? 0;
  const pageCount = Math.max(1, Math.min(MAX_PAGE, Math.ceil(reportTotal / REPORTS_PER_PAGE)));
  const facets = reports && Object.keys(reports.facets).length ? reports.facets : (tools?.facets ?? {});
  const fellBack = tools?.source === "database" || reports?.source === "database";
  return {
    source: fellBack ? "database" : "search",
    jobs,
    tools: tools?.hits ?? [],
    reports: reports?.hits ?? [],
    reportTotal,
    page,
    pageCount,
    facets,
  };
}

/** `?page=` leniently: missing or unreadable is the first page, beyond the last is the last we serve. */
export function parsePage(value: string | null): number {
  const n = Number(value ?? "1");
  return Number.isInteger(n) && n >= 1 ? Math.min(n, MAX_PAGE) : 1;
}
