// The bulk files: every accepted report read through a server-side cursor a batch at a time and
// written as the client takes it (a pull stream), so memory stays flat at any table size.
// PostgreSQL writes each NDJSON line itself (queries.server.ts); the server only forwards text.
import { Readable } from "node:stream";
import { createGzip } from "node:zlib";
import { stringify } from "csv-stringify/sync";
import type pg from "pg";
import Cursor from "pg-cursor";
import { db, pool } from "~/db.server";
import { REPORT_FIELDS } from "./fields";
import { bulkQuery } from "./queries.server";

const BATCH = 2000;
/**
 * Rows are handed on as text in pieces of about this many characters: small enough that V8
 * frees them in its cheap young-generation collections (one string per batch would land in
 * large-object space and wait for a full collection), large enough to keep writes few.
 */
const PIECE = 32 * 1024;

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

export type BulkFormat = "ndjson" | "csv";

const CONTENT_TYPE: Record<BulkFormat, string> = {
  ndjson: "application/x-ndjson; charset=utf-8",
  csv: "text/csv; charset=utf-8; header=present",
};

/** Rows come from PostgreSQL as arrays of text, unparsed: a JSON line, or the CSV's columns. */
type RawRow = (string | null)[];
const RAW_TEXT = { getTypeParser: () => (value: string) => value };

/** RFC 4180 lines: CRLF after every record, fields quoted when they hold a comma, quote or line break. */
const csvLines = (rows: RawRow[], header: boolean) =>
  stringify(rows, { header, columns: REPORT_FIELDS.map((f) => f.name), record_delimiter: "\r\n" });

function reportStream(format: BulkFormat, origin: string, signal: AbortSignal): ReadableStream<Uint8Array> {
  let client: pg.PoolClient | null = null;
  let cursor: Cursor | null = null;
  let first = true;
  // The next batch is asked for as soon as one arrives, so PostgreSQL works on it while this one
  // is written out: two batches at most are held.
  let next: Promise<RawRow[]> | null = null;
  const encoder = new TextEncoder();
  const release = async () => {
    const c = cursor;
    const k = client;
    cursor = null;
    client = null;
    await next?.catch(() => {});
    next = null;
    if (c) await c.close().catch(() => {});
    k?.release();
  };
  signal.addEventListener("abort", () => void release(), { once: true });
  return new ReadableStream<Uint8Array>({
    async start() {
      client = await pool.connect();
      const q = bulkQuery(db, origin, format);
      cursor = client.query(new Cursor(q.sql, [...q.parameters], { rowMode: "array", types: RAW_TEXT }));
    },
    async pull(controller) {
      if (!cursor) return controller.close();
      try {
        const rows = await (next ?? (cursor.read(BATCH) as Promise<RawRow[]>));
        next = rows.length === BATCH ? (cursor.read(BATCH) as Promise<RawRow[]>) : null;
        next?.catch(() => {});
        if (format === "csv") {
          if (rows.length > 0 || first) for (const piece of pieces(rows, (r) => csvLines([r], false), first ? csvLines([], true) : "")) controller.enqueue(encoder.encode(piece));
        } else {
          for (const piece of pieces(rows, (r) => `${r[0]}\n`)) controller.enqueue(encoder.encode(piece));
        }
        first = false;
        if (rows.length < BATCH) {
          await release();
          controller.close();
        }
      } catch (error) {
        await release();
        controller.error(error);
      }
    },
    async cancel() {
      await release();
    },
  }, { highWaterMark: 1 });
}

/** The whole file as a response; gzip-compressed here when the client accepts it. */
export function bulkResponse(request: Request, format: BulkFormat, origin: string, day: string): Response {
  let body = reportStream(format, origin, request.signal);
  const headers: Record<string, string> = {
    "Content-Type": CONTENT_TYPE[format],
    "Content-Disposition": `attachment; filename="bayproof-reports-${day}.${format}"`,
    "Cache-Control": "no-store",
  };
  if (/\bgzip\b/.test(request.headers.get("accept-encoding") ?? "")) {
    body = Readable.toWeb(Readable.fromWeb(body as never).pipe(createGzip({ level: 4 }))) as unknown as ReadableStream<Uint8Array>;
    headers["Content-Encoding"] = "gzip";
    headers.Vary = "Accept-Encoding";
  }
  return new Response(body, { status: 200, headers });
}
