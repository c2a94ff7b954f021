import { Form, Link } from "react-router";
import { FITTING_LABELS } from "~/domain";
import { ErrorPage } from "~/components/error-page";
import { buttonClass, Card } from "~/components/ui";
import { db } from "~/db.server";
import { parseSearch } from "~/search/query";
import { search } from "~/search/search.server";
import type { Route } from "./+types/search";

export async function loader({ request }: Route.LoaderArgs) {
  const parsed = parseSearch(new URL(request.url).searchParams);
  const result = parsed.q || Object.keys(parsed.filters).length ? await search(db, parsed.q, parsed.filters, 30) : null;
  return { ...parsed, result };
}

const FACET_LABELS: Record<string, string> = { category: "Category", job: "Job", shank: "Shank or drive" };

export default function SearchPage({ loaderData }: Route.ComponentProps) {
  const { q, filters, ignored, truncated, result } = loaderData;
  const withFilter = (key: string, value: string | null) => {
    const p = new URLSearchParams({ q, ...filters });
    if (value == null) p.delete(key);
    else p.set(key, value);
    return `/search?${p}`;
  };
  return (
    <div className="space-y-4">
      <h1 className="text-2xl font-bold">Search</h1>
      <Form method="get" className="flex gap-2" role="search">
        <input name="q" defaultValue={q} aria-label="Search tools and reports" placeholder="Maker, model code, job, vehicle…" className="flex-1 rounded border border-stone-300 px-3 py-3" />
        {Object.entries(filters).map(([k, v]) => <input key={k} type="hidden" name={k} value={v} />)}
        <button type="submit" className={buttonClass()}>Search</button>
      </Form>
      {(ignored.length > 0 || truncated) && (
        <p role="alert" className="text-sm text-amber-800">
          {truncated ? "The search was cut to 200 characters. " : ""}{ignored.length ? `Left out what could not be read: ${ignored.join(", ")}.` : ""}
        </p>
      )}
      {result?.source === "database" && (
        <p role="status" className="rounded bg-amber-50 px-3 py-2 text-sm">The search service cannot be reached just now: these are plainer matches from the database (no typo tolerance, no facets).</p>
      )}
      {result && (
        <div className="grid gap-4 sm:grid-cols-[14rem_1fr]">
          <aside className="space-y-3 text-sm">
            {Object.entries(result.facets).map(([facet, counts]) => (
              <div key={facet}>
                <h2 className="font-semibold">{FACET_LABELS[facet] ?? facet}</h2>
                <ul>
                  {filters[facet] && <li><Link to={withFilter(facet, null)} className="text-bay-700 underline">any</Link></li>}
                  {Object.entries(counts).sort((a, b) => b[1] - a[1]).slice(0, 12).map(([value, n]) => (
                    <li key={value}>
                      <Link to={withFilter(facet, value)} className={filters[facet] === value ? "font-semibold" : "text-bay-700 hover:underline"}>
                        {facet === "shank" ? FITTING_LABELS[value] ?? value : value.replaceAll("-", " ")}
                      </Link> <span className="text-stone-500">{n}</span>
                    </li>
                  ))}
                </ul>
              </div>
            ))}
          </aside>
          <section aria-label="Results">
            <p className="mb-2 text-sm text-stone-600">{result.total} matches</p>
            <Card as="ul" padding="none" className="divide-y divide-stone-100">
              {result.hits.map((h) => (
                <li key={h.id} className="px-3 py-2">
                  <Link to={h.url} className="font-semibold text-bay-700 hover:underline" data-testid="search-hit">{h.title}</Link>
                  <span className="ml-2 rounded bg-stone-100 px-2 text-xs">{h.kind === "model" ? "tool" : "report"}</span>
                  <div className="text-xs text-stone-600">{h.kind === "report" ? `${h.job_name}${h.notes ? ` — ${h.notes}` : ""}` : h.category_name}</div>
                </li>
              ))}
              {result.hits.length === 0 && <li className="px-3 py-3 text-stone-600">Nothing matches.</li>}
            </Card>
          </section>
        </div>
      )}
    </div>
  );
}

export function meta() {
  return [{ title: "Search — Bayproof" }];
}

export function ErrorBoundary({ error }: Route.ErrorBoundaryProps) {
  return <ErrorPage error={error} />;
}
