// The daily snapshot of the open data: written straight to the test store, then downloaded
// anonymously through the app — whole, by byte range, and revalidated by ETag.
import { createHash } from "node:crypto";
import { gunzipSync } from "node:zlib";
import { sql } from "kysely";
import { afterAll, beforeAll, describe, expect, inject, it } from "vitest";
import { writeSnapshot } from "../../app/feed/snapshot.server";
import type { SnapshotInfo } from "../../app/feed/documents";
import { REPORT_FIELDS } from "../../app/feed/fields";
import { storeAt } from "../../app/storage/s3.server";
import { createPool } from "../../db/database";
import { createDb } from "../../db/database";
import { feedClient } from "../support/feed";

const pool = createPool(inject("databaseUrl"), 3);
const db = createDb(pool);
const get = feedClient(); // anonymous: no key
let snapshot: SnapshotInfo;
let ndjson: Buffer;

beforeAll(async () => {
  const { endpoint, bucket } = inject("s3");
  snapshot = await writeSnapshot(db, pool, storeAt(endpoint, bucket), inject("baseUrl"));
  const res = await get(snapshot.files.find((f) => f.format === "ndjson")!.path);
  expect(res.status).toBe(200);
  ndjson = Buffer.from(await res.arrayBuffer());
}, 60_000);
afterAll(() => db.destroy());

const file = (format: "ndjson" | "csv") => snapshot.files.find((f) => f.format === format)!;

describe("the daily snapshot", () => {
  it("holds every report accepted as of its time, one NDJSON line each, and its published SHA-256 and size", async () => {
    const lines = gunzipSync(ndjson).toString("utf8").split("\n").filter(Boolean);
    const accepted = await db
      .selectFrom("reports")
      .select(sql<number>`count(*)::int`.as("n"))
      .where("status", "=", "accepted")
      .where("accepted_at", "<=", new Date(snapshot.createdAt))
      .executeTakeFirstOrThrow();
    expect(lines.length).toBe(accepted.n);
    expect(lines.length).toBe(snapshot.reportCount);
    expect(ndjson.length).toBe(file("ndjson").bytes);
    expect(createHash("sha256").update(ndjson).digest("hex")).toBe(file("ndjson").sha256);
    // The same line as the live feed's record of that report.
    const first = JSON.parse(lines[0]!);
    const record = await (await get(`/api/v1/reports/${first.id}`)).json();
    expect(first).toEqual(record);
  });

  it("has the CSV of the same reports, with the Data Package's columns", async () => {
    const res = await get(file("csv").path);
    expect(res.status).toBe(200);
    const body = Buffer.from(await res.arrayBuffer());
    expect(createHash("sha256").update(body).digest("hex")).toBe(file("csv").sha256);
    const text = gunzipSync(body).toString("utf8");
    expect(text.split("\r\n")[0]).toBe(REPORT_FIELDS.map((f) => f.name).join(","));
    const ids = new Set(
      gunzipSync(ndjson)
        .toString("utf8")
        .split("\n")
        .filter(Boolean)
        .map((l) => String(JSON.parse(l).id)),
    );
    const csvIds = new Set(
      text
        .split("\r\n")
        .slice(1)
        .filter(Boolean)
        .map((l) => l.split(",")[0]!)
        .filter((v) => /^\d+$/.test(v)),
    );
    for (const id of ids) expect(csvIds.has(id), id).toBe(true);
  });

  it("answers a byte range with 206, and a known ETag with 304", async () => {
    const path = file("ndjson").path;
    const whole = await get(path);
    const etag = whole.headers.get("etag")!;
    await whole.body?.cancel();
    expect(etag).toBe(`"${file("ndjson").sha256}"`);
    expect(whole.headers.get("accept-ranges")).toBe("bytes");
    expect(whole.headers.get("content-type")).toBe("application/gzip");

    const part = await get(path, { range: "bytes=0-99" });
    expect(part.status).toBe(206);
    expect(part.headers.get("content-range")).toBe(`bytes 0-99/${file("ndjson").bytes}`);
    const bytes = Buffer.from(await part.arrayBuffer());
    expect(bytes.length).toBe(100);
    expect(bytes.equals(ndjson.subarray(0, 100))).toBe(true);

    const tail = await get(path, { range: "bytes=-10" });
    expect(tail.status).toBe(206);
    expect(Buffer.from(await tail.arrayBuffer()).equals(ndjson.subarray(ndjson.length - 10))).toBe(true);

    const unchanged = await get(path, { "if-none-match": etag });
    expect(unchanged.status).toBe(304);
    expect(await unchanged.text()).toBe("");

    const outside = await get(path, { range: `bytes=${file("ndjson").bytes}-` });
    expect(outside.status).toBe(416);
    expect(outside.headers.get("content-range")).toBe(`bytes */${file("ndjson").bytes}`);
  });

  it("is listed in the Data Package with its URL, size, SHA-256 and time", async () => {
    const pkg = await (await get("/api/v1/datapackage.json")).json();
    const listed = pkg.resources.filter((r: { name: string }) => r.name.endsWith("-snapshot"));
    expect(listed.map((r: { format: string }) => r.format).sort()).toEqual(["csv", "ndjson"]);
    for (const r of listed) {
      // The newest snapshot, which may be the worker's own rather than this test's.
      const id = Number(r.path.match(/\/api\/v1\/snapshots\/(\d+)\//)[1]);
      const row = await db.selectFrom("feed_snapshots").selectAll().where("id", "=", id).executeTakeFirstOrThrow();
      expect(r.bytes).toBe(Number(row[`${r.format as "csv" | "ndjson"}_bytes`]));
      expect(r.hash).toBe(`sha256:${row[`${r.format as "csv" | "ndjson"}_sha256`]}`);
      expect(r.created).toBe(new Date(row.created_at).toISOString());
    }
  });

  it("is on /data with sizes and SHA-256, and the latest one downloads without a key", async () => {
    // Writing a snapshot notifies the page caches; the cached /data page is emptied once that
    // notification arrives (other files may write snapshots meanwhile), so wait for the page to
    // name the newest one.
    const deadline = Date.now() + 20_000;
    let html: string;
    let sha: string;
    do {
      html = await (await get("/data")).text();
      sha = (
        await db
          .selectFrom("feed_snapshots")
          .select(["ndjson_sha256"])
          .orderBy("created_at", "desc")
          .orderBy("id", "desc")
          .executeTakeFirstOrThrow()
      ).ndjson_sha256;
    } while (!html.includes(sha) && Date.now() < deadline && (await new Promise((r) => setTimeout(r, 50, true))));
    expect(html).toContain("Daily snapshot");
    expect(html).toContain(sha);
    const res = await get("/api/v1/snapshots/latest/reports.csv.gz");
    expect(res.status).toBe(200);
    await res.body?.cancel();
  });

  it("refuses malformed snapshot paths with a 404 that says why", async () => {
    for (const path of [
      "/api/v1/snapshots/abc/reports.ndjson.gz",
      "/api/v1/snapshots/latest/reports.zip",
      "/api/v1/snapshots/999999999/reports.csv.gz",
    ]) {
      const res = await get(path);
      expect(res.status, path).toBe(404);
      expect((await res.json()).error.message).toBeTruthy();
    }
  });

  it("is written by the worker at start when there was none", async () => {
    const deadline = Date.now() + 60_000;
    let done = 0;
    while (Date.now() < deadline) {
      done = (
        await sql<{
          n: number;
        }>`select count(*)::int as n from pgboss.job where name = 'feed-snapshot' and state = 'completed'`.execute(db)
      ).rows[0]!.n;
      if (done > 0) break;
      await new Promise((r) => setTimeout(r, 500));
    }
    expect(done).toBeGreaterThan(0);
  }, 70_000);

  it("the database refuses a snapshot row with a malformed SHA-256 or an empty file", async () => {
    const good = {
      report_count: 1,
      ndjson_key: `snapshots/test-${Date.now()}/reports.ndjson.gz`,
      ndjson_bytes: 10,
      ndjson_sha256: "a".repeat(64),
      csv_key: `snapshots/test-${Date.now()}/reports.csv.gz`,
      csv_bytes: 10,
      csv_sha256: "b".repeat(64),
    };
    const tryInsert = async (row: typeof good) => {
      try {
        await db.transaction().execute(async (trx) => {
          await trx.insertInto("feed_snapshots").values(row).execute();
          throw new Error("rollback");
        });
      } catch (error) {
        return (error as Error).message;
      }
      return null;
    };
    expect(await tryInsert(good)).toBe("rollback");
    expect(await tryInsert({ ...good, ndjson_sha256: "not-a-hash" })).toMatch(/feed_snapshots_ndjson_sha256_check/);
    expect(await tryInsert({ ...good, csv_bytes: 0 })).toMatch(/feed_snapshots_csv_bytes_check/);
    expect(await tryInsert({ ...good, report_count: -1 })).toMatch(/feed_snapshots_report_count_check/);
    expect(await tryInsert({ ...good, csv_key: "evidence/x.csv.gz" })).toMatch(/feed_snapshots_csv_key_check/);
  });
});
