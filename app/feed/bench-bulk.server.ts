// The bench bulk files: every accepted run as NDJSON (a run a line, the records of /api/v1/bench-runs)
// or as CSV (a trial a row, the columns of BENCH_TRIAL_ROW_FIELDS, RFC 4180). The bench data are small
// — tens of runs per model, a few hundred bytes a trial — so the file is written in one piece.
import { stringify } from "csv-stringify/sync";
import type { Db } from "../../db/database";
import { BENCH_TRIAL_ROW_FIELDS } from "./bench-fields";
import { allBenchRuns, trialRows } from "./bench-queries.server";
import type { BulkFormat } from "./dump.server";

const CONTENT_TYPE: Record<BulkFormat, string> = {
  ndjson: "application/x-ndjson; charset=utf-8",
  csv: "text/csv; charset=utf-8; header=present",
};

/** A CSV cell: lists as JSON text, true/false spelled out, an empty cell for null. */
function cell(value: unknown): string {
  if (value === null || value === undefined) return "";
  if (Array.isArray(value)) return JSON.stringify(value);
  if (typeof value === "boolean") return value ? "true" : "false";
  if (typeof value === "number" || typeof value === "string") return String(value);
  return JSON.stringify(value);
}

export async function benchBulkText(db: Db, format: BulkFormat, origin: string): Promise<string> {
  const runs = await allBenchRuns(db, origin);
  if (format === "ndjson") return runs.map((r) => `${JSON.stringify(r)}\n`).join("");
  const columns = BENCH_TRIAL_ROW_FIELDS.map((f) => f.name);
  const rows = runs.flatMap(trialRows).map((row) => columns.map((c) => cell((row as Record<string, unknown>)[c])));
  return stringify(rows, { header: true, columns, record_delimiter: "\r\n" });
}

export async function benchBulkResponse(db: Db, format: BulkFormat, origin: string, day: string): Promise<Response> {
  return new Response(await benchBulkText(db, format, origin), {
    status: 200,
    headers: {
      "Content-Type": CONTENT_TYPE[format],
      "Content-Disposition": `attachment; filename="bayproof-bench-runs-${day}.${format}"`,
      "Cache-Control": "no-store",
    },
  });
}
