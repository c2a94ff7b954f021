import { getCoreRowModel, getSortedRowModel, type SortingState, useReactTable } from "@tanstack/react-table";
import { useRef, useState } from "react";
import { type ShouldRevalidateFunctionArgs, useFetcher, useNavigate } from "react-router";
import { filtersToSearch, type ModelFilters, parseModelFilters } from "~/catalogue/model-filters";
import { filterOptions, modelsTable, type ModelTableRow } from "~/catalogue/models-table.server";
import { COLUMN_SORT, useModelColumns } from "~/components/catalogue/model-columns";
import { ModelFilterForm } from "~/components/catalogue/model-filter-form";
import { ModelsDataTable } from "~/components/catalogue/models-data-table";
import { ErrorPage } from "~/components/error-page";
import { readDb } from "~/db.server";
import type { Route } from "./+types/models._index";

export async function loader({ request }: Route.LoaderArgs) {
  const { filters, ignored } = parseModelFilters(new URL(request.url).searchParams);
  const [rows, options] = await Promise.all([modelsTable(readDb, filters), filterOptions(readDb)]);
  return { rows, filters, ignored, options };
}

// The page's own filter changes are served by the resource route; only other navigations (back,
// forward, a shared link) need the loader.
let lastFetchedSearch: string | null = null;
export function shouldRevalidate({ nextUrl, defaultShouldRevalidate }: ShouldRevalidateFunctionArgs) {
  return nextUrl.search.replace(/^\?/, "") === lastFetchedSearch ? false : defaultShouldRevalidate;
}

export default function Models({ loaderData }: Route.ComponentProps) {
  const { options } = loaderData;
  const fetcher = useFetcher<{ rows: ModelTableRow[]; filters: ModelFilters; ignored: string[] }>();
  const navigate = useNavigate();
  const formRef = useRef<HTMLFormElement>(null);
  const current = fetcher.data && lastFetchedSearch !== null ? fetcher.data : loaderData;
  const job = options.jobs.find((j) => j.slug === current.filters.job);
  const [sorting, setSorting] = useState<SortingState>(
    loaderData.filters.sort ? [{ id: loaderData.filters.sort, desc: loaderData.filters.dir === "desc" }] : [],
  );

  function apply(nextSorting = sorting) {
    const form = new FormData(formRef.current!);
    const f = Object.fromEntries([...form].filter(([, v]) => v !== "")) as Record<string, string>;
    const s = nextSorting[0];
    if (s) Object.assign(f, { sort: COLUMN_SORT[s.id] ?? "tool", dir: s.desc ? "desc" : "asc" });
    const search = filtersToSearch(f);
    lastFetchedSearch = search;
    void fetcher.load(`/api/models?${search}`);
    void navigate(`?${search}`, { preventScrollReset: true });
  }

  const columns = useModelColumns(job);

  const table = useReactTable({
    data: current.rows,
    columns,
    state: { sorting },
    onSortingChange: (updater) => {
      const next = typeof updater === "function" ? updater(sorting) : updater;
      setSorting(next);
      apply(next);
    },
    getCoreRowModel: getCoreRowModel(),
    getSortedRowModel: getSortedRowModel(),
    enableSortingRemoval: false,
  });

  const f = loaderData.filters;
  return (
    <div className="space-y-4">
      <h1 className="text-2xl font-bold">Tools</h1>
      <ModelFilterForm filters={f} options={options} formRef={formRef} onChange={() => apply()} />
      {current.ignored.length > 0 && (
        <p role="alert" className="text-sm text-amber-800">
          Left out filters that could not be read: {current.ignored.join(", ")}.
        </p>
      )}
      <p className="text-sm text-stone-600" role="status">
        {current.rows.length} tools{fetcher.state === "loading" ? " · updating…" : ""}
      </p>
      <ModelsDataTable table={table} />
    </div>
  );
}

export function meta() {
  return [{ title: "Tools — Bayproof" }];
}

export function ErrorBoundary({ error }: Route.ErrorBoundaryProps) {
  return <ErrorPage error={error} />;
}
