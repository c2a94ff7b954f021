// Evidence: presigned uploads straight to the fake object store, the completion check on the
// bytes, checked files that no upload URL can change, the store's signature checks, shared-file
// flags, and the clean-up of orphaned objects.
import {
  DeleteObjectCommand,
  GetObjectCommand,
  HeadObjectCommand,
  PutObjectCommand,
  S3Client,
} from "@aws-sdk/client-s3";
import { getSignedUrl } from "@aws-sdk/s3-request-presigner";
import { createHash } from "node:crypto";
import { afterAll, beforeAll, describe, expect, inject, it } from "vitest";
import { testDb } from "../support/db";
import { fakeExecutable, tinyMp4, tinyPng } from "../support/files";
import { Browserish, signedInAs } from "../support/http";
import { validReport } from "../support/reports";
import { complete, newDraft, presign, publish, upload } from "../support/evidence";

const db = testDb();
const { endpoint, bucket } = inject("s3");
const s3 = new S3Client({
  endpoint,
  region: "us-east-1",
  forcePathStyle: true,
  credentials: { accessKeyId: "S3RVER", secretAccessKey: "S3RVER" },
});
let owner: Browserish;
let stranger: Browserish;
let draftId: number;

const exists = async (key: string) =>
  s3.send(new HeadObjectCommand({ Bucket: bucket, Key: key })).then(
    () => true,
    () => false,
  );
const storedSha256 = async (key: string) => {
  const res = await s3.send(new GetObjectCommand({ Bucket: bucket, Key: key }));
  return createHash("sha256")
    .update(await res.Body!.transformToByteArray())
    .digest("hex");
};
const row = (id: number) => db.selectFrom("evidence").selectAll().where("id", "=", id).executeTakeFirstOrThrow();
/** Files the draft through the real form; the report is then "submitted". */
async function submit(client: Browserish, reportId: number) {
  const res = await client.post(`/reports/${reportId}/edit`, { ...validReport(), reportId: String(reportId) });
  expect(res.status).toBe(302);
  expect(
    (await db.selectFrom("reports").select("status").where("id", "=", reportId).executeTakeFirstOrThrow()).status,
  ).toBe("submitted");
}

beforeAll(async () => {
  owner = await signedInAs(db, "reporter@demo.bayproof.test");
  stranger = await signedInAs(db, "torque-omar@demo.bayproof.test");
  draftId = await newDraft(owner);
});
afterAll(() => db.destroy());

describe("presigned upload URLs", () => {
  it("names the object itself, under the uploads prefix, for ten minutes and one type and length", async () => {
    const res = await presign(owner, draftId, { type: "video/mp4", size: 1000 });
    expect(res.status).toBe(200);
    const body = await res.json();
    expect(body.key).toMatch(new RegExp(`^uploads/${draftId}/[A-Za-z0-9_-]{24}$`));
    const url = new URL(body.url);
    expect(url.pathname).toBe(`/${bucket}/${body.key}`);
    expect(Number(url.searchParams.get("X-Amz-Expires"))).toBeLessThanOrEqual(600);
    expect(url.searchParams.get("X-Amz-SignedHeaders")!.split(";")).toEqual(
      expect.arrayContaining(["content-length", "content-type", "host"]),
    );
  });

  it("refuses another user's draft, forbidden types, oversized files and visitors", async () => {
    expect((await presign(stranger, draftId, { type: "video/mp4", size: 1000 })).status).toBe(404);
    const exe = await presign(owner, draftId, { type: "application/x-msdownload", size: 1000 });
    expect(exe.status).toBe(415);
    expect((await exe.json()).error).toMatch(/Only video/);
    const huge = await presign(owner, draftId, { type: "video/mp4", size: 2 * 1024 ** 3 });
    expect(huge.status).toBe(413);
    expect((await presign(owner, draftId, { type: "image/png", size: 30 * 1024 * 1024 })).status).toBe(413);
    expect((await presign(new Browserish(), draftId, { type: "video/mp4", size: 1000 })).status).toBe(401);
    expect((await presign(owner, draftId, { type: 5 })).status).toBe(400);
  });

  it("refuses uploads to a report that is already submitted", async () => {
    const submitted = await db
      .selectFrom("reports")
      .select("id")
      .where(
        "reporter_id",
        "=",
        (
          await db
            .selectFrom("users")
            .select("id")
            .where("email", "=", "torque-omar@demo.bayproof.test")
            .executeTakeFirstOrThrow()
        ).id,
      )
      .where("status", "=", "submitted")
      .executeTakeFirstOrThrow();
    const res = await presign(stranger, submitted.id, { type: "video/mp4", size: 1000 });
    expect(res.status).toBe(409);
    expect((await res.json()).error).toMatch(/only be added while the report is a draft or returned/);
  });

  it("refuses an upload URL for the reporter's own draft once it is submitted", async () => {
    const draft = await newDraft(owner);
    await upload(owner, draft, tinyPng(), "image/png");
    await submit(owner, draft);
    const res = await presign(owner, draft, { type: "image/png", size: 1000 });
    expect(res.status).toBe(409);
    expect((await res.json()).error).toMatch(/draft or returned/);
  });
});

describe("simultaneous requests", () => {
  it("hands out no more upload URLs than the per-report limit, however many arrive at once", async () => {
    const reportId = await newDraft(owner);
    const answers = await Promise.all(
      Array.from({ length: 20 }, () => presign(owner, reportId, { type: "image/png", size: 1000 })),
    );
    const statuses = answers.map((r) => r.status);
    expect(statuses.filter((s) => s === 200)).toHaveLength(12); // MAX_EVIDENCE_PER_REPORT
    expect(statuses.filter((s) => s === 409)).toHaveLength(8);
    const refused = answers.find((r) => r.status === 409)!;
    expect((await refused.json()).error).toMatch(/At most 12 files per report/);
    const rows = await db.selectFrom("evidence").select("id").where("report_id", "=", reportId).execute();
    expect(rows).toHaveLength(12);
  });

  it("checks an upload once: one completion does the work, the others get 409", async () => {
    const reportId = await newDraft(owner);
    const bytes = tinyPng();
    const signed = await (await presign(owner, reportId, { type: "image/png", size: bytes.length })).json();
    expect(
      (await fetch(signed.url, { method: "PUT", headers: signed.headers, body: new Uint8Array(bytes) })).status,
    ).toBe(200);
    const answers = await Promise.all(Array.from({ length: 5 }, () => complete(owner, signed.evidenceId)));
    expect(answers.map((r) => r.status).sort()).toEqual([200, 409, 409, 409, 409]);
    for (const loser of answers.filter((r) => r.status === 409)) {
      expect((await loser.json()).error).toMatch(/being checked by another request|already checked/);
    }
    const row = await db
      .selectFrom("evidence")
      .select(["status", "sha256"])
      .where("id", "=", signed.evidenceId)
      .executeTakeFirstOrThrow();
    expect(row.status).toBe("uploaded");
    expect(row.sha256).toBe(createHash("sha256").update(bytes).digest("hex"));
  });
});

describe("the completion check", () => {
  it("records a real video with its sniffed type, size and SHA-256", async () => {
    const bytes = tinyMp4();
    const { evidenceId, check } = await upload(owner, draftId, bytes, "video/mp4");
    expect(check.status).toBe(200);
    const row = await db.selectFrom("evidence").selectAll().where("id", "=", evidenceId).executeTakeFirstOrThrow();
    expect(row.status).toBe("uploaded");
    expect(row.content_type).toBe("video/mp4");
    expect(Number(row.size_bytes)).toBe(bytes.length);
    expect(row.sha256).toBe(createHash("sha256").update(bytes).digest("hex"));
  });

  it("refuses a renamed executable and deletes it from storage", async () => {
    const { key, evidenceId, check } = await upload(owner, draftId, fakeExecutable(), "video/mp4");
    expect(check.status).toBe(422);
    expect((await check.json()).error).toMatch(/not a video or photo/);
    expect(await exists(key)).toBe(false);
    expect(
      await db.selectFrom("evidence").select("id").where("id", "=", evidenceId).executeTakeFirst(),
    ).toBeUndefined();
  });

  it("takes the type from the bytes, not the claim", async () => {
    const { evidenceId, check } = await upload(owner, draftId, tinyPng(), "video/mp4");
    expect(check.status).toBe(200);
    const row = await db
      .selectFrom("evidence")
      .select(["kind", "content_type"])
      .where("id", "=", evidenceId)
      .executeTakeFirstOrThrow();
    expect(row).toEqual({ kind: "photo", content_type: "image/png" });
  });

  it("refuses to check an upload once its report was submitted", async () => {
    const draft = await newDraft(owner);
    await upload(owner, draft, tinyPng(), "image/png"); // so the report has evidence when filed
    const signed = await (await presign(owner, draft, { type: "image/png", size: tinyPng().length })).json();
    expect(
      (await fetch(signed.url, { method: "PUT", headers: signed.headers, body: new Uint8Array(tinyPng()) })).status,
    ).toBe(200);
    await submit(owner, draft);
    const res = await complete(owner, signed.evidenceId);
    expect(res.status).toBe(409);
    expect((await res.json()).error).toMatch(/draft or returned/);
    expect((await row(signed.evidenceId)).status).toBe("pending");
  });

  it("answers 409 when nothing arrived, and 404 for someone else's upload", async () => {
    const signed = await (await presign(owner, draftId, { type: "video/mp4", size: 100 })).json();
    expect((await complete(owner, signed.evidenceId)).status).toBe(409);
    expect((await complete(stranger, signed.evidenceId)).status).toBe(404);
  });
});

describe("a checked file cannot be changed afterwards", () => {
  it("keeps the checked copy when the upload URL is used again after completion", async () => {
    const png = tinyPng();
    const { key, url, evidenceId, check } = await upload(owner, draftId, png, "image/png");
    expect(check.status).toBe(200);
    const checked = await row(evidenceId);
    expect(checked.object_key).toMatch(new RegExp(`^evidence/${draftId}/${evidenceId}-`));
    expect(checked.sha256).toBe(createHash("sha256").update(png).digest("hex"));
    expect(await exists(key)).toBe(false);

    // Same length and type as signed, so the still-valid URL accepts it: it can only write the upload key.
    const html = Buffer.alloc(png.length, " ");
    html.write("<!doctype html><script>alert(1)</script>");
    expect(
      (await fetch(url, { method: "PUT", headers: { "Content-Type": "image/png" }, body: new Uint8Array(html) }))
        .status,
    ).toBe(200);
    const after = await row(evidenceId);
    expect(after.object_key).toBe(checked.object_key);
    expect(await storedSha256(after.object_key)).toBe(checked.sha256);
    expect((await complete(owner, evidenceId)).status).toBe(409);
  });

  it("is refused by the database when a checked row points into uploads/", async () => {
    const bad = db
      .insertInto("evidence")
      .values({
        report_id: draftId,
        object_key: `uploads/${draftId}/x`,
        kind: "photo",
        status: "uploaded",
        content_type: "image/png",
        size_bytes: 10,
        sha256: "a".repeat(64),
      })
      .execute();
    await expect(bad).rejects.toThrow(/evidence_checked_not_in_uploads/);
  });
});

describe("the object store checks signatures like the hosted one", () => {
  const objectUrl = (key: string) => `${endpoint}/${bucket}/${key}`;
  const code = async (res: Response) => /<Code>(\w+)<\/Code>/.exec(await res.text())?.[1];

  it("refuses anonymous GET, PUT and DELETE with 403 AccessDenied", async () => {
    const key = `tests/anonymous-${Date.now()}`;
    await s3.send(new PutObjectCommand({ Bucket: bucket, Key: key, Body: "kept" }));
    for (const init of [{ method: "GET" }, { method: "PUT", body: "changed" }, { method: "DELETE" }]) {
      const res = await fetch(objectUrl(key), init);
      expect(res.status, init.method).toBe(403);
      expect(await code(res)).toBe("AccessDenied");
    }
    expect(await storedSha256(key)).toBe(createHash("sha256").update("kept").digest("hex"));
    await s3.send(new DeleteObjectCommand({ Bucket: bucket, Key: key }));
  });

  it("refuses a tampered signature and a type other than the one signed", async () => {
    const signed = await (await presign(owner, draftId, { type: "image/png", size: tinyPng().length })).json();
    const tampered = new URL(signed.url);
    const sig = tampered.searchParams.get("X-Amz-Signature")!;
    tampered.searchParams.set("X-Amz-Signature", `${sig[0] === "0" ? "1" : "0"}${sig.slice(1)}`);
    const body = new Uint8Array(tinyPng());
    const res = await fetch(tampered, { method: "PUT", headers: signed.headers, body });
    expect(res.status).toBe(403);
    expect(await code(res)).toBe("SignatureDoesNotMatch");
    expect((await fetch(signed.url, { method: "PUT", headers: { "Content-Type": "text/html" }, body })).status).toBe(
      403,
    );
    expect(await exists(signed.key)).toBe(false);
  });

  it("refuses a presigned URL past its expiry", async () => {
    const key = `tests/expiry-${Date.now()}`;
    await s3.send(new PutObjectCommand({ Bucket: bucket, Key: key, Body: "x" }));
    const fresh = await getSignedUrl(s3, new GetObjectCommand({ Bucket: bucket, Key: key }), { expiresIn: 60 });
    expect((await fetch(fresh)).status).toBe(200);
    // Signed a minute ago for one second, rather than waiting for it to run out.
    const expired = await getSignedUrl(s3, new GetObjectCommand({ Bucket: bucket, Key: key }), {
      expiresIn: 1,
      signingDate: new Date(Date.now() - 60_000),
    });
    const res = await fetch(expired);
    expect(res.status).toBe(403);
    expect(await code(res)).toBe("AccessDenied");
    await s3.send(new DeleteObjectCommand({ Bucket: bucket, Key: key }));
  });

  it("still answers the browser's CORS preflight from the app's origin", async () => {
    const res = await fetch(objectUrl("uploads/1/x"), {
      method: "OPTIONS",
      headers: {
        Origin: owner.origin,
        "Access-Control-Request-Method": "PUT",
        "Access-Control-Request-Headers": "content-type",
      },
    });
    expect(res.status).toBe(200);
    expect(res.headers.get("access-control-allow-methods")).toMatch(/PUT/);
  });
});

describe("publishing a file with the open data", () => {
  it("is off by default and only the reporter can change it", async () => {
    const { evidenceId } = await upload(owner, draftId, tinyPng(), "image/png");
    const isPublic = async () =>
      (await db.selectFrom("evidence").select("is_public").where("id", "=", evidenceId).executeTakeFirstOrThrow())
        .is_public;
    expect(await isPublic()).toBe(false);
    expect((await publish(owner, evidenceId, { public: true })).status).toBe(200);
    expect(await isPublic()).toBe(true);
    expect((await publish(stranger, evidenceId, { public: false })).status).toBe(404);
    expect((await publish(new Browserish(), evidenceId, { public: false })).status).toBe(401);
    expect((await publish(owner, evidenceId, { public: "yes" })).status).toBe(400);
    expect(await isPublic()).toBe(true);
    expect((await publish(owner, evidenceId, { public: false })).status).toBe(200);
    expect(await isPublic()).toBe(false);

    // The same from "Your reports", as a plain form (for reports past the form).
    expect(
      (await owner.post("/me/reports", { intent: "publish-evidence", evidenceId: String(evidenceId), publish: "yes" }))
        .status,
    ).toBe(200);
    expect(await isPublic()).toBe(true);
    expect(
      (
        await stranger.post("/me/reports", {
          intent: "publish-evidence",
          evidenceId: String(evidenceId),
          publish: "no",
        })
      ).status,
    ).toBe(404);
    expect(
      (await owner.post("/me/reports", { intent: "publish-evidence", evidenceId: "x", publish: "no" })).status,
    ).toBe(400);
    expect(await isPublic()).toBe(true);
  });
});

describe("flags from shared files", () => {
  it("flags evidence that is byte-for-byte another report's", async () => {
    const other = await signedInAs(db, "bay3-lenka@demo.bayproof.test");
    const theirDraft = await newDraft(other);
    await upload(other, theirDraft, tinyMp4(), "video/mp4"); // same bytes as the owner's video above
    const res = await other.post(`/reports/${theirDraft}/edit`, { ...validReport(), reportId: String(theirDraft) });
    expect(res.status).toBe(302);
    const row = await db.selectFrom("reports").select("flags").where("id", "=", theirDraft).executeTakeFirstOrThrow();
    expect(row.flags).toContain("duplicate_evidence");
    expect(row.flags).not.toContain("no_evidence");
  });
});

describe("clean-up of orphaned objects", () => {
  it("removes day-old uploads never attached to a submitted report", async () => {
    process.env.S3_ENDPOINT = endpoint;
    process.env.S3_BUCKET = bucket;
    const { removeOrphanedEvidence } = await import("../../app/reports/evidence.server");
    const draft = await newDraft(owner);
    const { key, evidenceId } = await upload(owner, draft, tinyMp4(512), "video/mp4");
    await db
      .updateTable("evidence")
      .set({ created_at: new Date(Date.now() - 25 * 3600_000) })
      .where("id", "=", evidenceId)
      .execute();
    const removed = await removeOrphanedEvidence(db);
    expect(removed).toBeGreaterThanOrEqual(1);
    expect(await exists(key)).toBe(false);
    expect(
      await db.selectFrom("evidence").select("id").where("id", "=", evidenceId).executeTakeFirst(),
    ).toBeUndefined();
  });
});
