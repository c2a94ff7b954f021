import { Link } from "react-router";
import { formatDate, formatPressure, VEHICLE_LABELS } from "~/domain";
import type { SearchResults as Results } from "~/search/results.server";
import { OutcomeBadge } from "~/components/report-table";
import { buttonClass, Card } from "~/components/ui";

const linkClass = "font-semibold text-bay-700 underline-offset-2 hover:underline";

/** The hits of one search: job pages, tool pages, then a page of reports. */
export function SearchResults({
  result,
  filters,
  pageTo,
}: {
  result: Results;
  filters: Record<string, string>;
  pageTo: (page: number) => string;
}) {
  return (
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
          <Pager page={result.page} pageCount={result.pageCount} to={pageTo} />
        </section>
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
