// The text of the bulk files, shared by the live dump (bulk.server.ts) and the daily snapshot
// (snapshot.server.ts) so both are byte for byte the same: rows of bulkQuery() read through a
// cursor as unparsed text, turned into NDJSON lines or RFC 4180 CSV records.
import { stringify } from "csv-stringify/sync";
import { REPORT_FIELDS } from "./fields";

export type BulkFormat = "ndjson" | "csv";

/** Rows read from the cursor per batch. */
export const BATCH = 2000;
/**
 * Rows are handed on as text in pieces of about this many characters: small enough that V8
 * frees them in its cheap young-generation collections (one string per batch would land in
 * large-object space and wait for a full collection), large enough to keep writes few.
 */
const PIECE = 32 * 1024;

/** Rows come from PostgreSQL as arrays of text, unparsed: a JSON line, or the CSV's columns. */
export type RawRow = (string | null)[];
export const RAW_TEXT = { getTypeParser: () => (value: string) => value };

/** The rows' text joined into pieces of about PIECE characters. */
function* pieces(rows: RawRow[], text: (row: RawRow) => string, head = "") {
  let piece = head;
  for (const row of rows) {
    piece += text(row);
    if (piece.length >= PIECE) {
      yield piece;
      piece = "";
    }
  }
  if (piece) yield piece;
}

/** RFC 4180 lines: CRLF after every record, fields quoted when they hold a comma, quote or line break. */
const csvLines = (rows: RawRow[], header: boolean) =>
  stringify(rows, { header, columns: REPORT_FIELDS.map((f) => f.name), record_delimiter: "\r\n" });

/** One batch of rows as text; the first batch of a CSV starts with the header (even when empty). */
export function* batchText(format: BulkFormat, rows: RawRow[], first: boolean): Generator<string> {
  if (format === "csv") {
    if (rows.length > 0 || first) yield* pieces(rows, (r) => csvLines([r], false), first ? csvLines([], true) : "");
  } else {
    yield* pieces(rows, (r) => `${r[0]}\n`);
  }
}
