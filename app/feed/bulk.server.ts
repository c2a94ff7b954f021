// The bulk files: every accepted report read through a server-side cursor a batch at a time and
// written as the client takes it (a pull stream), so memory stays flat at any table size.
// PostgreSQL writes each NDJSON line itself (queries.server.ts); the server only forwards text.
// The daily snapshot (snapshot.server.ts) writes the same text (dump.server.ts) to storage.
import { Readable } from "node:stream";
import { createGzip } from "node:zlib";
import type pg from "pg";
import Cursor from "pg-cursor";
import type { Db } from "../../db/database";
import { BATCH, batchText, type BulkFormat, RAW_TEXT, type RawRow } from "./dump.server";
import { bulkQuery } from "./queries.server";

export type { BulkFormat };

const CONTENT_TYPE: Record<BulkFormat, string> = {
  ndjson: "application/x-ndjson; charset=utf-8",
  csv: "text/csv; charset=utf-8; header=present",
};

function reportStream(
  db: Db,
  pool: pg.Pool,
  format: BulkFormat,
  origin: string,
  signal: AbortSignal,
): ReadableStream<Uint8Array> {
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
  return new ReadableStream<Uint8Array>(
    {
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
          for (const piece of batchText(format, rows, first)) controller.enqueue(encoder.encode(piece));
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
    },
    { highWaterMark: 1 },
  );
}

/** The whole file as a response; gzip-compressed here when the client accepts it. */
export function bulkResponse(
  db: Db,
  pool: pg.Pool,
  request: Request,
  format: BulkFormat,
  origin: string,
  day: string,
): Response {
  let body = reportStream(db, pool, format, origin, request.signal);
  const headers: Record<string, string> = {
    "Content-Type": CONTENT_TYPE[format],
    "Content-Disposition": `attachment; filename="bayproof-reports-${day}.${format}"`,
    "Cache-Control": "no-store",
  };
  if (/\bgzip\b/.test(request.headers.get("accept-encoding") ?? "")) {
    body = Readable.toWeb(
      Readable.fromWeb(body as never).pipe(createGzip({ level: 4 })),
    ) as unknown as ReadableStream<Uint8Array>;
    headers["Content-Encoding"] = "gzip";
    headers.Vary = "Accept-Encoding";
  }
  return new Response(body, { status: 200, headers });
}
