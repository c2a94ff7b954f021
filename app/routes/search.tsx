import { Form } from "react-router";
import { ErrorPage } from "~/components/error-page";
import { SearchFacets } from "~/components/search/search-facets";
import { SearchResults } from "~/components/search/search-results";
import { buttonClass } from "~/components/ui";
import { readDb } from "~/db.server";
import { parseSearch } from "~/search/query";
import { parsePage, searchResults } from "~/search/results.server";
import type { Route } from "./+types/search";

export async function loader({ request }: Route.LoaderArgs) {
  const params = new URL(request.url).searchParams;
  const parsed = parseSearch(params);
  const page = parsePage(params.get("page"));
  const result =
    parsed.q || Object.keys(parsed.filters).length ? await searchResults(readDb, parsed.q, parsed.filters, page) : null;
  return { ...parsed, result };
}

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
          <SearchFacets facets={result.facets} filters={filters} withFilter={withFilter} />
          <SearchResults
            result={result}
            filters={filters}
            pageTo={(page) => address({ page: page === 1 ? null : String(page) })}
          />
        </div>
      )}
    </div>
  );
}

export function meta({ data }: Route.MetaArgs) {
  return [{ title: data?.q ? `“${data.q}” — Search — Bayproof` : "Search — Bayproof" }];
}

export function ErrorBoundary({ error }: Route.ErrorBoundaryProps) {
  return <ErrorPage error={error} />;
}
