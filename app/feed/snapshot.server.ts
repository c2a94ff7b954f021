// The open data's daily snapshot: every accepted report as gzipped NDJSON and CSV, written by the
// worker (feed-snapshot queue) to object storage under snapshots/, with sizes and SHA-256 kept in
// feed_snapshots. Anyone may download them (api.v1.snapshots.ts); the live dump needs a key.
// Both files are read in one repeatable-read transaction, so they hold the same reports.
import { createHash } from "node:crypto";
import { createReadStream, createWriteStream } from "node:fs";
import { mkdtemp, rm } from "node:fs/promises";
import { tmpdir } from "node:os";
import path from "node:path";
import { Readable, Transform } from "node:stream";
import { pipeline } from "node:stream/promises";
import { createGzip } from "node:zlib";
import { DeleteObjectCommand, GetObjectCommand, PutObjectCommand } from "@aws-sdk/client-s3";
import type pg from "pg";
import Cursor from "pg-cursor";
import type { Db } from "../../db/database";
import { notifyPagesChanged } from "~/http-cache/notify.server";
import type { Store } from "~/storage/s3.server";
import type { SnapshotInfo } from "./documents";
import { BATCH, batchText, type BulkFormat, RAW_TEXT, type RawRow } from "./dump.server";
import { bulkQuery } from "./queries.server";

export const SNAPSHOT_FORMATS = ["ndjson", "csv"] as const satisfies readonly BulkFormat[];
/** Snapshots kept; older ones (rows and objects) are removed after a new one is written. */
const KEEP = 3;

interface Written {
  bytes: number;
  sha256: string;
  rows: number;
}

/** Streams one format through gzip to a file, hashing and counting the gzipped bytes. */
async function writeFile(
  client: pg.PoolClient,
  db: Db,
  format: BulkFormat,
  origin: string,
  file: string,
): Promise<Written> {
  const q = bulkQuery(db, origin, format);
  const cursor = client.query(new Cursor(q.sql, [...q.parameters], { rowMode: "array", types: RAW_TEXT }));
  let rows = 0;
  async function* text() {
    for (let first = true; ; first = false) {
      const batch = (await cursor.read(BATCH)) as RawRow[];
      rows += batch.length;
      yield* batchText(format, batch, first);
      if (batch.length < BATCH) return;
    }
  }
  const hash = createHash("sha256");
  let bytes = 0;
  const tap = new Transform({
    transform(chunk: Buffer, _enc, done) {
      hash.update(chunk);
      bytes += chunk.length;
      done(null, chunk);
    },
  });
  try {
    await pipeline(Readable.from(text()), createGzip({ level: 6 }), tap, createWriteStream(file));
  } finally {
    await cursor.close();
  }
  return { bytes, sha256: hash.digest("hex"), rows };
}

/** Writes a snapshot of the accepted reports now, stores both files, and records it. */
export async function writeSnapshot(db: Db, pool: pg.Pool, store: Store, origin: string) {
  const dir = await mkdtemp(path.join(tmpdir(), "bayproof-snapshot-"));
  const client = await pool.connect();
  try {
    await client.query("begin isolation level repeatable read read only");
    const {
      rows: [clock],
    } = await client.query<{ now: Date }>("select now()");
    const createdAt = clock!.now;
    const stamp = createdAt
      .toISOString()
      .replace(/[-:]/g, "")
      .replace(/\.\d+Z$/, "Z");
    const written = {} as Record<BulkFormat, Written & { key: string }>;
    for (const format of SNAPSHOT_FORMATS) {
      const file = path.join(dir, `reports.${format}.gz`);
      const w = await writeFile(client, db, format, origin, file);
      const key = `snapshots/${stamp}/reports.${format}.gz`;
      await store.client.send(
        new PutObjectCommand({
          Bucket: store.bucket,
          Key: key,
          Body: createReadStream(file),
          ContentLength: w.bytes,
          ContentType: "application/gzip",
          Metadata: { sha256: w.sha256 },
        }),
      );
      written[format] = { ...w, key };
    }
    await client.query("commit");
    const row = await db
      .insertInto("feed_snapshots")
      .values({
        created_at: createdAt,
        report_count: written.ndjson.rows,
        ndjson_key: written.ndjson.key,
        ndjson_bytes: written.ndjson.bytes,
        ndjson_sha256: written.ndjson.sha256,
        csv_key: written.csv.key,
        csv_bytes: written.csv.bytes,
        csv_sha256: written.csv.sha256,
      })
      .returningAll()
      .executeTakeFirstOrThrow();
    await pruneSnapshots(db, store);
    // Whoever writes a snapshot (the worker, a script, a test) empties the cached /data pages.
    await notifyPagesChanged(db, "snapshot");
    return snapshotInfo(row);
  } catch (error) {
    await client.query("rollback").catch(() => {});
    throw error;
  } finally {
    client.release();
    await rm(dir, { recursive: true, force: true });
  }
}

/** Keeps the newest KEEP snapshots (a day apart), so a download of an older one has time to finish. */
async function pruneSnapshots(db: Db, store: Store) {
  const old = await db
    .selectFrom("feed_snapshots")
    .select(["id", "ndjson_key", "csv_key"])
    .orderBy("created_at", "desc")
    .orderBy("id", "desc")
    .offset(KEEP)
    .limit(100)
    .execute();
  for (const s of old) {
    for (const key of [s.ndjson_key, s.csv_key])
      await store.client.send(new DeleteObjectCommand({ Bucket: store.bucket, Key: key }));
    await db.deleteFrom("feed_snapshots").where("id", "=", s.id).execute();
  }
}

type Row = Awaited<ReturnType<typeof findRow>>;
const findRow = (db: Db, id: number | "latest") =>
  db
    .selectFrom("feed_snapshots")
    .selectAll()
    .$if(id !== "latest", (q) => q.where("id", "=", id as number))
    .orderBy("created_at", "desc")
    .orderBy("id", "desc")
    .limit(1)
    .executeTakeFirst();

export const snapshotPath = (id: number, format: BulkFormat) => `/api/v1/snapshots/${id}/reports.${format}.gz`;

function snapshotInfo(row: NonNullable<Row>): SnapshotInfo {
  return {
    id: row.id,
    createdAt: new Date(row.created_at).toISOString(),
    reportCount: row.report_count,
    files: SNAPSHOT_FORMATS.map((format) => ({
      format,
      path: snapshotPath(row.id, format),
      key: row[`${format}_key`],
      bytes: Number(row[`${format}_bytes`]),
      sha256: row[`${format}_sha256`],
    })),
  };
}

/** The newest snapshot, or a given one; null when there is none. */
export async function findSnapshot(db: Db, id: number | "latest" = "latest"): Promise<SnapshotInfo | null> {
  const row = await findRow(db, id);
  return row ? snapshotInfo(row) : null;
}
export const latestSnapshot = (db: Db) => findSnapshot(db, "latest");

/** A stored file, whole or one byte range of it. */
export async function readSnapshotObject(store: Store, key: string, range?: { start: number; end: number }) {
  const res = await store.client.send(
    new GetObjectCommand({
      Bucket: store.bucket,
      Key: key,
      ...(range ? { Range: `bytes=${range.start}-${range.end}` } : {}),
    }),
  );
  return res.Body as Readable;
}
