// Evidence uploads: the browser PUTs straight to object storage through a presigned URL this
// module hands out, then asks for the upload to be checked. The server names every object, checks
// the real type from the bytes, hashes it, and deletes what it refuses.
//
// A presigned URL can write its upload key (uploads/…) again until it expires, so checked evidence
// never stays there: completion copies the upload to a key of its own (evidence/…) that no URL is
// ever signed for, checks and hashes that copy, records its key and removes the upload.
import { sql } from "kysely";
import type { Db } from "../../db/database";
import { randomToken } from "~/utils/tokens.server";
import type { EvidenceKind } from "~/domain";
import { EVIDENCE_TYPES, isEvidenceType, MAX_BYTES } from "~/storage/evidence-types";
import {
  copyObject,
  deleteObject,
  isStorageOutage,
  objectSize,
  presignPut,
  readHead,
  sha256OfObject,
} from "~/storage/s3.server";
import { sniffEvidenceType } from "~/storage/sniff.server";
import { EDITABLE } from "./status";
import { AppError } from "~/utils/errors";

export const MAX_EVIDENCE_PER_REPORT = 12;
export const STORAGE_UNREACHABLE =
  "File storage is not reachable right now. Your file is kept on your device and the draft is unchanged: try again in a few minutes.";
const NOT_EDITABLE = "Evidence can only be added while the report is a draft or returned";

export class EvidenceError extends AppError {
  constructor(
    message: string,
    readonly status: 400 | 404 | 409 | 413 | 415 | 422 | 503,
  ) {
    super(message, status);
  }
}

/** A storage call whose outage becomes a 503 the uploader can show, not a server error. */
const stored = <T>(work: Promise<T>) =>
  work.catch((error: unknown) => {
    throw isStorageOutage(error) ? new EvidenceError(STORAGE_UNREACHABLE, 503) : error;
  });

const mb = (bytes: number) => `${Math.round(bytes / 1024 / 1024)} MB`;

/**
 * One evidence row and a presigned PUT. The report row is locked for the count and the insert, so
 * simultaneous requests for one report queue and the per-report limit holds.
 */
export async function createUpload(db: Db, userId: number, reportId: number, claimed: { type: string; size: number }) {
  const row = await db.transaction().execute(async (trx) => {
    const report = await trx
      .selectFrom("reports")
      .select(["status"])
      .where("id", "=", reportId)
      .where("reporter_id", "=", userId)
      .forUpdate()
      .executeTakeFirst();
    if (!report) throw new EvidenceError("No such report among yours", 404);
    if (!EDITABLE.includes(report.status)) throw new EvidenceError(NOT_EDITABLE, 409);
    if (!isEvidenceType(claimed.type))
      throw new EvidenceError("Only video (mp4, mov, webm) and photos (jpeg, png, heic) are accepted", 415);
    const kind = EVIDENCE_TYPES[claimed.type].kind;
    if (claimed.size > MAX_BYTES[kind]) throw new EvidenceError(`A ${kind} may be at most ${mb(MAX_BYTES[kind])}`, 413);
    const count = await trx
      .selectFrom("evidence")
      .select(sql<number>`count(*)::int`.as("n"))
      .where("report_id", "=", reportId)
      .executeTakeFirstOrThrow();
    if (count.n >= MAX_EVIDENCE_PER_REPORT)
      throw new EvidenceError(`At most ${MAX_EVIDENCE_PER_REPORT} files per report`, 409);
    // Our own random name under the uploads prefix; the client's file name is never used.
    const key = `uploads/${reportId}/${randomToken(18)}`;
    return trx
      .insertInto("evidence")
      .values({ report_id: reportId, object_key: key, kind, status: "pending" })
      .returning(["id", "object_key"])
      .executeTakeFirstOrThrow();
  });
  // The URL is signed for this type and length: the browser sends Content-Length itself.
  return {
    evidenceId: row.id,
    key: row.object_key,
    url: await presignPut(row.object_key, claimed.type, claimed.size),
    headers: { "Content-Type": claimed.type },
  };
}

type Check =
  | { done: { id: number; kind: EvidenceKind; contentType: string; size: number; sha256: string }; upload: string }
  | { refused: EvidenceError };

/**
 * Checks an upload once. The request that locks the pending row does the work (copy, sniff, hash,
 * record) and answers 200; any other request for the same upload answers 409 straight away,
 * "being checked" while the lock is held and "already checked" after. The lock is the row's own,
 * so a request that dies mid-check leaves the upload pending for the next try.
 */
export async function completeUpload(db: Db, userId: number, evidenceId: number) {
  const owned = await db
    .selectFrom("evidence as e")
    .innerJoin("reports as r", "r.id", "e.report_id")
    .select("e.id")
    .where("e.id", "=", evidenceId)
    .where("r.reporter_id", "=", userId)
    .executeTakeFirst();
  if (!owned) throw new EvidenceError("No such upload among yours", 404);

  const check: Check = await db.transaction().execute(async (trx) => {
    const item = await trx
      .selectFrom("evidence")
      .select(["id", "report_id", "object_key", "status"])
      .where("id", "=", evidenceId)
      .forUpdate()
      .skipLocked()
      .executeTakeFirst();
    if (!item)
      throw new EvidenceError("This upload is being checked by another request; its result will show shortly", 409);
    if (item.status !== "pending") throw new EvidenceError("This upload was already checked", 409);
    const report = await trx
      .selectFrom("reports")
      .select("status")
      .where("id", "=", item.report_id)
      .executeTakeFirstOrThrow();
    if (!EDITABLE.includes(report.status)) throw new EvidenceError(NOT_EDITABLE, 409);

    const upload = item.object_key;
    if ((await stored(objectSize(upload))) == null)
      throw new EvidenceError("The file has not arrived in storage yet", 409);
    // A fresh key per attempt, so two completions of one upload never share an object.
    const final = `evidence/${item.report_id}/${item.id}-${randomToken(12)}`;
    await stored(copyObject(upload, final));
    const refuse = async (message: string, status: 409 | 413 | 422) => {
      await stored(Promise.all([deleteObject(final), deleteObject(upload)]));
      await trx.deleteFrom("evidence").where("id", "=", item.id).execute();
      return { refused: new EvidenceError(message, status) };
    };
    // Everything below reads the copy, which only this server writes: what is checked is what stays.
    const size = (await stored(objectSize(final))) ?? 0;
    const type = size > 0 ? await sniffEvidenceType(await stored(readHead(final))) : null;
    if (!type)
      return refuse("This file is not a video or photo we accept, whatever its name says; it was removed", 422);
    const kind = EVIDENCE_TYPES[type].kind;
    if (size > MAX_BYTES[kind]) return refuse(`A ${kind} may be at most ${mb(MAX_BYTES[kind])}; it was removed`, 413);
    const sha256 = await stored(sha256OfObject(final));

    const recorded = await trx
      .updateTable("evidence")
      .set({ status: "uploaded", object_key: final, content_type: type, kind, size_bytes: size, sha256 })
      .where("id", "=", item.id)
      .where("status", "=", "pending")
      .where(
        "report_id",
        "in",
        trx.selectFrom("reports").select("id").where("id", "=", item.report_id).where("status", "in", EDITABLE),
      )
      .executeTakeFirst();
    if (recorded.numUpdatedRows === 0n) {
      // Submitted while this request was reading.
      await stored(deleteObject(final));
      return { refused: new EvidenceError(NOT_EDITABLE, 409) };
    }
    return { done: { id: item.id, kind, contentType: type, size, sha256 }, upload };
  });
  // A refusal is thrown only after its row's deletion has committed.
  if ("refused" in check) throw check.refused;
  // Nothing reads the upload key again; if this delete fails the object is only clutter.
  await deleteObject(check.upload).catch(() => {});
  return check.done;
}

/**
 * Publishes one of the reporter's own files with the open data (or takes it back). Only the
 * reporter decides, at any time; the feed links a file only while it is published.
 */
export async function setEvidencePublic(db: Db, userId: number, evidenceId: number, isPublic: boolean) {
  const r = await db
    .updateTable("evidence")
    .set({ is_public: isPublic })
    .where("id", "=", evidenceId)
    .where("status", "in", ["uploaded", "verified"])
    .where("report_id", "in", db.selectFrom("reports").select("id").where("reporter_id", "=", userId))
    .executeTakeFirst();
  if (r.numUpdatedRows === 0n) throw new EvidenceError("No such checked file among yours", 404);
  return { id: evidenceId, isPublic };
}

/** A report's files as its editor lists them (pending uploads left out). */
export async function listReportEvidence(db: Db, reportId: number) {
  const rows = await db
    .selectFrom("evidence")
    .select(["id", "kind", "content_type", "size_bytes", "status", "is_public"])
    .where("report_id", "=", reportId)
    .where("status", "!=", "pending")
    .execute();
  return rows.map((e) => ({
    id: e.id,
    kind: e.kind,
    contentType: e.content_type,
    size: e.size_bytes == null ? null : Number(e.size_bytes),
    status: e.status,
    isPublic: e.is_public,
  }));
}

/** The reporter's checked files, by report, with whether each is published. */
export async function publishableFiles(db: Db, userId: number) {
  return db
    .selectFrom("evidence as e")
    .innerJoin("reports as r", "r.id", "e.report_id")
    .select(["e.id", "e.report_id", "e.kind", "e.is_public"])
    .where("r.reporter_id", "=", userId)
    .where("e.status", "in", ["uploaded", "verified"])
    .orderBy("e.report_id")
    .orderBy("e.id")
    .limit(2000)
    .execute();
}

/**
 * Removes objects that never became part of a submitted report: uploads left pending, and files of
 * drafts abandoned, older than `olderThanHours`. Run by the background worker.
 */
export async function removeOrphanedEvidence(db: Db, olderThanHours = 24) {
  const stale = await db
    .selectFrom("evidence as e")
    .innerJoin("reports as r", "r.id", "e.report_id")
    .select(["e.id", "e.object_key"])
    .where("e.created_at", "<", sql<Date>`now() - ${`${olderThanHours} hours`}::interval`)
    .where((eb) =>
      eb.or([
        eb("e.status", "=", "pending"),
        eb.and([eb("r.status", "in", ["draft", "withdrawn"]), eb("r.submitted_at", "is", null)]),
      ]),
    )
    .limit(500)
    .execute();
  for (const item of stale) {
    await deleteObject(item.object_key).catch(() => {});
    await db.deleteFrom("evidence").where("id", "=", item.id).execute();
  }
  return stale.length;
}
