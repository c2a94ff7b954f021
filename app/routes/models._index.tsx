import {
  type ColumnDef,
  flexRender,
  getCoreRowModel,
  getSortedRowModel,
  type SortingState,
  useReactTable,
} from "@tanstack/react-table";
import { useMemo, useRef, useState } from "react";
import { Form, Link, type ShouldRevalidateFunctionArgs, useFetcher, useNavigate } from "react-router";
import { FITTING_LABELS, formatPrice, toolName } from "~/domain";
import { filtersToSearch, type ModelFilters, parseModelFilters, type SortKey } from "~/catalogue/model-filters";
import { filterOptions, modelsTable, type ModelTableRow } from "~/catalogue/models-table.server";
import { ErrorPage } from "~/components/error-page";
import { IntervalBar, pct } from "~/components/intervals";
import { buttonClass, cardClass, DataTable } from "~/components/ui";
import { db } from "~/db.server";
import type { Route } from "./+types/models._index";

export async function loader({ request }: Route.LoaderArgs) {
  const { filters, ignored } = parseModelFilters(new URL(request.url).searchParams);
  const [rows, options] = await Promise.all([modelsTable(db, filters), filterOptions(db)]);
  return { rows, filters, ignored, options };
}

// The page's own filter changes are served by the resource route; only other navigations (back,
// forward, a shared link) need the loader.
let lastFetchedSearch: string | null = null;
export function shouldRevalidate({ nextUrl, defaultShouldRevalidate }: ShouldRevalidateFunctionArgs) {
  return nextUrl.search.replace(/^\?/, "") === lastFetchedSearch ? false : defaultShouldRevalidate;
}

const COLUMN_SORT: Record<string, SortKey> = {
  tool: "tool",
  price: "price",
  weight: "weight",
  length: "length",
  reports: "reports",
  success: "success",
};

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

  const columns = useMemo<ColumnDef<ModelTableRow>[]>(
    () => [
      {
        id: "tool",
        header: "Tool",
        accessorFn: (r) => toolName(r.maker_name, r.model_code),
        cell: ({ row: { original: r } }) => (
          <>
            <Link to={`/models/${r.slug}`} className="font-semibold text-bay-700 hover:underline">
              {toolName(r.maker_name, r.model_code)}
            </Link>
            <div className="text-xs text-stone-500">
              {r.name} · {r.category_name}
            </div>
          </>
        ),
      },
      {
        id: "fitting",
        header: "Shank or drive",
        accessorFn: (r) => FITTING_LABELS[r.fitting] ?? r.fitting,
        enableSorting: false,
      },
      { id: "jobs", header: "Jobs with reports", accessorKey: "jobs_with_reports", enableSorting: false },
      { id: "weight", header: "Weight", accessorKey: "weight_kg", cell: ({ getValue }) => `${getValue<number>()} kg` },
      { id: "length", header: "Length", accessorKey: "length_mm", cell: ({ getValue }) => `${getValue<number>()} mm` },
      {
        id: "price",
        header: "Price",
        accessorFn: (r) => r.street_price_cents ?? Infinity,
        cell: ({ row }) => formatPrice(row.original.street_price_cents),
      },
      { id: "reports", header: "Accepted reports", accessorKey: "reports" },
      {
        id: "success",
        header: job ? `Freed on ${job.name.toLowerCase()} (lower bound sorts)` : "Success on a job",
        accessorFn: (r) => r.job_lower ?? -1,
        enableSorting: !!job,
        cell: ({ row: { original: r } }) =>
          r.job_estimate == null ? (
            <span className="text-xs text-stone-500">{job ? "no reports on this job" : "pick a job"}</span>
          ) : (
            <span className="flex items-center gap-2">
              <IntervalBar
                estimate={r.job_estimate}
                lower={r.job_lower!}
                upper={r.job_upper!}
                muted={(r.job_n ?? 0) < 10}
              />
              {pct(r.job_estimate)}{" "}
              <span className="text-xs text-stone-500">
                ({pct(r.job_lower!)}–{pct(r.job_upper!)}, n = {r.job_n})
              </span>
            </span>
          ),
      },
    ],
    [job],
  );

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
  const select = "mt-1 block w-full rounded border border-stone-300 px-2 py-2 text-sm";
  return (
    <div className="space-y-4">
      <h1 className="text-2xl font-bold">Tools</h1>
      <Form
        method="get"
        ref={formRef}
        onChange={() => apply()}
        className={cardClass("sm", "grid grid-cols-2 gap-3 sm:grid-cols-6")}
      >
        <label className="text-sm">
          Category
          <select name="category" defaultValue={f.category ?? ""} className={select}>
            <option value="">Any</option>
            {options.categories.map((c) => (
              <option key={c.slug} value={c.slug}>
                {c.name}
              </option>
            ))}
          </select>
        </label>
        <label className="text-sm">
          Shank or drive
          <select name="fitting" defaultValue={f.fitting ?? ""} className={select}>
            <option value="">Any</option>
            {Object.entries(FITTING_LABELS).map(([k, v]) => (
              <option key={k} value={k}>
                {v}
              </option>
            ))}
          </select>
        </label>
        <label className="col-span-2 text-sm">
          Success on the job
          <select name="job" defaultValue={f.job ?? ""} className={select}>
            <option value="">— pick a job —</option>
            {options.jobs.map((j) => (
              <option key={j.slug} value={j.slug}>
                {j.category}: {j.name}
              </option>
            ))}
          </select>
        </label>
        <label className="text-sm">
          Max price, $<input name="maxPrice" defaultValue={f.maxPrice ?? ""} inputMode="decimal" className={select} />
        </label>
        <label className="text-sm">
          Max weight, kg
          <input name="maxWeight" defaultValue={f.maxWeight ?? ""} inputMode="decimal" className={select} />
        </label>
        <label className="text-sm">
          At least … reports
          <input name="minReports" defaultValue={f.minReports ?? ""} inputMode="numeric" className={select} />
        </label>
        <input type="hidden" name="sort" value={f.sort ?? ""} />
        <input type="hidden" name="dir" value={f.dir ?? ""} />
        <noscript>
          <button type="submit" className={buttonClass("primary", "sm")}>
            Filter
          </button>
        </noscript>
      </Form>
      {current.ignored.length > 0 && (
        <p role="alert" className="text-sm text-amber-800">
          Left out filters that could not be read: {current.ignored.join(", ")}.
        </p>
      )}
      <p className="text-sm text-stone-600" role="status">
        {current.rows.length} tools{fetcher.state === "loading" ? " · updating…" : ""}
      </p>
      <DataTable
        label="Tools"
        minWidth="52rem"
        head={table.getHeaderGroups().map((g) => (
          <tr key={g.id}>
            {g.headers.map((h) => (
              <th
                key={h.id}
                className="px-3 py-2"
                aria-sort={
                  h.column.getIsSorted() ? (h.column.getIsSorted() === "desc" ? "descending" : "ascending") : undefined
                }
              >
                {h.column.getCanSort() ? (
                  <button
                    type="button"
                    onClick={h.column.getToggleSortingHandler()}
                    className="inline-flex min-h-11 items-center text-left uppercase hover:underline"
                  >
                    {flexRender(h.column.columnDef.header, h.getContext())}
                    {{ asc: " ▲", desc: " ▼" }[h.column.getIsSorted() as string] ?? ""}
                  </button>
                ) : (
                  flexRender(h.column.columnDef.header, h.getContext())
                )}
              </th>
            ))}
          </tr>
        ))}
      >
        {table.getRowModel().rows.map((row) => (
          <tr key={row.id} data-testid="model-row">
            {row.getVisibleCells().map((cell) => (
              <td key={cell.id} className="px-3 py-2">
                {flexRender(cell.column.columnDef.cell, cell.getContext())}
              </td>
            ))}
          </tr>
        ))}
      </DataTable>
    </div>
  );
}

export function meta() {
  return [{ title: "Tools — Bayproof" }];
}

export function ErrorBoundary({ error }: Route.ErrorBoundaryProps) {
  return <ErrorPage error={error} />;
}
