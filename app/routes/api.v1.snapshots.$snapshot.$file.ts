import { Readable } from "node:stream";
import { readDb } from "~/db.server";
import { answer, feedError, readParams } from "~/feed/http.server";
import { matchesIfNoneMatch } from "~/utils/http";
import { findSnapshot, readSnapshotObject } from "~/feed/snapshot.server";
import { defaultStore } from "~/storage/s3.server";
import type { Route } from "./+types/api.v1.snapshots.$snapshot.$file";

// The daily snapshot's files, open to anyone: streamed from object storage with the file's
// SHA-256 as a strong ETag, one byte range at a time if asked (206), or a 304 when unchanged.
// `latest` moves daily; a numbered snapshot never changes, so it may be cached for good.
export async function loader({ request, params }: Route.LoaderArgs) {
  return answer(async () => {
    readParams(new URL(request.url), {});
    const which =
      params.snapshot === "latest" ? "latest" : /^[1-9]\d{0,9}$/.test(params.snapshot) ? Number(params.snapshot) : null;
    const format = ({ "reports.ndjson.gz": "ndjson", "reports.csv.gz": "csv" } as const)[
      params.file as "reports.ndjson.gz" | "reports.csv.gz"
    ];
    if (which === null || !format)
      throw feedError(
        404,
        "not_found",
        "No such file: use /api/v1/snapshots/latest/reports.ndjson.gz or reports.csv.gz.",
      );
    const snapshot = await findSnapshot(readDb, which);
    if (!snapshot) {
      throw feedError(
        404,
        "no_snapshot",
        which === "latest"
          ? "No snapshot has been written yet; one is written daily at 03:15 UTC."
          : "No such snapshot: it may have been replaced by newer ones (see /api/v1/datapackage.json).",
      );
    }
    const file = snapshot.files.find((f) => f.format === format)!;
    const etag = `"${file.sha256}"`;
    const headers: Record<string, string> = {
      ETag: etag,
      "Last-Modified": new Date(snapshot.createdAt).toUTCString(),
      "Cache-Control": which === "latest" ? "public, max-age=300" : "public, max-age=31536000, immutable",
      "Accept-Ranges": "bytes",
      "Content-Disposition": `attachment; filename="bayproof-reports-${snapshot.createdAt.slice(0, 10)}.${format}.gz"`,
    };
    if (matchesIfNoneMatch(request.headers.get("if-none-match"), etag))
      return new Response(null, { status: 304, headers });

    const range = wantedRange(request, etag, file.bytes);
    if (range === "unsatisfiable") {
      throw feedError(
        416,
        "range_not_satisfiable",
        `The file has ${file.bytes} bytes; ask for a range inside it.`,
        undefined,
        { "Content-Range": `bytes */${file.bytes}` },
      );
    }
    const length = range ? range.end - range.start + 1 : file.bytes;
    Object.assign(headers, { "Content-Type": "application/gzip", "Content-Length": String(length) });
    if (range) headers["Content-Range"] = `bytes ${range.start}-${range.end}/${file.bytes}`;
    const status = range ? 206 : 200;
    if (request.method === "HEAD") return new Response(null, { status, headers });
    const body = await readSnapshotObject(defaultStore, file.key, range ?? undefined);
    request.signal.addEventListener("abort", () => body.destroy(), { once: true });
    return new Response(Readable.toWeb(body) as ReadableStream<Uint8Array>, { status, headers });
  });
}

/**
 * The one byte range asked for (RFC 9110 §14): null for the whole file — no Range, one this
 * server does not read (several ranges, another unit), or an If-Range that names an older file.
 */
function wantedRange(
  request: Request,
  etag: string,
  size: number,
): { start: number; end: number } | null | "unsatisfiable" {
  const header = request.headers.get("range");
  if (!header) return null;
  const ifRange = request.headers.get("if-range");
  if (ifRange && ifRange.trim() !== etag) return null;
  const m = /^bytes=(\d*)-(\d*)$/.exec(header.trim());
  if (!m || (m[1] === "" && m[2] === "")) return null;
  if (m[1] === "") {
    const suffix = Number(m[2]);
    if (suffix === 0) return "unsatisfiable";
    return { start: Math.max(0, size - suffix), end: size - 1 };
  }
  const start = Number(m[1]);
  const end = m[2] === "" ? size - 1 : Math.min(Number(m[2]), size - 1);
  if (m[2] !== "" && Number(m[2]) < start) return null;
  if (start >= size) return "unsatisfiable";
  return { start, end };
}
