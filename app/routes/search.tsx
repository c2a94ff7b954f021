import { Form, Link } from "react-router";
import { FITTING_LABELS, formatDate, formatPressure, VEHICLE_LABELS } from "~/domain";
import { ErrorPage } from "~/components/error-page";
import { OutcomeBadge } from "~/components/report-table";
import { buttonClass, Card } from "~/components/ui";
import { db } from "~/db.server";
import { parseSearch } from "~/search/query";
import { parsePage, searchResults } from "~/search/results.server";
import type { Route } from "./+types/search";

export async function loader({ request }: Route.LoaderArgs) {
  const params = new URL(request.url).searchParams;
  const parsed = parseSearch(params);
  const page = parsePage(params.get("page"));
  const result =
    parsed.q || Object.keys(parsed.filters).length ? await searchResults(db, parsed.q, parsed.filters, page) : null;
  return { ...parsed, result };
}

const FACET_LABELS: Record<string, string> = { category: "Category", job: "Job", shank: "Shank or drive" };
const linkClass = "font-semibold text-bay-700 underline-offset-2 hover:underline";

export default function SearchPage({ loaderData }: Route.ComponentProps) {
  const { q, filters, ignored, truncated, result } = loaderData;
  const address = (changes: Record<string, string | null>) => {
    const p = new URLSearchParams({ q, ...filters });
    for (const [key, value] of Object.entries(changes)) {
      if (value == null) p.delete(key);
      else p.set(key, value);
    }
    return `/search?${p}`;
  };
  // A changed filter starts again at the first page.
  const withFilter = (key: string, value: string | null) => address({ [key]: value, page: null });
  return (
    <div className="space-y-4">
      <h1 className="text-2xl font-bold">Search</h1>
      <Form method="get" className="flex gap-2" role="search" aria-label="Search the records">
        <input
          name="q"
          defaultValue={q}
          aria-label="Search tools, jobs and reports"
          placeholder="Maker, model code, job, vehicle…"
          className="min-w-0 flex-1 rounded border border-stone-400 px-3 py-3"
        />
        {Object.entries(filters).map(([k, v]) => (
          <input key={k} type="hidden" name={k} value={v} />
        ))}
        <button type="submit" className={buttonClass()}>
          Search
        </button>
      </Form>
      {(ignored.length > 0 || truncated) && (
        <p role="alert" className="text-sm text-amber-800">
          {truncated ? "The search was cut to 200 characters. " : ""}
          {ignored.length ? `Left out what could not be read: ${ignored.join(", ")}.` : ""}
        </p>
      )}
      {result?.source === "database" && (
        <p role="status" className="rounded bg-amber-50 px-3 py-2 text-sm">
          The search service cannot be reached just now: these are plainer matches from the database (no typo tolerance,
          no facets).
        </p>
      )}
      {result && (
        <div className="grid gap-4 sm:grid-cols-[14rem_1fr]">
          <aside aria-label="Narrow the search" className="space-y-3 text-sm">
            {Object.entries(result.facets).map(([facet, counts]) => (
              <div key={facet}>
                <h2 className="font-semibold">{FACET_LABELS[facet] ?? facet}</h2>
                <ul>
                  {filters[facet] && (
                    <li>
                      <Link
                        to={withFilter(facet, null)}
                        className="inline-flex min-h-11 items-center text-bay-700 underline"
                      >
                        any
                      </Link>
                    </li>
                  )}
                  {Object.entries(counts)
                    .sort((a, b) => b[1] - a[1])
                    .slice(0, 12)
                    .map(([value, n]) => (
                      <li key={value}>
                        <Link
                          to={withFilter(facet, value)}
                          className={`inline-flex min-h-11 items-center gap-2 sm:min-h-8 ${filters[facet] === value ? "font-semibold" : "text-bay-700 hover:underline"}`}
                        >
                          {facet === "shank" ? (FITTING_LABELS[value] ?? value) : value.replaceAll("-", " ")}
                          <span className="text-stone-600">{n}</span>
                        </Link>
                      </li>
                    ))}
                </ul>
              </div>
            ))}
          </aside>
          <div className="min-w-0 space-y-5">
            {result.jobs.length > 0 && (
              <section aria-labelledby="job-results">
                <h2 id="job-results" className="mb-2 text-lg font-bold">
                  Job pages
                </h2>
                <Card as="ul" padding="none" className="divide-y divide-stone-100">
                  {result.jobs.map((j) => (
                    <li key={j.slug}>
                      <Link
                        to={`/jobs/${j.slug}`}
                        className="flex min-h-11 flex-wrap items-center justify-between gap-2 px-3 py-2 hover:bg-bay-50"
                        data-testid="search-hit"
                      >
                        <span className={linkClass}>{j.name}</span>
                        <span className="text-sm text-stone-600">{j.category_name}</span>
                      </Link>
                    </li>
                  ))}
                </Card>
              </section>
            )}
            {result.tools.length > 0 && (
              <section aria-labelledby="tool-results">
                <h2 id="tool-results" className="mb-2 text-lg font-bold">
                  Tool pages
                </h2>
                <Card as="ul" padding="none" className="divide-y divide-stone-100">
                  {result.tools.map((h) => (
                    <li key={h.id}>
                      <Link
                        to={h.url}
                        className="flex min-h-11 flex-wrap items-center justify-between gap-2 px-3 py-2 hover:bg-bay-50"
                        data-testid="search-hit"
                      >
                        <span className={linkClass}>{h.title}</span>
                        <span className="text-sm text-stone-600">{h.category_name}</span>
                      </Link>
                    </li>
                  ))}
                </Card>
              </section>
            )}
            {filters.kind !== "model" && (
              <section aria-labelledby="report-results">
                <h2 id="report-results" className="mb-2 text-lg font-bold">
                  Reports{" "}
                  <span className="text-sm font-normal text-stone-600">
                    ({result.reportTotal} {result.reportTotal === 1 ? "match" : "matches"})
                  </span>
                </h2>
                <Card as="ul" padding="none" className="divide-y divide-stone-100">
                  {result.reports.map((h) => (
                    <li key={h.id}>
                      <Link to={h.url} className="block px-3 py-2 hover:bg-bay-50" data-testid="search-hit">
                        <span className="flex flex-wrap items-center gap-2">
                          <OutcomeBadge outcome={h.outcome ?? null} />
                          <span className={linkClass}>{h.title}</span>
                        </span>
                        <span className="mt-1 block text-sm text-stone-700">
                          {[
                            h.accepted_on && formatDate(h.accepted_on),
                            h.inlet_kpa != null && `${formatPressure(h.inlet_kpa)} at the tool`,
                            VEHICLE_LABELS[(h.vehicle_class ?? "").replaceAll(" ", "_")],
                          ]
                            .filter(Boolean)
                            .join(" · ")}
                        </span>
                        {h.notes && <span className="mt-1 line-clamp-2 block text-sm text-stone-600">{h.notes}</span>}
                      </Link>
                    </li>
                  ))}
                  {result.reports.length === 0 && <li className="px-3 py-3 text-stone-600">No reports match.</li>}
                </Card>
                <Pager
                  page={result.page}
                  pageCount={result.pageCount}
                  to={(page) => address({ page: page === 1 ? null : String(page) })}
                />
              </section>
            )}
          </div>
        </div>
      )}
    </div>
  );
}

function Pager({ page, pageCount, to }: { page: number; pageCount: number; to: (page: number) => string }) {
  if (pageCount <= 1) return null;
  return (
    <nav aria-label="Report pages" className="mt-3 flex items-center justify-between gap-2 text-sm">
      {page > 1 ? (
        <Link to={to(page - 1)} className={buttonClass("plain", "sm", "min-h-11 inline-flex items-center")}>
          ← Previous
        </Link>
      ) : (
        <span />
      )}
      <span className="text-stone-700">
        Page {page} of {pageCount}
      </span>
      {page < pageCount ? (
        <Link to={to(page + 1)} className={buttonClass("plain", "sm", "min-h-11 inline-flex items-center")}>
          Next →
        </Link>
      ) : (
        <span />
      )}
    </nav>
  );
}

export function meta({ data }: Route.MetaArgs) {
  return [{ title: data?.q ? `“${data.q}” — Search — Bayproof` : "Search — Bayproof" }];
}

export function ErrorBoundary({ error }: Route.ErrorBoundaryProps) {
  return <ErrorPage error={error} />;
}
