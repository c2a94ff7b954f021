import type { ColumnDef } from "@tanstack/react-table";
import { useMemo } from "react";
import { Link } from "react-router";
import { FITTING_LABELS, formatPrice, toolName } from "~/domain";
import type { SortKey } from "~/catalogue/model-filters";
import type { ModelTableRow } from "~/catalogue/models-table.server";
import { IntervalBar, pct } from "~/components/intervals";

/** The table's column ids, as the sort parameter names them. */
export const COLUMN_SORT: Record<string, SortKey> = {
  tool: "tool",
  price: "price",
  weight: "weight",
  length: "length",
  reports: "reports",
  success: "success",
};

/** The tools table's columns; the success column follows the chosen job. */
export function useModelColumns(job: { name: string } | undefined) {
  return useMemo<ColumnDef<ModelTableRow>[]>(
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
}
