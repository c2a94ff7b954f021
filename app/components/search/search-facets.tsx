import { Link } from "react-router";
import { FITTING_LABELS } from "~/domain";
import type { SearchResults } from "~/search/results.server";

const FACET_LABELS: Record<string, string> = { category: "Category", job: "Job", shank: "Shank or drive" };

/** The facet counts beside the results; each value narrows the search, "any" widens it again. */
export function SearchFacets({
  facets,
  filters,
  withFilter,
}: {
  facets: SearchResults["facets"];
  filters: Record<string, string>;
  withFilter: (key: string, value: string | null) => string;
}) {
  return (
    <aside aria-label="Narrow the search" className="space-y-3 text-sm">
      {Object.entries(facets).map(([facet, counts]) => (
        <div key={facet}>
          <h2 className="font-semibold">{FACET_LABELS[facet] ?? facet}</h2>
          <ul>
            {filters[facet] && (
              <li>
                <Link to={withFilter(facet, null)} className="inline-flex min-h-11 items-center text-bay-700 underline">
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
  );
}
