import { flexRender, type Table } from "@tanstack/react-table";
import type { ModelTableRow } from "~/catalogue/models-table.server";
import { DataTable } from "~/components/ui";

/** The tools table, with a sort button in every sortable header. */
export function ModelsDataTable({ table }: { table: Table<ModelTableRow> }) {
  return (
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
  );
}
